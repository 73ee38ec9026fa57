import type { MathNode } from 'mathjs';
import { BudgetError } from '../budget/budget-error';
import type { ModelLine } from './parse-model';
import { SCALE_UNIT, combineScales, isScalePoint, type TemperatureScale } from './temperature-scale';
import { DIMENSIONLESS, describeDimension, isDimensionless, multiplyDimensions, powerDimension, sameDimension, type Dimension } from './units';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyNode = MathNode & Record<string, any>;

/** The dimension of a quantity and, for a temperature, the scale its value is read on (the temperature rule). */
export interface QuantityKind {
  dimension: Dimension;
  scale?: TemperatureScale;
}

interface Analysed extends QuantityKind {
  /** The numeric value when the expression contains no quantity (e.g. an exponent `1/3`). */
  constantValue?: number;
}

const DIMENSIONLESS_ARGUMENT: ReadonlySet<string> = new Set(['exp', 'log', 'log10', 'sin', 'cos', 'tan', 'asin', 'acos', 'atan']);
const MATH_CONSTANTS: ReadonlyMap<string, number> = new Map([
  ['pi', Math.PI],
  ['e', Math.E],
]);

function quantityUnitText(d: Dimension): string {
  return isDimensionless(d) ? 'no unit' : `unit ${describeDimension(d)}`;
}

/**
 * Dimensional analysis of the model lines (ISO 80000-1 quantity calculus):
 * terms of a sum, arguments of min/max/atan2, share one dimension; exp, log and
 * trigonometric functions take dimensionless arguments (angles count as
 * dimensionless); an exponent is a dimensionless number, constant unless the
 * base is dimensionless. Temperatures on different scales (°C, °F, K) never
 * meet in a sum, a difference, min or max (the temperature rule,
 * `temperature-scale.ts`). Returns the dimension and scale of every line.
 */
export function analyseDimensions(lines: readonly ModelLine[], quantities: ReadonlyMap<string, QuantityKind>): Map<string, QuantityKind> {
  const known = new Map<string, QuantityKind>(quantities);
  for (const line of lines) {
    const fail = (message: string, token: string): never => {
      throw new BudgetError('unit', `model line ${line.line}: ${message}`, 'model', { line: line.line, token });
    };
    /** Applies the temperature rule to terms that share a dimension. */
    const combine = (a: Analysed, b: Analysed, subtract: boolean, left: MathNode, right: MathNode, token: string): TemperatureScale | undefined => {
      const scale = combineScales(a.scale, b.scale, subtract);
      if (scale !== null) return scale;
      const [sa, sb] = [SCALE_UNIT[a.scale as keyof typeof SCALE_UNIT], SCALE_UNIT[b.scale as keyof typeof SCALE_UNIT]];
      return fail(
        `"${left.toString()}" is a temperature in ${sa} and "${right.toString()}" one in ${sb}: values in °C and °F are used without the offset to K, so temperatures on different scales cannot be combined (the temperature rule); give both in ${sa} or both in ${sb} (a correction of 5 mK to a value in °C is 0.005 degC; a thermodynamic temperature from t in °C is T0 + (t - t0) with T0 = 273.15 K and t0 = 0 degC)`,
        token,
      );
    };
    const walk = (node: MathNode): Analysed => {
      const n = node as AnyNode;
      switch (n.type) {
        case 'ConstantNode':
          return { dimension: DIMENSIONLESS, constantValue: n.value as number };
        case 'SymbolNode': {
          const quantity = known.get(n.name);
          if (quantity) return quantity;
          const constant = MATH_CONSTANTS.get(n.name);
          return { dimension: DIMENSIONLESS, constantValue: constant };
        }
        case 'ParenthesisNode':
          return walk(n.content);
        case 'OperatorNode': {
          const args = (n.args as MathNode[]).map(walk);
          const constant = args.every((a) => a.constantValue !== undefined);
          const cv = (f: (...v: number[]) => number) => (constant ? f(...args.map((a) => a.constantValue as number)) : undefined);
          switch (n.fn) {
            case 'unaryMinus':
              return { dimension: args[0].dimension, scale: args[0].scale, constantValue: cv((a) => -a) };
            case 'unaryPlus':
              return args[0];
            case 'add':
            case 'subtract': {
              const subtract = n.fn === 'subtract';
              if (!sameDimension(args[0].dimension, args[1].dimension)) {
                fail(
                  `cannot ${subtract ? 'subtract' : 'add'} "${n.args[0].toString()}" (${quantityUnitText(args[0].dimension)}) and "${n.args[1].toString()}" (${quantityUnitText(args[1].dimension)}): their units differ`,
                  n.op,
                );
              }
              const scale = combine(args[0], args[1], subtract, n.args[0], n.args[1], n.op);
              return { dimension: args[0].dimension, scale, constantValue: cv(subtract ? (a, b) => a - b : (a, b) => a + b) };
            }
            case 'multiply':
            case 'divide': {
              const sign = n.fn === 'multiply' ? 1 : -1;
              const dimension = multiplyDimensions(args[0].dimension, args[1].dimension, sign);
              // a temperature scaled by a number stays on its scale; any other product is no temperature value
              const scale = isDimensionless(args[1].dimension) ? args[0].scale : sign > 0 && isDimensionless(args[0].dimension) ? args[1].scale : undefined;
              return { dimension, scale, constantValue: cv(sign > 0 ? (a, b) => a * b : (a, b) => a / b) };
            }
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
          if (name === 'abs') return { dimension: args[0].dimension, scale: args[0].scale };
          // atan2, min, max: all arguments alike
          let scale = args[0].scale;
          for (let i = 1; i < args.length; i++) {
            if (!sameDimension(args[0].dimension, args[i].dimension)) {
              fail(
                `the arguments of "${name}" must share one unit: "${n.args[0].toString()}" has ${quantityUnitText(args[0].dimension)}, "${n.args[i].toString()}" has ${quantityUnitText(args[i].dimension)}`,
                name,
              );
            }
            scale = combine({ ...args[0], scale }, args[i], false, n.args[0], n.args[i], name);
          }
          return name === 'atan2' ? { dimension: DIMENSIONLESS } : { dimension: args[0].dimension, scale };
        }
      }
      return { dimension: DIMENSIONLESS };
    };
    const { dimension, scale } = walk(line.expression);
    known.set(line.symbol, isScalePoint(scale) || scale === 'difference' ? { dimension, scale } : { dimension });
  }
  const result = new Map<string, QuantityKind>();
  for (const line of lines) result.set(line.symbol, known.get(line.symbol) as QuantityKind);
  return result;
}
