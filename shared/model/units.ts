import { unit as mathUnit } from 'mathjs';

/**
 * Exponents of the SI base quantities: mass, length, time, current,
 * temperature, luminous intensity, amount of substance. Angles are
 * dimensionless (SI Brochure 2.3.3), so the angle dimension is dropped.
 */
export type Dimension = readonly number[];

export const DIMENSIONLESS: Dimension = [0, 0, 0, 0, 0, 0, 0];
const BASE_NAMES = ['kg', 'm', 's', 'A', 'K', 'cd', 'mol'];

/** A unit of a budget quantity: its SI factor (value in coherent SI units = factor × value) and dimension. */
export interface QuantityUnit {
  text: string;
  factor: number;
  dimension: Dimension;
}

const DIMENSIONLESS_UNITS: Record<string, number> = { '': 1, '1': 1, '%': 0.01, ppm: 1e-6 };

/**
 * Normalises a unit as users write it for mathjs: µ → u, Ω → ohm, and
 * degC → K (a Celsius quantity in a budget is a temperature difference, so it
 * has the size of the kelvin and no offset; likewise degF → degR).
 */
function normaliseUnitText(text: string): string {
  return text
    .trim()
    .replace(/[µμ]/g, 'u')
    .replace(/Ω/g, 'ohm')
    .replace(/°C|\bdegC\b/g, 'K')
    .replace(/°F|\bdegF\b/g, 'degR')
    .replace(/·/g, ' ');
}

/**
 * Parses a unit expression (`mg`, `kg/m^3`, `1/degC`, `mol/L`, `%`, `1`).
 * Throws an Error whose message says why; callers add the field.
 */
export function parseUnit(text: string | undefined): QuantityUnit {
  const raw = text ?? '';
  const trimmed = raw.trim();
  if (trimmed in DIMENSIONLESS_UNITS) return { text: raw, factor: DIMENSIONLESS_UNITS[trimmed], dimension: DIMENSIONLESS };
  let u;
  try {
    u = mathUnit(1, normaliseUnitText(trimmed));
  } catch {
    throw new Error(`unknown unit "${trimmed}"`);
  }
  const dims = u.dimensions as number[];
  const factor = u.value as number;
  if (!Number.isFinite(factor) || factor <= 0) throw new Error(`unit "${trimmed}" has no usable size`);
  return { text: raw, factor, dimension: dims.slice(0, 7) };
}

export function sameDimension(a: Dimension, b: Dimension): boolean {
  return a.every((v, i) => Math.abs(v - b[i]) < 1e-9);
}

export function isDimensionless(d: Dimension): boolean {
  return sameDimension(d, DIMENSIONLESS);
}

export function multiplyDimensions(a: Dimension, b: Dimension, sign = 1): Dimension {
  return a.map((v, i) => v + sign * b[i]);
}

export function powerDimension(a: Dimension, p: number): Dimension {
  return a.map((v) => v * p);
}

/** Writes a dimension in SI base units, e.g. `kg m^-3`; `1` when dimensionless. */
export function describeDimension(d: Dimension): string {
  const parts = d
    .map((p, i) => (Math.abs(p) < 1e-9 ? '' : p === 1 ? BASE_NAMES[i] : `${BASE_NAMES[i]}^${+p.toFixed(6)}`))
    .filter(Boolean);
  return parts.length ? parts.join(' ') : '1';
}
