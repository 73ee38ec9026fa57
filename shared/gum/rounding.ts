/** A value rounded for display: the number and the decimal exponent of its last kept digit. */
export interface Rounded {
  value: number;
  /** 10^exponent is the place of the last digit kept (−3 → thousandths). */
  exponent: number;
}

/**
 * Rounds an uncertainty to `significantDigits` significant digits (JCGM 100:2008
 * 7.2.6: at most two significant digits are usually enough).
 */
export function roundUncertainty(u: number, significantDigits = 2): Rounded {
  if (!(u > 0) || !Number.isFinite(u)) return { value: u, exponent: 0 };
  let exponent = Math.floor(Math.log10(u)) - (significantDigits - 1);
  // 0.0996 → 0.10: the rounding carried into a new leading digit
  if (Math.round(u / 10 ** exponent) >= 10 ** significantDigits) exponent += 1;
  return { value: roundToExponent(u, exponent), exponent };
}

/** Rounds x to the place 10^exponent (half away from zero on the binary value). */
function roundToExponent(x: number, exponent: number): number {
  if (!Number.isFinite(x)) return x;
  if (exponent < 0) return Number(x.toFixed(Math.min(-exponent, 100)));
  const p = 10 ** exponent;
  return Math.round(x / p) * p;
}

/** Formats x with the decimals implied by the place 10^exponent. */
export function formatAtExponent(x: number, exponent: number): string {
  return exponent < 0 ? roundToExponent(x, exponent).toFixed(-exponent) : roundToExponent(x, exponent).toFixed(0);
}

/** Significant digits of a binary double beyond which its decimal digits are representation noise. */
const DOUBLE_SIGNIFICANT_DIGITS = 15;

/**
 * The place 10^exponent of the last significant digit of x as written with at
 * most 15 significant digits (0.5 → −1, 1200 → 2, 0.1 + 0.2 → −1); 0 for 0.
 */
function lastDigitExponent(x: number): number {
  if (x === 0 || !Number.isFinite(x)) return 0;
  const [mantissa, exp] = Math.abs(x)
    .toExponential(DOUBLE_SIGNIFICANT_DIGITS - 1)
    .split('e');
  const digits = mantissa.replace('.', '').replace(/0+$/, '');
  return Number(exp) - (digits.length - 1);
}

/**
 * Rounds an estimate and its uncertainty together: the uncertainty to two
 * significant digits, the estimate to the same decimal place (JCGM 100:2008 7.2.6).
 * An uncertainty of 0 (e.g. the difference of two fully correlated inputs) sets
 * no decimal place, so the estimate keeps its own significant digits
 * (`lastDigitExponent`) and the uncertainty is written at that place: 0.5 with
 * U = 0 gives 0.5 and 0.0, never 1 and 0.
 */
export function roundResult(estimate: number, uncertainty: number, significantDigits = 2): { estimate: string; uncertainty: string; exponent: number } {
  if (uncertainty === 0) {
    const exponent = Math.min(lastDigitExponent(estimate), 0);
    return { estimate: formatAtExponent(estimate, exponent), uncertainty: formatAtExponent(0, exponent), exponent };
  }
  const r = roundUncertainty(uncertainty, significantDigits);
  return { estimate: formatAtExponent(estimate, r.exponent), uncertainty: formatAtExponent(uncertainty, r.exponent), exponent: r.exponent };
}
