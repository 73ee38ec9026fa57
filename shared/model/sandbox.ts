import type { MathNode } from 'mathjs';
import { BudgetError } from '../budget/budget-error';

/**
 * The whitelist of a measurement model: arithmetic, powers, parentheses,
 * numbers, known symbols and a short list of elementary functions. Anything
 * else (function definitions, property access, matrices, strings, ranges,
 * conditionals, mathjs's own functions such as evaluate or parse) is refused,
 * because a model is data that travels between users and must never execute
 * anything but arithmetic.
 */
const MODEL_OPERATORS: ReadonlyMap<string, string> = new Map([
  ['add', '+'],
  ['subtract', '-'],
  ['multiply', '*'],
  ['divide', '/'],
  ['unaryMinus', '-'],
  ['unaryPlus', '+'],
  ['pow', '^'],
]);

/** Allowed functions with their accepted argument counts ([min, max]). */
export const MODEL_FUNCTIONS: ReadonlyMap<string, readonly [number, number]> = new Map<string, readonly [number, number]>([
  ['sqrt', [1, 1]],
  ['exp', [1, 1]],
  ['log', [1, 1]],
  ['log10', [1, 1]],
  ['sin', [1, 1]],
  ['cos', [1, 1]],
  ['tan', [1, 1]],
  ['asin', [1, 1]],
  ['acos', [1, 1]],
  ['atan', [1, 1]],
  ['atan2', [2, 2]],
  ['abs', [1, 1]],
  ['min', [2, 64]],
  ['max', [2, 64]],
]);

/** Symbols every model knows; they cannot be used as quantity names. */
export const RESERVED_SYMBOLS = ['pi', 'e'] as const;

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyNode = MathNode & Record<string, any>;

const NODE_DESCRIPTIONS: ReadonlyMap<string, string> = new Map([
  ['AccessorNode', 'property or index access'],
  ['ArrayNode', 'a matrix or list'],
  ['BlockNode', 'several statements on one line'],
  ['ConditionalNode', 'a conditional expression'],
  ['FunctionAssignmentNode', 'a function definition'],
  ['IndexNode', 'an index'],
  ['ObjectNode', 'an object'],
  ['RangeNode', 'a range'],
  ['RelationalNode', 'a comparison'],
  ['AssignmentNode', 'an assignment inside an expression'],
]);

export interface SandboxContext {
  line: number;
  /** The line as written, to find the column of an implicit multiplication. */
  text?: string;
  /** Returns true when the symbol is defined at this point of the model. */
  isKnown(name: string): boolean;
}

function refuse(ctx: SandboxContext, code: 'model_forbidden' | 'unknown_symbol', message: string, token: string): never {
  throw new BudgetError(code, `model line ${ctx.line}: ${message}`, 'model', { line: ctx.line, token });
}

/**
 * The column (1-based) where the operator is missing: just after the first
 * place in the line where the left operand's last token is followed, through
 * nothing but spaces or parentheses, by the right operand's first token.
 */
function implicitColumn(text: string, left: string, right: string): number | undefined {
  const escape = (t: string) => t.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const m = new RegExp(`(?<![\\w.])${escape(left)}[\\s()]*(?=${escape(right)}(?![\\w.]))`).exec(text);
  return m ? m.index + left.length + 1 : undefined;
}

/**
 * Two operands side by side (`x1 x2`, `2 V`, `2(a + b)`, `x1 (x2 + 1)`) are a multiplication
 * to mathjs, but in a model they are far more often a missing operator or a
 * unit written where a quantity belongs: refused, with the place.
 */
function refuseImplicitMultiplication(ctx: SandboxContext, l: string, r: string): never {
  const column = ctx.text === undefined ? undefined : implicitColumn(ctx.text, lastToken(l), firstToken(r));
  const where = column === undefined ? '' : `, column ${column}`;
  throw new BudgetError(
    'model_syntax',
    `model line ${ctx.line}${where}: an operator is missing between "${l}" and "${r}"; write "${l} * ${r}" for a product (units belong in the unit field, not in the model)`,
    'model',
    { line: ctx.line, column, token: `${l} ${r}` },
  );
}

const firstToken = (t: string) => /^[\s(]*([\w.]+|.)/.exec(t)?.[1] ?? t;
const lastToken = (t: string) => /([\w.]+|.)[\s)]*$/.exec(t)?.[1] ?? t;

/**
 * Checks an expression tree against the whitelist; throws a BudgetError naming
 * the first offending token.
 */
export function assertSafeExpression(node: MathNode, ctx: SandboxContext): void {
  const n = node as AnyNode;
  switch (n.type) {
    case 'ConstantNode':
      if (typeof n.value !== 'number' || !Number.isFinite(n.value)) {
        refuse(ctx, 'model_forbidden', `the value ${JSON.stringify(n.value)} is not allowed: only finite numbers`, String(n.value));
      }
      return;
    case 'SymbolNode':
      if (!ctx.isKnown(n.name)) {
        refuse(ctx, 'unknown_symbol', `unknown symbol "${n.name}": it is not an input, a constant or an earlier line`, n.name);
      }
      return;
    case 'ParenthesisNode':
      assertSafeExpression(n.content, ctx);
      return;
    case 'OperatorNode': {
      if (!MODEL_OPERATORS.has(n.fn)) refuse(ctx, 'model_forbidden', `the operator "${n.op}" is not allowed`, n.op);
      for (const a of n.args) assertSafeExpression(a, ctx);
      if (n.implicit) refuseImplicitMultiplication(ctx, n.args[0].toString(), n.args[1].toString());
      return;
    }
    case 'FunctionNode': {
      const fnNode = n.fn as AnyNode;
      if (fnNode.type !== 'SymbolNode') refuse(ctx, 'model_forbidden', `calling "${fnNode.toString()}" is not allowed`, fnNode.toString());
      const name = fnNode.name as string;
      const arity = MODEL_FUNCTIONS.get(name);
      // a quantity followed by parentheses, `x1 (x2 + 1)`, is read as a call of x1
      if (!arity && ctx.isKnown(name)) refuseImplicitMultiplication(ctx, name, `(${(n.args as MathNode[]).map((a) => a.toString()).join(', ')})`);
      if (!arity) {
        return refuse(ctx, 'model_forbidden', `the function "${name}" is not allowed; allowed are ${[...MODEL_FUNCTIONS.keys()].join(', ')}`, name);
      }
      if (n.args.length < arity[0] || n.args.length > arity[1]) {
        const expected = arity[0] === arity[1] ? `${arity[0]}` : `at least ${arity[0]}`;
        refuse(ctx, 'model_forbidden', `"${name}" takes ${expected} argument${arity[0] === 1 && arity[1] === 1 ? '' : 's'}, not ${n.args.length}`, name);
      }
      for (const a of n.args) assertSafeExpression(a, ctx);
      return;
    }
    default: {
      const what = NODE_DESCRIPTIONS.get(n.type) ?? n.type;
      refuse(ctx, 'model_forbidden', `${what} is not allowed ("${n.toString()}")`, n.toString());
    }
  }
}
