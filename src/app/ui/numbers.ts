import { formatCount, groupDigits } from '../../../shared/format/digit-groups';
import { formatPercent } from '../../../shared/format/percent';
import { withTrueMinus } from '../../../shared/format/signs';
import { atPlace, dofNumeral, significant, uncertaintyNumeral, valueNumeral, writeNumeral, type Numeral } from '../../../shared/format/significant-digits';
import { superscript } from '../../../shared/format/superscript';

/*
 * Numbers on screen: the shared number formatting (shared/format), digits
 * grouped in threes with a narrow no-break space, a true minus sign, powers of
 * ten written ×10ⁿ with Unicode superscripts. Rounding follows GUM 7.2.6.
 */

export { formatCount, formatPercent, groupDigits };

const write = (n: Numeral) => writeNumeral(n, superscript);

/** Splits a decimal string at the decimal sign (for alignment): ["−12 345", ".678"]. */
export function splitDecimal(text: string): [string, string] {
  const times = text.indexOf('×');
  const mantissa = times >= 0 ? text.slice(0, times) : text;
  const tail = times >= 0 ? text.slice(times) : '';
  const dot = mantissa.indexOf('.');
  if (dot < 0) return [mantissa, tail];
  return [mantissa.slice(0, dot), mantissa.slice(dot) + tail];
}

/** Formats x with `sig` significant digits, switching to ×10ⁿ outside 10⁻³ … 10⁶. */
export const formatSignificant = (x: number, sig = 3): string => write(significant(x, sig));

/** Formats x at the decimal place 10^exponent, in ×10ⁿ form when that place is very small or x large. */
export const formatAt = (x: number, exponent: number): string => write(atPlace(x, exponent));

/** An uncertainty with two significant digits (GUM 7.2.6). */
export const formatUncertainty = (u: number, sig = 2): string => write(uncertaintyNumeral(u, sig));

/** A value rounded to the place of its uncertainty's last significant digit (GUM 7.2.6). */
export const formatWithUncertainty = (x: number, u: number, sig = 2): string => write(valueNumeral(x, u, sig));

/** Degrees of freedom, "∞" when infinite. */
export const formatDof = (dof: number | null | undefined): string => write(dofNumeral(dof));

/** The full-precision value for tooltips. */
export function fullPrecision(x: number | null | undefined): string {
  if (x === null || x === undefined) return '∞';
  if (!Number.isFinite(x)) return formatSignificant(x);
  return withTrueMinus(String(x));
}

export function formatDateTime(ms: number): string {
  return new Date(ms).toLocaleString('en-GB', { year: 'numeric', month: 'short', day: '2-digit', hour: '2-digit', minute: '2-digit' });
}
