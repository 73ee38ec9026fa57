import { ConstantNode, OperatorNode, ParenthesisNode, SymbolNode, derivative, type MathNode } from 'mathjs';
import { BudgetError } from '../budget/budget-error';
import { analyseDimensions } from './dimensions';
import { parseModel, type ModelLine } from './parse-model';
import { resultUnitText } from './result-unit';
import { UnsupportedInCode, toJavaScript } from './codegen';
import { describeDimension, parseUnit, sameDimension, type Dimension, type QuantityUnit } from './units';

/** A quantity the model reads: an input (one column per input) or a constant. */
export interface ModelQuantity {
  symbol: string;
  unit?: string;
}
export interface ModelConstant extends ModelQuantity {
  value: number;
}
export interface ModelSpec {
  model: string;
  measurand: { symbol: string; unit?: string };
  inputs: readonly ModelQuantity[];
  constants: readonly ModelConstant[];
}

export type ScalarFunction = (x: ArrayLike<number>) => number;

/** A measurement model compiled once into JavaScript. All arguments are input values in their own units. */
export interface CompiledModel {
  inputSymbols: string[];
  lines: ModelLine[];
  /** Inputs the model reads. */
  usedSymbols: Set<string>;
  /** Unit of the measurand value the model returns. */
  measurandUnit?: string;
  /** Whether any quantity carries a unit (and dimensions were checked). */
  hasUnits: boolean;
  /** y = f(x) in the measurand's unit. */
  value: ScalarFunction;
  /** Every line's value: intermediates in coherent SI units (see `lineUnits`), the last one y. */
  lineValues(x: ArrayLike<number>): number[];
  lineUnits: string[];
  /** out[offset + t] = f(columns[·][t]) for t < n: the Monte Carlo kernel. */
  evaluateBlock(columns: readonly Float64Array[], out: Float64Array, offset: number, n: number): void;
  /** ∂f/∂x_i compiled from the symbolic derivative; null where mathjs could not differentiate. */
  partials: (ScalarFunction | null)[];
  /** For each partial, the input indices its code reads (sorted; [] for an unused input, null where there is no symbolic partial). */
  partialReads: (readonly number[] | null)[];
}

function unitOf(q: ModelQuantity, field: string): QuantityUnit {
  try {
    return parseUnit(q.unit);
  } catch (e) {
    throw new BudgetError('unit', `${field}: ${(e as Error).message}`, field);
  }
}

/** Replaces inputs by `x_i·k_i`, constants by their SI values and intermediates by their own trees. */
function inlineLines(lines: readonly ModelLine[], inputIndex: Map<string, number>, factors: number[], constantsSI: Map<string, number>): MathNode[] {
  const inlined = new Map<string, MathNode>();
  return lines.map((line) => {
    const tree = line.expression.transform((node, path) => {
      if (path === 'fn' || node.type !== 'SymbolNode') return node;
      const name = (node as SymbolNode).name;
      const i = inputIndex.get(name);
      if (i !== undefined) {
        return new ParenthesisNode(new OperatorNode('*', 'multiply', [new SymbolNode(`x${i}`), new ConstantNode(factors[i])]));
      }
      if (constantsSI.has(name)) return new ConstantNode(constantsSI.get(name) as number);
      const earlier = inlined.get(name);
      if (earlier) return new ParenthesisNode(earlier);
      return node;
    });
    inlined.set(line.symbol, tree);
    return tree;
  });
}

function symbolicPartial(tree: MathNode, i: number, scale: number): { partial: ScalarFunction; reads: number[] } | null {
  try {
    const d = derivative(tree, `x${i}`, { simplify: false });
    const reads = new Set<number>();
    const code = toJavaScript(d, (name) => {
      const m = /^x(\d+)$/.exec(name);
      if (!m) throw new UnsupportedInCode(name);
      reads.add(Number(m[1]));
      return `x[${m[1]}]`;
    });
    const partial = new Function('x', `"use strict"; return (${code}) * ${scale};`) as ScalarFunction;
    return { partial, reads: [...reads].sort((a, b) => a - b) };
  } catch {
    return null;
  }
}

/**
 * Parses, checks and compiles a measurement model (JCGM 100:2008 4.1.1,
 * Y = f(X₁, …, X_N), possibly through intermediate quantities). Every value
 * is converted to coherent SI units inside the model (x_SI = k_i·x_i) and the
 * result back to the measurand's unit, so mixed units (mg and g, mol/mL and
 * mol/L) are consistent and sensitivity coefficients come out in measurand
 * unit per input unit.
 */
export function compileModel(spec: ModelSpec): CompiledModel {
  const inputSymbols = spec.inputs.map((q) => q.symbol);
  const quantitySymbols = new Set([...inputSymbols, ...spec.constants.map((c) => c.symbol)]);
  const parsed = parseModel(spec.model, quantitySymbols, spec.measurand.symbol);
  const inputUnits = spec.inputs.map((q, i) => unitOf(q, `inputs[${i}].unit`));
  const constantUnits = spec.constants.map((c, i) => unitOf(c, `constants[${i}].unit`));
  const hasUnits =
    [...spec.inputs, ...spec.constants].some((q) => (q.unit ?? '').trim() !== '' && (q.unit ?? '').trim() !== '1') ||
    Boolean(spec.measurand.unit && spec.measurand.unit.trim() !== '' && spec.measurand.unit.trim() !== '1');

  const factors = hasUnits ? inputUnits.map((u) => u.factor) : inputUnits.map(() => 1);
  const constantsSI = new Map(spec.constants.map((c, i) => [c.symbol, hasUnits ? c.value * constantUnits[i].factor : c.value]));

  let measurandFactor = 1;
  let measurandUnit = spec.measurand.unit;
  let lineUnits = parsed.lines.map(() => '');
  if (hasUnits) {
    const dims = new Map<string, Dimension>();
    spec.inputs.forEach((q, i) => dims.set(q.symbol, inputUnits[i].dimension));
    spec.constants.forEach((c, i) => dims.set(c.symbol, constantUnits[i].dimension));
    const lineDims = analyseDimensions(parsed.lines, dims);
    lineUnits = parsed.lines.map((l) => describeDimension(lineDims.get(l.symbol) as Dimension));
    const yDim = lineDims.get(spec.measurand.symbol) as Dimension;
    if (spec.measurand.unit && spec.measurand.unit.trim() !== '') {
      const target = unitOf(spec.measurand, 'measurand.unit');
      if (!sameDimension(target.dimension, yDim)) {
        throw new BudgetError(
          'unit',
          `measurand.unit: the model yields ${describeDimension(yDim)}, which cannot be expressed in "${spec.measurand.unit}"`,
          'measurand.unit',
        );
      }
      measurandFactor = target.factor;
    } else {
      measurandUnit = resultUnitText(parsed.lines, spec.inputs, spec.constants) ?? describeDimension(yDim);
      try {
        measurandFactor = parseUnit(measurandUnit).factor;
      } catch {
        measurandUnit = describeDimension(yDim);
        measurandFactor = 1;
      }
    }
    lineUnits[lineUnits.length - 1] = measurandUnit ?? '';
  }

  const inputIndex = new Map(inputSymbols.map((s, i) => [s, i]));
  const lineIndex = new Map(parsed.lines.map((l, i) => [l.symbol, i]));
  const symbolCode = (name: string): string => {
    const i = inputIndex.get(name);
    if (i !== undefined) return `q${i}`;
    if (constantsSI.has(name)) {
      const v = constantsSI.get(name) as number;
      return v < 0 ? `(${v})` : String(v);
    }
    const l = lineIndex.get(name);
    if (l !== undefined) return `l${l}`;
    throw new UnsupportedInCode(name);
  };
  const used = inputSymbols.map((s, i) => ({ s, i })).filter(({ s }) => parsed.usedSymbols.has(s));
  const lineCode = parsed.lines.map((l, i) => `const l${i} = ${toJavaScript(l.expression, symbolCode)};`).join('\n');
  const last = `l${parsed.lines.length - 1}`;
  const invScale = 1 / measurandFactor;
  const readScalar = used.map(({ i }) => `const q${i} = x[${i}] * ${factors[i]};`).join('\n');

  const value = new Function('x', `"use strict";\n${readScalar}\n${lineCode}\nreturn ${last} * ${invScale};`) as ScalarFunction;
  const lineValuesFn = new Function(
    'x',
    `"use strict";\n${readScalar}\n${lineCode}\nreturn [${parsed.lines.map((_, i) => (i === parsed.lines.length - 1 ? `${last} * ${invScale}` : `l${i}`)).join(', ')}];`,
  ) as (x: ArrayLike<number>) => number[];
  const evaluateBlock = new Function(
    'columns',
    'out',
    'offset',
    'n',
    `"use strict";\n${used.map(({ i }) => `const c${i} = columns[${i}];`).join('\n')}
for (let t = 0; t < n; t++) {
${used.map(({ i }) => `const q${i} = c${i}[t] * ${factors[i]};`).join('\n')}
${lineCode}
out[offset + t] = ${last} * ${invScale};
}`,
  ) as CompiledModel['evaluateBlock'];

  const trees = inlineLines(parsed.lines, inputIndex, factors, constantsSI);
  const yTree = trees[trees.length - 1];
  const symbolic = inputSymbols.map((s, i) => (parsed.usedSymbols.has(s) ? symbolicPartial(yTree, i, invScale) : { partial: () => 0, reads: [] }));

  return {
    inputSymbols,
    lines: parsed.lines,
    usedSymbols: parsed.usedSymbols,
    measurandUnit,
    hasUnits,
    value,
    lineValues: lineValuesFn,
    lineUnits,
    evaluateBlock,
    partials: symbolic.map((p) => p?.partial ?? null),
    partialReads: symbolic.map((p) => p?.reads ?? null),
  };
}
