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
export function roundToExponent(x: number, exponent: number): number {
  if (!Number.isFinite(x)) return x;
  if (exponent < 0) return Number(x.toFixed(Math.min(-exponent, 100)));
  const p = 10 ** exponent;
  return Math.round(x / p) * p;
}

/** Formats x with the decimals implied by the place 10^exponent. */
export function formatAtExponent(x: number, exponent: number): string {
  return exponent < 0 ? roundToExponent(x, exponent).toFixed(-exponent) : roundToExponent(x, exponent).toFixed(0);
}

/**
 * Rounds an estimate and its uncertainty together: the uncertainty to two
 * significant digits, the estimate to the same decimal place (JCGM 100:2008 7.2.6).
 */
export function roundResult(estimate: number, uncertainty: number, significantDigits = 2): { estimate: string; uncertainty: string; exponent: number } {
  const r = roundUncertainty(uncertainty, significantDigits);
  return { estimate: formatAtExponent(estimate, r.exponent), uncertainty: formatAtExponent(uncertainty, r.exponent), exponent: r.exponent };
}
