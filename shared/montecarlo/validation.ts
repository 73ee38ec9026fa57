import { significantFigure } from '../presentation/figures';
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

/** Two significant digits for the figures quoted in a verdict's reason. */
function figure(x: number): string {
  return significantFigure(x, 2).text;
}

/**
 * How far a Monte Carlo endpoint may move with another seed, as a multiple of
 * its numerical standard uncertainty: 2, the factor JCGM 101:2008 7.9.4 uses
 * when it asks 2s ≤ δ of the adaptive procedure (about 95 %).
 */
const ENDPOINT_COVERAGE_FACTOR = 2;

export interface ValidationOptions {
  /**
   * Numerical standard uncertainties u(y_low), u(y_high) of the Monte Carlo
   * endpoints (see MonteCarloRun.endpointUncertainty). Without them the
   * verdict is d against δ alone.
   */
  endpointUncertainty?: readonly [number, number];
  /** Trials of the run, for the reason of an inconclusive verdict. */
  trials?: number;
}

/**
 * Validates the GUM coverage interval y ± U against the Monte Carlo interval
 * [y_low, y_high] (JCGM 101:2008 8.3): d_low = |y − U − y_low|,
 * d_high = |y + U − y_high|, compared with δ of the Monte Carlo u (8.2).
 * The Monte Carlo endpoints are themselves uncertain (JCGM 101:2008 7.9, 8.2:
 * the comparison presumes them accurate to δ); with e = 2·u(endpoint):
 * - `validated` when d_low + e_low ≤ δ and d_high + e_high ≤ δ;
 * - `not-validated` when d_low − e_low > δ or d_high − e_high > δ;
 * - `inconclusive` otherwise: another seed at this number of trials could give
 *   the other verdict, and more trials decide it. An adaptive run stable to δ
 *   (7.9) can still be inconclusive: 2s ≤ δ does not resolve a d close to δ.
 * Without endpoint uncertainties, validated when both d ≤ δ (8.3 as written).
 * `passed` is true only for `validated`.
 */
export function validateGumInterval(gum: { y: number; U: number }, mcInterval: readonly [number, number], u: number, nDig: number, options: ValidationOptions = {}): ValidationResult {
  const tolerance = numericalTolerance(u, nDig);
  const dLow = Math.abs(gum.y - gum.U - mcInterval[0]);
  const dHigh = Math.abs(gum.y + gum.U - mcInterval[1]);
  const base = { significantDigits: nDig, tolerance, dLow, dHigh };
  const [uLow, uHigh] = options.endpointUncertainty ?? [0, 0];
  const eLow = ENDPOINT_COVERAGE_FACTOR * uLow;
  const eHigh = ENDPOINT_COVERAGE_FACTOR * uHigh;
  const withUncertainty = options.endpointUncertainty ? { endpointUncertainty: [uLow, uHigh] as [number, number] } : {};
  if (dLow + eLow <= tolerance && dHigh + eHigh <= tolerance) {
    return { ...base, passed: true, verdict: 'validated', ...withUncertainty };
  }
  if (dLow - eLow > tolerance || dHigh - eHigh > tolerance) {
    return {
      ...base,
      passed: false,
      verdict: 'not-validated',
      reason: `the GUM interval differs from the Monte Carlo interval by more than δ = ${figure(tolerance)} ` + `(d_low = ${figure(dLow)}, d_high = ${figure(dHigh)}; JCGM 101:2008 8)`,
      ...withUncertainty,
    };
  }
  const at = options.trials !== undefined ? ` at ${options.trials} trials` : '';
  return {
    ...base,
    passed: false,
    verdict: 'inconclusive',
    reason:
      `inconclusive${at}: d_low = ${figure(dLow)} and d_high = ${figure(dHigh)} lie within the Monte Carlo endpoints' numerical ` +
      `uncertainty (2u = ${figure(eLow)}, ${figure(eHigh)}) of δ = ${figure(tolerance)}, so another seed could give the other verdict; ` +
      'run more trials (four times as many halve that uncertainty)',
    ...withUncertainty,
  };
}

/**
 * The clause 8 comparison cannot be made: the Monte Carlo u, and so δ, does
 * not exist (an input drawn from a t-distribution with ν ≤ 2 has no variance,
 * JCGM 101:2008 6.4.9). d_low and d_high are still given: both intervals exist.
 */
export function validationNotPossible(gum: { y: number; U: number }, mcInterval: readonly [number, number], nDig: number, reason: string): ValidationResult {
  return {
    significantDigits: nDig,
    tolerance: null,
    dLow: Math.abs(gum.y - gum.U - mcInterval[0]),
    dHigh: Math.abs(gum.y + gum.U - mcInterval[1]),
    passed: false,
    verdict: 'not-possible',
    reason,
  };
}
