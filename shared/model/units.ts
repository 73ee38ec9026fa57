import { create, createUnitDependencies, UnitDependencies, unitDependencies, type MathJsInstance, type Unit } from 'mathjs';
import {
  absDependencies,
  addScalarDependencies,
  divideScalarDependencies,
  equalDependencies,
  fixDependencies,
  formatDependencies,
  isNumericDependencies,
  multiplyScalarDependencies,
  numberDependencies,
  powDependencies,
  roundDependencies,
  subtractScalarDependencies,
} from 'mathjs/number';
import { MINUS } from '../format/signs';

// mathjs exports this factory map (its number-only subtractScalar) but its types leave it out.
declare module 'mathjs' {
  const subtractScalarDependencies: FactoryFunctionMap;
}

/**
 * The unit system of budgets: mathjs units with the changes a budget needs
 * (`withBudgetUnits`, applied to each mathjs instance of its own that holds
 * budget units) so the rest of the program keeps mathjs as shipped.
 * - °C and °F have the size of the kelvin and of 5/9 K and no offset: the
 *   engine never adds 273.15 K by itself (the temperature rule, see
 *   `temperature-scale.ts`).
 * - %, ppm and ppb are the numbers 10⁻², 10⁻⁶, 10⁻⁹ (SI Brochure 9th ed.
 *   5.4.7, pure numbers), so
 *   `ppm/K` and `%/K` are coefficients per kelvin.
 * - rpm is the rotational frequency 1/60 s⁻¹ (ISO 80000-3 rotational
 *   frequency, unit s⁻¹: one revolution per minute); lm = cd·sr and lx = lm/m² with the steradian
 *   counted as 1 (SI Brochure 9th ed., table 4).
 * - dB is a level of its own kind: a level adds only to levels in dB and is
 *   no number factor (10 dB is not 10 × something); a ratio written in dB is
 *   converted in the model by the user (r = 10^(L/10) with L given without unit).
 */
export function withBudgetUnits(math: MathJsInstance): MathJsInstance {
  math.createUnit('degC', { definition: '1 K', prefixes: 'none' }, { override: true });
  math.createUnit('degF', { definition: `${5 / 9} K`, prefixes: 'none' }, { override: true });
  math.createUnit('percent', { definition: '0.01', prefixes: 'none' }, { override: true });
  math.createUnit('ppm', { definition: '1e-6', prefixes: 'none' }, { override: true });
  math.createUnit('ppb', { definition: '1e-9', prefixes: 'none' }, { override: true });
  math.createUnit('rpm', { definition: `${1 / 60} Hz`, prefixes: 'none' }, { override: true });
  math.createUnit('lm', { definition: '1 cd', prefixes: 'short' }, { override: true });
  math.createUnit('lx', { definition: '1 cd/m^2', prefixes: 'short' }, { override: true });
  math.createUnit('dB', {}, { override: true });
  return math;
}

/**
 * The Unit class on number arithmetic: the arithmetic a Unit is made with comes
 * from the number-only factories (`mathjs/number`), as in `math.ts`, since a
 * unit read here is always of the number 1. Made with mathjs's own, the
 * arithmetic would carry the BigNumber, fraction, complex and matrix signatures,
 * whose making was most of the 50–70 ms the first unit read took on a page
 * (the editor's budget table reads units before its first paint).
 */
const unitOnNumbers = {
  ...UnitDependencies,
  absDependencies,
  addScalarDependencies,
  divideScalarDependencies,
  equalDependencies,
  fixDependencies,
  formatDependencies,
  isNumericDependencies,
  multiplyScalarDependencies,
  numberDependencies,
  powDependencies,
  roundDependencies,
  subtractScalarDependencies,
};

let instance: MathJsInstance | undefined;
/**
 * The mathjs instance that parses the units of budgets, made on first use; only
 * unit code may use it. It holds units alone, on number arithmetic, without
 * expression evaluation: reading a unit is all the pages need, and evaluation
 * would bring most of mathjs into them (`result-unit.ts` makes its own
 * instance that evaluates).
 */
function unitMath(): MathJsInstance {
  instance ??= withBudgetUnits(
    create({
      unitDependencies: { ...unitDependencies, UnitDependencies: unitOnNumbers },
      createUnitDependencies: { ...createUnitDependencies, UnitDependencies: unitOnNumbers },
    }),
  );
  return instance;
}

/**
 * The base dimensions kept, by mathjs name (dB makes its own, "dB_STUFF"),
 * with the symbol each is written with. The angle is left out: angles are
 * dimensionless (SI Brochure 2.3.3).
 */
const KEPT_DIMENSIONS: readonly (readonly [string, string])[] = [
  ['MASS', 'kg'],
  ['LENGTH', 'm'],
  ['TIME', 's'],
  ['CURRENT', 'A'],
  ['TEMPERATURE', 'K'],
  ['LUMINOUS_INTENSITY', 'cd'],
  ['AMOUNT_OF_SUBSTANCE', 'mol'],
  ['BIT', 'b'],
  ['dB_STUFF', 'dB'],
];
const BASE_NAMES = KEPT_DIMENSIONS.map(([, symbol]) => symbol);
let keptIndices: number[] | undefined;
function kept(): number[] {
  if (!keptIndices) {
    const base = unitMath().Unit.BASE_DIMENSIONS as string[];
    keptIndices = KEPT_DIMENSIONS.map(([name]) => {
      const i = base.indexOf(name);
      if (i < 0) throw new Error(`mathjs has no base dimension ${name}`);
      return i;
    });
  }
  return keptIndices;
}

/**
 * Exponents of the base quantities: mass, length, time, current,
 * temperature, luminous intensity, amount of substance, information, level
 * in dB. Angles are dimensionless, so there is no angle exponent.
 */
export type Dimension = readonly number[];

export const DIMENSIONLESS: Dimension = KEPT_DIMENSIONS.map(() => 0);

/** Where a temperature value sits: on the Celsius or Fahrenheit scale, or in kelvin (or rankine). */
export type TemperatureUnitScale = 'celsius' | 'fahrenheit' | 'kelvin';

/** A unit of a budget quantity: its SI factor (value in coherent SI units = factor × value) and dimension. */
export interface QuantityUnit {
  text: string;
  factor: number;
  dimension: Dimension;
  /** For a unit of temperature alone (K, mK, °C, °F): the scale its values are read on. */
  temperatureScale?: TemperatureUnitScale;
}

const QUANTITY_IN_UNIT = 'a unit symbol carries no information about the quantity (SI Brochure, 9th ed., chapter 5): write "%" and say "relative humidity" in the description';
/**
 * Names that look like units but would be misread; each is refused with what
 * to write instead.
 */
const MISREAD = new Map<string, string>([
  ['pH', '"pH" is a quantity, not a unit: leave the unit of a pH value empty (or write "1"); for the inductance picohenry write "picohenry"'],
  ['%RH', QUANTITY_IN_UNIT],
  ['RH', QUANTITY_IN_UNIT],
  ['ppt', '"ppt" means 10⁻³ to some and 10⁻¹² to others: write "1e-12" as a factor in the model, or use "ppm" or "ppb"'],
  ['dBm', '"dBm" is a level relative to 1 mW: write "dB" for a level, or give the power in "mW"'],
]);

const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';

/**
 * Rewrites a unit as users write it into mathjs syntax: µ → u, Ω → ohm,
 * °C → degC, °F → degF, % → percent, · and × → a product, − → -, and
 * superscript exponents (m², s⁻¹) → ^2, ^-1. Throws for the names in
 * MISREAD with what to write instead.
 */
function mathjsUnitText(text: string): string {
  const trimmed = text.trim();
  for (const token of trimmed.split(/[\s*/^()·×]+/)) {
    const why = MISREAD.get(token);
    if (why !== undefined) throw new Error(why);
  }
  return trimmed
    .replace(/[µμ]/g, 'u')
    .replace(/Ω/g, 'ohm')
    .replace(/°C/g, 'degC')
    .replace(/°F/g, 'degF')
    .replace(/%/g, 'percent')
    .replace(/[·×]/g, ' ')
    .replaceAll(MINUS, '-')
    .replace(/⁻?[⁰¹²³⁴⁵⁶⁷⁸⁹]+/g, (e) => `^${[...e].map((c) => (c === '⁻' ? '-' : String(SUPERSCRIPT_DIGITS.indexOf(c)))).join('')}`);
}

/** The unit `text` as a mathjs Unit of size 1 of the instance `math` (budget units); throws an Error whose message says why. */
export function toMathUnit(text: string, math: MathJsInstance = unitMath()): Unit {
  const written = mathjsUnitText(text);
  try {
    return math.unit(1, written);
  } catch {
    throw new Error(`unknown unit "${text.trim()}"`);
  }
}

/** The dimension of a mathjs unit, without the angle exponent. */
function dimensionOf(u: Unit): Dimension {
  const dims = u.dimensions as number[];
  return kept().map((i) => dims[i] ?? 0);
}

function temperatureScaleOf(u: Unit, dimension: Dimension): TemperatureUnitScale | undefined {
  if (!sameDimension(dimension, TEMPERATURE)) return undefined;
  const names = u.units.map((part) => part.unit.name);
  if (names.length !== 1) return undefined;
  if (names[0] === 'degC') return 'celsius';
  if (names[0] === 'degF') return 'fahrenheit';
  return 'kelvin';
}

/**
 * Parses a unit expression (`mg`, `kg/m^3`, `1/degC`, `ppm/K`, `mol/L`, `%`, `1`).
 * Throws an Error whose message says why; callers add the field. The result
 * is frozen and kept for the last 512 texts, so a model edit does not parse
 * the units of every input again.
 */
export function parseUnit(text: string | undefined): QuantityUnit {
  const raw = text ?? '';
  const known = parsedUnits.get(raw);
  if (known) return known;
  const parsed = parseUnitText(raw);
  // Budgets repeat a few unit texts over many inputs, and every model edit parses them again: keep the last few hundred.
  if (parsedUnits.size >= PARSED_UNITS_KEPT) parsedUnits.delete(parsedUnits.keys().next().value as string);
  parsedUnits.set(raw, parsed);
  return parsed;
}

const PARSED_UNITS_KEPT = 512;
const parsedUnits = new Map<string, QuantityUnit>();

function parseUnitText(raw: string): QuantityUnit {
  const trimmed = raw.trim();
  if (trimmed === '' || trimmed === '1') return Object.freeze({ text: raw, factor: 1, dimension: DIMENSIONLESS });
  const u = toMathUnit(trimmed);
  const factor = u.value as unknown as number;
  if (typeof factor !== 'number' || !Number.isFinite(factor) || factor <= 0) throw new Error(`unit "${trimmed}" has no usable size`);
  const dimension = Object.freeze(dimensionOf(u));
  return Object.freeze({ text: raw, factor, dimension, temperatureScale: temperatureScaleOf(u, dimension) });
}

/** Whether two dimensions have the same exponents (to 10⁻⁹, for exponents such as 1/2 from sqrt). */
export function sameDimension(a: Dimension, b: Dimension): boolean {
  return a.length === b.length && a.every((v, i) => Math.abs(v - b[i]) < 1e-9);
}

/** Whether every exponent is 0: a number, or a ratio such as % or ppm. */
export function isDimensionless(d: Dimension): boolean {
  return sameDimension(d, DIMENSIONLESS);
}

/** The dimension of a product (sign 1) or quotient (sign −1): exponents add or subtract (ISO 80000-1). */
export function multiplyDimensions(a: Dimension, b: Dimension, sign = 1): Dimension {
  return a.map((v, i) => v + sign * b[i]);
}

/** The dimension of a power a^p: every exponent times p. */
export function powerDimension(a: Dimension, p: number): Dimension {
  return a.map((v) => v * p);
}

/** The dimension of temperature alone (K). */
const TEMPERATURE: Dimension = DIMENSIONLESS.map((_, i) => (BASE_NAMES[i] === 'K' ? 1 : 0));

/** Writes a dimension in SI base units, e.g. `kg m^-3`; `1` when dimensionless. */
export function describeDimension(d: Dimension): string {
  const parts = d.map((p, i) => (Math.abs(p) < 1e-9 ? '' : p === 1 ? BASE_NAMES[i] : `${BASE_NAMES[i]}^${Math.round(p * 1e6) / 1e6}`)).filter(Boolean);
  return parts.length ? parts.join(' ') : '1';
}
