import { superscript } from '../format/superscript';
import { ratioPieces, unitPieces, writeUnit, type UnitPiece } from '../format/unit-symbols';
import { isDimensionless, parseUnit, sameDimension, multiplyDimensions } from '../model/units';
import { coefficient, type Figure } from './figures';

/*
 * Units as the reader sees them, in both spellings (screen superscripts and
 * PDF raise markup), and sensitivity coefficients expressed in units a
 * metrologist would write by hand.
 */

/** A typeset unit: `text` with Unicode superscripts, `markup` for the PDF; both "" when dimensionless. */
export interface UnitText {
  text: string;
  markup: string;
}

const spell = (pieces: UnitPiece[]): UnitText => ({ text: writeUnit(pieces, superscript), markup: writeUnit(pieces, (e) => `^{${e}}`) });

/** A unit as written in a budget file, typeset: "um" → µm, "kg/m^3" → kg/m³, "1" → "" (SI Brochure 5.4.3). */
export function unitText(unit: string | undefined | null): UnitText {
  return spell(unitPieces(unit));
}

/** A figure followed by its unit, separated by a space (SI Brochure 5.4.3); the figure alone when dimensionless. */
export function withUnit(f: Figure, u: UnitText): Figure {
  return u.text ? { text: `${f.text} ${u.text}`, markup: `${f.markup} ${u.markup}`, value: f.value } : f;
}

/** A sensitivity coefficient in the units it is shown with. */
export interface ShownCoefficient {
  figure: Figure;
  unit: UnitText;
}

const PREFIXES: [string, number][] = [
  ['p', -12],
  ['n', -9],
  ['u', -6],
  ['m', -3],
  ['', 0],
  ['k', 3],
  ['M', 6],
  ['G', 9],
];

const safeParse = (u: string | undefined) => {
  try {
    return parseUnit(u);
  } catch {
    return null;
  }
};

/** The unit name without its SI prefix, when the name is a prefixed simple unit: "mK" → "K", "um" → "m", "degC" → "K". */
function baseOf(unit: string): string | null {
  const t = unit.trim();
  if (t === 'degC' || t === '°C') return 'K';
  if (!/^[A-Za-zµΩ]+$/.test(t)) return null;
  const parsed = safeParse(t);
  if (!parsed) return null;
  for (const [p] of PREFIXES) {
    if (!p || !t.startsWith(p) || t.length === p.length) continue;
    const rest = t.slice(p.length);
    const r = safeParse(rest);
    if (r && sameDimension(r.dimension, parsed.dimension)) return rest;
  }
  return t;
}

/**
 * A sensitivity coefficient c_i = ∂f/∂x_i (JCGM 100:2008 5.1.3), given in measurand unit per
 * input unit, expressed as a hand-written budget gives it:
 * - when measurand and input have the same dimension, as the pure number c_i·(unit of y)/(unit of x)
 *   in coherent units: a difference of temperatures in mK against °C gives −1, not −1000 mK/°C;
 * - otherwise in (prefixed unit of y)/(unit of x), the prefix chosen so the number lies in [0.1, 100):
 *   1.15·10⁻⁵ m/°C → 11.5 µm/°C.
 * Units that cannot be parsed keep the coefficient as computed.
 */
export function sensitivityShown(c: number, measurandUnit: string | undefined, inputUnit: string | undefined): ShownCoefficient {
  const y = safeParse(measurandUnit);
  const x = safeParse(inputUnit);
  const asComputed = { figure: coefficient(c), unit: spell(ratioPieces(measurandUnit, inputUnit)) };
  if (!y || !x || !Number.isFinite(c)) return asComputed;
  const coherent = (c * y.factor) / x.factor;
  if (isDimensionless(multiplyDimensions(y.dimension, x.dimension, -1))) {
    return { figure: coefficient(coherent), unit: { text: '', markup: '' } };
  }
  const base = measurandUnit ? baseOf(measurandUnit) : null;
  if (!base || c === 0) return asComputed;
  const baseUnit = safeParse(base);
  if (!baseUnit) return asComputed;
  // c in base-unit-of-y per x-unit, then the prefix that brings it into [0.1, 100)
  const inBase = (c * y.factor) / baseUnit.factor;
  const mag = Math.floor(Math.log10(Math.abs(inBase)) + 1e-12);
  const wanted = Math.floor((mag + 1) / 3) * 3;
  const prefix = PREFIXES.find(([, e]) => e === Math.max(-12, Math.min(9, wanted)));
  if (!prefix) return asComputed;
  // no prefix needed: keep the unit the measurand is written in when it is the base (°C stays °C)
  const name = prefix[1] === 0 && y.factor === baseUnit.factor ? (measurandUnit as string) : `${prefix[0]}${base}`;
  const check = safeParse(name);
  if (!check || !sameDimension(check.dimension, y.dimension)) return asComputed;
  return { figure: coefficient(inBase / 10 ** prefix[1]), unit: spell(ratioPieces(name, inputUnit)) };
}
