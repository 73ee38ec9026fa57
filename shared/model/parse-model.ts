import type { MathNode } from 'mathjs';
import { parse } from './math';
import { BudgetError } from '../budget/budget-error';
import { LIMITS } from '../budget/limits';
import { MINUS } from '../format/signs';
import { treeDepth } from './expression-size';
import { RESERVED_SYMBOLS, assertSafeExpression } from './sandbox';

/** One line of a measurement model: `symbol = expression`. */
export interface ModelLine {
  symbol: string;
  expression: MathNode;
  /** 1-based line number in the model text. */
  line: number;
  text: string;
}

export interface ParsedModel {
  /** Intermediate quantities in order, then the measurand as the last line. */
  lines: ModelLine[];
  /** Input and constant symbols the model actually uses. */
  usedSymbols: Set<string>;
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyNode = MathNode & Record<string, any>;

function syntaxError(lineNo: number, text: string, error: Error): BudgetError {
  // mathjs reports "(char N)" with a 1-based position within the line.
  const m = /\(char (\d+)\)/.exec(error.message);
  const column = m ? Number(m[1]) : undefined;
  const token = column ? text.slice(column - 1, column).trim() || undefined : undefined;
  const message = error.message.replace(/\s*\(char \d+\)/, '');
  const where = column ? `, column ${column}` : '';
  return new BudgetError('model_syntax', `model line ${lineNo}${where}: ${message}`, 'model', { line: lineNo, column, token });
}

/**
 * The operator signs of typeset mathematics as the parser reads them: the
 * minus sign − (U+2212), × and the dot operators · and ⋅ for products.
 * Each is one character for one, so columns stay those of the line as written.
 */
const TYPESET_OPERATORS: ReadonlyMap<string, string> = new Map([
  [MINUS, '-'],
  ['\u00d7', '*'],
  ['\u00b7', '*'],
  ['\u22c5', '*'],
]);

function withAsciiOperators(text: string): string {
  return [...text].map((c) => TYPESET_OPERATORS.get(c) ?? c).join('');
}

/**
 * Refuses a line whose parentheses or brackets nest deeper than
 * LIMITS.modelNesting, before parsing: every stage walks the tree
 * recursively, and such nesting is no measurement model.
 */
function assertNesting(text: string, lineNo: number): void {
  let depth = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '(' || c === '[') depth++;
    else if (c === ')' || c === ']') depth--;
    if (depth > LIMITS.modelNesting) {
      throw new BudgetError('limit', `model line ${lineNo}, column ${i + 1}: parentheses nested deeper than ${LIMITS.modelNesting}; split the expression into intermediate lines`, 'model', {
        line: lineNo,
        column: i + 1,
        token: c,
      });
    }
  }
}

function tooDeep(lineNo: number): BudgetError {
  return new BudgetError('limit', `model line ${lineNo}: the expression is nested deeper than ${LIMITS.modelTreeDepth} operations; split it into intermediate lines`, 'model', { line: lineNo });
}

/** Lines kept parsed: a budget of a few hundred lines, and the lines of the other budgets open at the time. */
const PARSED_LINES_KEPT = 4096;
const parsedLines = new Map<string, MathNode>();

/**
 * mathjs `parse` of one line, kept by its text: while a model is typed, every
 * keystroke re-reads the whole model, but only the edited line is new. The
 * trees are shared between compiled models and never changed (every later
 * stage builds new trees). A line that fails to parse is not kept.
 */
function parseLine(source: string): MathNode {
  const known = parsedLines.get(source);
  if (known) {
    // Most recently used last, so the oldest line is the one let go.
    parsedLines.delete(source);
    parsedLines.set(source, known);
    return known;
  }
  const node = parse(source);
  if (parsedLines.size >= PARSED_LINES_KEPT) parsedLines.delete(parsedLines.keys().next().value as string);
  parsedLines.set(source, node);
  return node;
}

function collectSymbols(node: MathNode, into: Set<string>): void {
  node.traverse((n, path) => {
    // a function's own name (path "fn") is not a quantity
    if (n.type === 'SymbolNode' && path !== 'fn') into.add((n as AnyNode).name);
  });
}

/**
 * Parses the model text: one `name = expression` per line, the last line the
 * measurand (it may also be a bare expression). `#` starts a comment.
 * `quantitySymbols` are the inputs and constants of the budget.
 */
export function parseModel(text: string, quantitySymbols: ReadonlySet<string>, measurandSymbol: string): ParsedModel {
  if (text.length > LIMITS.modelLength) {
    throw new BudgetError('limit', `model: longer than ${LIMITS.modelLength} characters`, 'model');
  }
  const defined = new Set<string>([...quantitySymbols, ...RESERVED_SYMBOLS]);
  const lines: ModelLine[] = [];
  const usedSymbols = new Set<string>();
  const rawLines = text.split(/\r?\n/);
  const contentLines = rawLines
    .map((raw, i) => {
      const source = withAsciiOperators(raw.replace(/#.*$/, ''));
      return { raw, source, lineNo: i + 1, code: source.trim() };
    })
    .filter((l) => l.code.length > 0);
  if (contentLines.length === 0) throw new BudgetError('model_syntax', 'model: the model has no expression', 'model');

  contentLines.forEach(({ raw, source, lineNo, code }, index) => {
    const isLast = index === contentLines.length - 1;
    assertNesting(source, lineNo);
    let node: AnyNode;
    try {
      // the untrimmed line, so mathjs's positions are columns of the line as written
      node = parseLine(source) as AnyNode;
    } catch (e) {
      if (e instanceof RangeError) throw tooDeep(lineNo);
      throw syntaxError(lineNo, raw, e as Error);
    }
    if (treeDepth(node) > LIMITS.modelTreeDepth) throw tooDeep(lineNo);
    let symbol: string;
    let expression: MathNode;
    const sandbox = { line: lineNo, text: source, isKnown: (name: string) => defined.has(name) };
    if (node.type === 'FunctionAssignmentNode' || node.type === 'BlockNode') assertSafeExpression(node, sandbox);
    if (node.type === 'AssignmentNode') {
      const target = node.object as AnyNode;
      if (target.type !== 'SymbolNode' || node.index) {
        const written = `${target.toString()}${node.index ? node.index.toString() : ''}`;
        throw new BudgetError('model_forbidden', `model line ${lineNo}: only a plain name can be assigned ("${written}")`, 'model', {
          line: lineNo,
          token: written,
        });
      }
      symbol = target.name;
      expression = node.value;
      if (isLast && symbol !== measurandSymbol) {
        throw new BudgetError('model_syntax', `model line ${lineNo}: the last line assigns "${symbol}", but the measurand is "${measurandSymbol}"`, 'model', { line: lineNo, token: symbol });
      }
    } else if (isLast) {
      symbol = measurandSymbol;
      expression = node;
    } else {
      throw new BudgetError('model_syntax', `model line ${lineNo}: an intermediate line must have the form "name = expression"`, 'model', {
        line: lineNo,
      });
    }
    if (defined.has(symbol)) {
      const why = (RESERVED_SYMBOLS as readonly string[]).includes(symbol)
        ? 'is reserved'
        : quantitySymbols.has(symbol)
          ? 'is already an input or a constant'
          : 'is already defined by an earlier line';
      throw new BudgetError('duplicate_symbol', `model line ${lineNo}: "${symbol}" ${why}`, 'model', { line: lineNo, token: symbol });
    }
    assertSafeExpression(expression, sandbox);
    collectSymbols(expression, usedSymbols);
    defined.add(symbol);
    lines.push({ symbol, expression, line: lineNo, text: code });
  });

  for (const s of [...usedSymbols]) if (!quantitySymbols.has(s)) usedSymbols.delete(s);
  return { lines, usedSymbols };
}
