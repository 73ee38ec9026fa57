import { BudgetError } from '../budget/budget-error';
import { analyseDimensions, type QuantityKind } from './dimensions';
import { parseModel, type ModelLine } from './parse-model';
import { resultUnitText } from './result-unit';
import { UnsupportedInCode, toJavaScript } from './codegen';
import { symbolicPartials, type ScalarFunction, type SymbolicFallback } from './symbolic-partials';
import { fitsScale } from './temperature-scale';
import { describeDimension, parseUnit, sameDimension, type QuantityUnit } from './units';

export type { ScalarFunction } from './symbolic-partials';

/** A quantity the model reads: an input (one column per input) or a constant. */
interface ModelQuantity {
  symbol: string;
  unit?: string;
}
interface ModelConstant extends ModelQuantity {
  value: number;
}
export interface ModelSpec {
  model: string;
  measurand: { symbol: string; unit?: string };
  inputs: readonly ModelQuantity[];
  constants: readonly ModelConstant[];
}

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
  /** Every line's value in its unit of `lineUnits`: intermediates in coherent SI units (°C or °F for a temperature on that scale), the last one y. */
  lineValues(x: ArrayLike<number>): number[];
  lineUnits: string[];
  /**
   * out[offset + t] = f(columns[·][t]) for t < n: the Monte Carlo kernel. With
   * `sums` (see BlockSums in montecarlo/summary) it also writes the block's
   * Σ(y − K), Σ(y − K)², min and max for the shift K = sums[0] in the same
   * loop, and returns true.
   */
  evaluateBlock(columns: readonly Float64Array[], out: Float64Array, offset: number, n: number, sums?: Float64Array): boolean;
  /** ∂f/∂x_i compiled from the symbolic derivative; null where mathjs could not differentiate or the bounds of `symbolic-partials.ts` leave it to differences. */
  partials: (ScalarFunction | null)[];
  /** For each partial, the input indices its code reads (sorted; [] for an unused input, null where there is no symbolic partial). */
  partialReads: (readonly number[] | null)[];
  /** How the partials were formed: the inlined size of the model, why they fell back to differences, inputs whose derivative was too large. */
  symbolicDerivatives: { inlinedNodes: number; fallback: SymbolicFallback; oversized: number[] };
}

function unitOf(q: ModelQuantity, field: string): QuantityUnit {
  try {
    return parseUnit(q.unit);
  } catch (e) {
    throw new BudgetError('unit', `${field}: ${(e as Error).message}`, field);
  }
}

/** The unit a line's value is stated in: °C or °F for a temperature on that scale (its own value), else coherent SI units. */
function lineUnitText(kind: QuantityKind): string {
  if (kind.scale === 'celsius') return 'degC';
  if (kind.scale === 'fahrenheit') return 'degF';
  return describeDimension(kind.dimension);
}

/** The SI factor of `lineUnitText(kind)`: 5/9 for °F, 1 for °C and coherent SI units. */
function lineUnitFactor(kind: QuantityKind): number {
  return kind.scale === 'fahrenheit' ? 5 / 9 : 1;
}

/** Whether `text` is a unit of the dimension and scale of `kind`, so a value labelled with it is what the label says. */
function labels(text: string, kind: QuantityKind): boolean {
  try {
    const u = parseUnit(text);
    return sameDimension(u.dimension, kind.dimension) && fitsScale(kind.scale, u.temperatureScale);
  } catch {
    return false;
  }
}

/**
 * Parses, checks and compiles a measurement model (JCGM 100:2008 4.1.1,
 * Y = f(X₁, …, X_N), possibly through intermediate quantities). Every value
 * is converted to coherent SI units inside the model (x_SI = k_i·x_i) and the
 * result back to the measurand's unit, so mixed units (mg and g, mol/mL and
 * mol/L) are consistent and sensitivity coefficients come out in measurand
 * unit per input unit. The code computes each line once, in order, so its
 * size grows with the model text, never with the depth of intermediates.
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
  let lineFactors = parsed.lines.map(() => 1);
  if (hasUnits) {
    const kinds = new Map<string, QuantityKind>();
    const kindOf = (u: QuantityUnit): QuantityKind => ({ dimension: u.dimension, scale: u.temperatureScale });
    spec.inputs.forEach((q, i) => kinds.set(q.symbol, kindOf(inputUnits[i])));
    spec.constants.forEach((c, i) => kinds.set(c.symbol, kindOf(constantUnits[i])));
    const analysed = analyseDimensions(parsed.lines, kinds);
    const lineKinds = parsed.lines.map((l) => analysed.get(l.symbol) as QuantityKind);
    lineUnits = lineKinds.map(lineUnitText);
    lineFactors = lineKinds.map(lineUnitFactor);
    const y = lineKinds[lineKinds.length - 1];
    if (spec.measurand.unit && spec.measurand.unit.trim() !== '') {
      const target = unitOf(spec.measurand, 'measurand.unit');
      if (!sameDimension(target.dimension, y.dimension)) {
        throw new BudgetError('unit', `measurand.unit: the model yields ${describeDimension(y.dimension)}, which cannot be expressed in "${spec.measurand.unit}"`, 'measurand.unit');
      }
      if (!fitsScale(y.scale, target.temperatureScale)) {
        throw new BudgetError(
          'unit',
          `measurand.unit: the model yields a temperature on the ${y.scale} scale, which "${spec.measurand.unit}" would show without the offset between the scales (the temperature rule); write the measurand unit as ${lineUnitText(y)}`,
          'measurand.unit',
        );
      }
      measurandFactor = target.factor;
    } else {
      // the label must state the value: a unit text mathjs cannot tell, or of another dimension, gives way to SI base units
      const yielded = resultUnitText(parsed.lines, spec.inputs, spec.constants);
      if (yielded !== undefined && labels(yielded, y)) {
        measurandUnit = yielded;
        measurandFactor = parseUnit(yielded).factor;
      } else {
        measurandUnit = lineUnitText(y);
        measurandFactor = lineUnitFactor(y);
      }
    }
    lineUnits[lineUnits.length - 1] = measurandUnit ?? '';
    lineFactors[lineFactors.length - 1] = measurandFactor;
  }

  const inputIndex = new Map(inputSymbols.map((s, i) => [s, i]));
  const lineIndex = new Map(parsed.lines.map((l, i) => [l.symbol, i]));
  const symbolCode = (name: string): string => {
    const i = inputIndex.get(name);
    if (i !== undefined) return `q${i}`;
    const v = constantsSI.get(name);
    if (v !== undefined) return v < 0 ? `(${v})` : String(v);
    const l = lineIndex.get(name);
    if (l !== undefined) return `l${l}`;
    throw new UnsupportedInCode(name);
  };
  const used = inputSymbols.map((s, i) => ({ s, i })).filter(({ s }) => parsed.usedSymbols.has(s));
  const lineCode = parsed.lines.map((l, i) => `const l${i} = ${toJavaScript(l.expression, symbolCode)};`).join('\n');
  const last = `l${parsed.lines.length - 1}`;
  const invScale = 1 / measurandFactor;
  const readScalar = used.map(({ i }) => `const q${i} = x[${i}] * ${factors[i]};`).join('\n');
  const stated = (i: number) => (lineFactors[i] === 1 ? `l${i}` : `l${i} * ${1 / lineFactors[i]}`);

  const value = new Function('x', `"use strict";\n${readScalar}\n${lineCode}\nreturn ${last} * ${invScale};`) as ScalarFunction;
  const lineValuesFn = new Function('x', `"use strict";\n${readScalar}\n${lineCode}\nreturn [${parsed.lines.map((_, i) => stated(i)).join(', ')}];`) as (x: ArrayLike<number>) => number[];
  const reads = used.map(({ i }) => `const q${i} = c${i}[t] * ${factors[i]};`).join('\n');
  // Two loops: the plain one, and one that also gathers the block's moment sums while y is in a register (no second pass).
  const evaluateBlock = new Function(
    'columns',
    'out',
    'offset',
    'n',
    'sums',
    `"use strict";\n${used.map(({ i }) => `const c${i} = columns[${i}];`).join('\n')}
if (sums === undefined) {
for (let t = 0; t < n; t++) {
${reads}
${lineCode}
out[offset + t] = ${last} * ${invScale};
}
return false;
}
const K = sums[0];
let d = 0;
let dd = 0;
let lo = Infinity;
let hi = -Infinity;
for (let t = 0; t < n; t++) {
${reads}
${lineCode}
const y = ${last} * ${invScale};
out[offset + t] = y;
const e = y - K;
d += e;
dd += e * e;
lo = Math.min(lo, y);
hi = Math.max(hi, y);
}
sums[1] = d;
sums[2] = dd;
sums[3] = lo;
sums[4] = hi;
return true;`,
  ) as CompiledModel['evaluateBlock'];

  const symbolic = symbolicPartials(parsed.lines, inputSymbols, parsed.usedSymbols, factors, constantsSI, invScale);

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
    partials: symbolic.partials,
    partialReads: symbolic.reads,
    symbolicDerivatives: { inlinedNodes: symbolic.inlinedNodes, fallback: symbolic.fallback, oversized: symbolic.oversizedDerivatives },
  };
}
