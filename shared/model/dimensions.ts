import type { MathNode } from 'mathjs';
import { BudgetError } from '../budget/budget-error';
import type { ModelLine } from './parse-model';
import {
  DIMENSIONLESS,
  describeDimension,
  isDimensionless,
  multiplyDimensions,
  powerDimension,
  sameDimension,
  type Dimension,
} from './units';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyNode = MathNode & Record<string, any>;

interface Analysed {
  dimension: Dimension;
  /** The numeric value when the expression contains no quantity (e.g. an exponent `1/3`). */
  constantValue?: number;
}

const DIMENSIONLESS_ARGUMENT = new Set(['exp', 'log', 'log10', 'sin', 'cos', 'tan', 'asin', 'acos', 'atan']);
const MATH_CONSTANTS: Record<string, number> = { pi: Math.PI, e: Math.E };

function quantityUnitText(d: Dimension): string {
  return isDimensionless(d) ? 'no unit' : `unit ${describeDimension(d)}`;
}

/**
 * Dimensional analysis of the model lines (ISO 80000-1 quantity calculus):
 * terms of a sum, arguments of min/max/atan2, share one dimension; exp, log and
 * trigonometric functions take dimensionless arguments (angles count as
 * dimensionless); an exponent is a dimensionless number, constant unless the
 * base is dimensionless. Returns the dimension of every line.
 */
export function analyseDimensions(lines: readonly ModelLine[], quantities: ReadonlyMap<string, Dimension>): Map<string, Dimension> {
  const known = new Map(quantities);
  for (const line of lines) {
    const fail = (message: string, token: string): never => {
      throw new BudgetError('unit', `model line ${line.line}: ${message}`, 'model', { line: line.line, token });
    };
    const walk = (node: MathNode): Analysed => {
      const n = node as AnyNode;
      switch (n.type) {
        case 'ConstantNode':
          return { dimension: DIMENSIONLESS, constantValue: n.value as number };
        case 'SymbolNode':
          if (n.name in MATH_CONSTANTS) return { dimension: DIMENSIONLESS, constantValue: MATH_CONSTANTS[n.name] };
          return { dimension: known.get(n.name) ?? DIMENSIONLESS };
        case 'ParenthesisNode':
          return walk(n.content);
        case 'OperatorNode': {
          const args = (n.args as MathNode[]).map(walk);
          const constant = args.every((a) => a.constantValue !== undefined);
          const cv = (f: (...v: number[]) => number) => (constant ? f(...args.map((a) => a.constantValue as number)) : undefined);
          switch (n.fn) {
            case 'unaryMinus':
              return { dimension: args[0].dimension, constantValue: cv((a) => -a) };
            case 'unaryPlus':
              return args[0];
            case 'add':
            case 'subtract':
              if (!sameDimension(args[0].dimension, args[1].dimension)) {
                const verb = n.fn === 'add' ? 'add' : 'subtract';
                fail(
                  `cannot ${verb} "${n.args[0].toString()}" (${quantityUnitText(args[0].dimension)}) and "${n.args[1].toString()}" (${quantityUnitText(args[1].dimension)}): their units differ`,
                  n.op,
                );
              }
              return { dimension: args[0].dimension, constantValue: cv(n.fn === 'add' ? (a, b) => a + b : (a, b) => a - b) };
            case 'multiply':
              return { dimension: multiplyDimensions(args[0].dimension, args[1].dimension), constantValue: cv((a, b) => a * b) };
            case 'divide':
              return { dimension: multiplyDimensions(args[0].dimension, args[1].dimension, -1), constantValue: cv((a, b) => a / b) };
            case 'pow': {
              const [base, exponent] = args;
              if (!isDimensionless(exponent.dimension)) {
                fail(`the exponent "${n.args[1].toString()}" must be dimensionless, but has ${quantityUnitText(exponent.dimension)}`, '^');
              }
              if (isDimensionless(base.dimension)) return { dimension: DIMENSIONLESS, constantValue: cv((a, b) => a ** b) };
              if (exponent.constantValue === undefined) {
                fail(`"${n.args[0].toString()}" has ${quantityUnitText(base.dimension)}, so its exponent must be a fixed number`, '^');
              }
              return { dimension: powerDimension(base.dimension, exponent.constantValue as number) };
            }
          }
          return { dimension: DIMENSIONLESS };
        }
        case 'FunctionNode': {
          const name = (n.fn as AnyNode).name as string;
          const args = (n.args as MathNode[]).map(walk);
          if (DIMENSIONLESS_ARGUMENT.has(name)) {
            if (!isDimensionless(args[0].dimension)) {
              fail(`"${name}" needs a dimensionless argument, but "${n.args[0].toString()}" has ${quantityUnitText(args[0].dimension)}`, name);
            }
            return { dimension: DIMENSIONLESS };
          }
          if (name === 'sqrt') return { dimension: powerDimension(args[0].dimension, 0.5) };
          if (name === 'abs') return { dimension: args[0].dimension };
          // atan2, min, max: all arguments alike
          for (let i = 1; i < args.length; i++) {
            if (!sameDimension(args[0].dimension, args[i].dimension)) {
              fail(
                `the arguments of "${name}" must share one unit: "${n.args[0].toString()}" has ${quantityUnitText(args[0].dimension)}, "${n.args[i].toString()}" has ${quantityUnitText(args[i].dimension)}`,
                name,
              );
            }
          }
          return { dimension: name === 'atan2' ? DIMENSIONLESS : args[0].dimension };
        }
      }
      return { dimension: DIMENSIONLESS };
    };
    known.set(line.symbol, walk(line.expression).dimension);
  }
  const result = new Map<string, Dimension>();
  for (const line of lines) result.set(line.symbol, known.get(line.symbol) as Dimension);
  return result;
}
