import type { ValidationResult } from '../budget/result';

/**
 * Numerical tolerance δ of a standard uncertainty u for n_dig significant
 * digits: u = c·10^ℓ with c an n_dig-digit integer, δ = ½·10^ℓ (JCGM 101:2008 8.2).
 * E.g. u = 0.0539 with n_dig = 2: c = 54, ℓ = −3, δ = 0.0005.
 */
export function numericalTolerance(u: number, nDig: number): number {
  if (!(Number.isFinite(u) && u > 0)) throw new RangeError(`the standard uncertainty must be finite and positive (got ${u})`);
  if (!(Number.isInteger(nDig) && nDig >= 1)) throw new RangeError(`significant digits must be a whole number ≥ 1 (got ${nDig})`);
  let l = Math.floor(Math.log10(u)) - (nDig - 1);
  // log10 may be off by one at exact powers of ten, and rounding c may carry to n_dig + 1 digits.
  for (let guard = 0; guard < 4; guard++) {
    const c = Math.round(u / Math.pow(10, l));
    if (c >= Math.pow(10, nDig)) l++;
    else if (c < Math.pow(10, nDig - 1)) l--;
    else break;
  }
  return Math.pow(10, l) / 2;
}

/**
 * Validates the GUM coverage interval y ± U against the Monte Carlo interval
 * [y_low, y_high] (JCGM 101:2008 8.3): d_low = |y − U − y_low|,
 * d_high = |y + U − y_high|; passed when both are ≤ δ of the Monte Carlo u (8.2).
 */
export function validateGumInterval(
  gum: { y: number; U: number },
  mcInterval: readonly [number, number],
  u: number,
  nDig: number,
): ValidationResult {
  const tolerance = numericalTolerance(u, nDig);
  const dLow = Math.abs(gum.y - gum.U - mcInterval[0]);
  const dHigh = Math.abs(gum.y + gum.U - mcInterval[1]);
  return { significantDigits: nDig, tolerance, dLow, dHigh, passed: dLow <= tolerance && dHigh <= tolerance };
}
