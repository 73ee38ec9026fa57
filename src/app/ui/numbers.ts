import { formatAtExponent, roundUncertainty } from '../../../shared/gum/rounding';

/*
 * Number display: digits grouped in threes on both sides of the decimal sign
 * (SI Brochure 5.4.4, narrow no-break space), a true minus sign, powers of ten
 * written as ×10ⁿ. Rounding for results follows GUM 7.2.6 (shared/gum/rounding).
 */

const THIN = '\u202f';
const MINUS = '\u2212';
const SUP: Record<string, string> = { '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻' };

function groupInt(s: string): string {
  if (s.length <= 4) return s;
  return s.replace(/\B(?=(\d{3})+(?!\d))/g, THIN);
}
function groupFrac(s: string): string {
  if (s.length <= 4) return s;
  return s.replace(/(\d{3})(?=\d)/g, `$1${THIN}`);
}

/** Groups a plain decimal string such as "-12345.678901" → "−12 345.678 901". */
export function groupDigits(text: string): string {
  const m = /^([+-]?)(\d*)(?:\.(\d*))?$/.exec(text);
  if (!m) return text.replace('-', MINUS);
  const [, sign, int, frac] = m;
  return `${sign === '-' ? MINUS : ''}${groupInt(int)}${frac !== undefined ? '.' + groupFrac(frac) : ''}`;
}

export function superscriptExponent(n: number): string {
  return [...String(n)].map((c) => SUP[c] ?? c).join('');
}

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
export function formatSignificant(x: number, sig = 3): string {
  if (x === 0) return '0';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : x < 0 ? `${MINUS}∞` : '—';
  const mag = Math.floor(Math.log10(Math.abs(x)));
  if (mag < -3 || mag >= 6) {
    const [m, e] = x.toExponential(sig - 1).split('e');
    return `${groupDigits(m)}×10${superscriptExponent(Number(e))}`;
  }
  const decimals = Math.max(0, sig - 1 - mag);
  return groupDigits(x.toFixed(Math.min(decimals, 20)));
}

/** Formats x at the decimal place 10^exponent, in ×10ⁿ form when that place is very small or large. */
export function formatAt(x: number, exponent: number): string {
  if (!Number.isFinite(x)) return formatSignificant(x);
  if (x === 0) return '0';
  const mag = Math.floor(Math.log10(Math.abs(x)));
  if ((exponent < -6 && mag < -2) || mag >= 9) {
    // scientific: choose the power of x (or of the place when x is 0)
    const p = mag;
    const digits = Math.max(0, p - exponent);
    const mantissa = x / 10 ** p;
    return `${groupDigits(mantissa.toFixed(Math.min(digits, 20)))}×10${superscriptExponent(p)}`;
  }
  return groupDigits(formatAtExponent(x, exponent));
}

/** An uncertainty with two significant digits (GUM 7.2.6). */
export function formatUncertainty(u: number, sig = 2): string {
  if (!(u > 0) || !Number.isFinite(u)) return formatSignificant(u);
  const r = roundUncertainty(u, sig);
  return formatAt(u, r.exponent);
}

/** A value rounded to the place of its uncertainty's last significant digit (GUM 7.2.6). */
export function formatWithUncertainty(x: number, u: number, sig = 2): string {
  if (!(u > 0) || !Number.isFinite(u)) return formatSignificant(x, 6);
  const r = roundUncertainty(u, sig);
  return formatAt(x, r.exponent);
}

/** The full-precision value for tooltips. */
export function fullPrecision(x: number | null | undefined): string {
  if (x === null || x === undefined) return '∞';
  if (!Number.isFinite(x)) return formatSignificant(x);
  return String(x).replace('-', MINUS);
}

export function formatPercent(share: number): string {
  const pct = share * 100;
  if (pct === 0) return '0 %';
  if (pct < 0.1) return '< 0.1 %';
  return `${pct.toFixed(pct < 10 ? 1 : 0)} %`;
}

export function formatDof(dof: number | null | undefined): string {
  if (dof === null || dof === undefined || !Number.isFinite(dof)) return '∞';
  if (dof >= 1e6) return formatSignificant(dof, 2);
  return dof % 1 === 0 ? groupDigits(dof.toFixed(0)) : groupDigits(dof.toFixed(1));
}

export function formatDateTime(ms: number): string {
  return new Date(ms).toLocaleString('en-GB', { year: 'numeric', month: 'short', day: '2-digit', hour: '2-digit', minute: '2-digit' });
}

export function formatCount(n: number): string {
  return groupDigits(String(Math.round(n)));
}
