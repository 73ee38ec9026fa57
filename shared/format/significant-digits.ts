import { formatAtExponent } from '../gum/rounding';
import { groupDigits } from './digit-groups';
import { MINUS } from './signs';

/*
 * Numbers written to a number of significant digits or to a decimal place, with
 * a power of ten when plain decimals would be too long. Uncertainties keep two
 * significant digits and values are written to the same place (GUM 7.2.6).
 * The result is a numeral whose power each renderer raises in its own way.
 */

/** Grouped decimal digits and the power of ten they multiply (null: written without one). */
export interface Numeral {
  digits: string;
  power: number | null;
}

const plain = (digits: string): Numeral => ({ digits, power: null });

/** x with `sig` significant digits; a power of ten outside 10⁻³ … 10⁶; "∞", "−∞", "—" for non-finite x. */
export function significant(x: number, sig = 3): Numeral {
  if (x === 0) return plain('0');
  if (!Number.isFinite(x)) return plain(Number.isNaN(x) ? '—' : x > 0 ? '∞' : `${MINUS}∞`);
  const mag = Math.floor(Math.log10(Math.abs(x)));
  if (mag < -3 || mag >= 6) {
    const [m, e] = x.toExponential(sig - 1).split('e');
    return { digits: groupDigits(m), power: Number(e) };
  }
  return plain(groupDigits(x.toFixed(Math.min(Math.max(0, sig - 1 - mag), 20))));
}

/** x written to the decimal place 10^exponent; a power of ten when that place is very small or x very large. */
export function atPlace(x: number, exponent: number): Numeral {
  if (!Number.isFinite(x)) return significant(x);
  if (x === 0) return plain(exponent < 0 && exponent >= -6 ? (0).toFixed(-exponent) : '0');
  const mag = Math.floor(Math.log10(Math.abs(x)));
  if ((exponent < -6 && mag < -2) || mag >= 9) {
    const digits = Math.max(0, mag - exponent);
    return { digits: groupDigits((x / 10 ** mag).toFixed(Math.min(digits, 20))), power: mag };
  }
  return plain(groupDigits(formatAtExponent(x, exponent)));
}

/** Writes a numeral, raising its power of ten with `raise`: "1.2" and −6 → "1.2×10" + raise("−6"). */
export function writeNumeral(n: Numeral, raise: (exponent: string) => string): string {
  return n.power === null ? n.digits : `${n.digits}×10${raise(String(n.power).replace('-', MINUS))}`;
}

/** x rounded to `sig` significant digits, as a number to put in an input field: 0.0057735 → 0.00577 (sig 3). */
export function roundSignificant(x: number, sig: number): number {
  return Number.isFinite(x) && x !== 0 ? Number(x.toPrecision(sig)) : x;
}
