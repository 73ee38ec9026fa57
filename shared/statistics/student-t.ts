import * as jstatModule from 'jstat';

type JStat = typeof jstatModule.jStat;
// jstat is CommonJS: bundlers expose `jStat` by name, Node's ESM loader only as `default`.
const jStat: JStat =
  (jstatModule as { jStat?: JStat }).jStat ?? (jstatModule as unknown as { default: JStat & { jStat?: JStat } }).default.jStat ?? (jstatModule as unknown as { default: JStat }).default;

/** Beyond this ν the t quantile equals the normal one to far better than display precision. */
const NORMAL_LIMIT_DOF = 1e7;

/**
 * The p-quantile t_p(ν) of the t-distribution with ν > 0 degrees of freedom
 * (GUM G.3, Table G.2); the standard normal quantile when ν is ∞ or above 10⁷.
 */
export function studentTQuantile(p: number, dof: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`probability must lie strictly between 0 and 1 (got ${p})`);
  if (!(dof > 0)) throw new RangeError(`degrees of freedom must be greater than 0 (got ${dof})`);
  if (dof > NORMAL_LIMIT_DOF) return jStat.normal.inv(p, 0, 1);
  return jStat.studentt.inv(p, dof);
}

/**
 * Coverage factor k_p = t_{(1+p)/2}(ν) for a two-sided coverage probability p
 * (GUM G.3.4, Table G.2) at the real ν, so that k is the factor of the ν_eff
 * the result states. The note to GUM G.4.1 truncates ν_eff to an integer only
 * for reading Table G.2 and allows interpolation; the quantile of the
 * t-distribution is defined for every real ν > 0, and computing it there is
 * exact where truncation makes k larger than the stated ν_eff implies.
 * ν = ∞ gives the normal factor (1.96 for p = 0.95). Holds for ν > 0; the
 * engine refuses ν < 1 before it gets here (budget schema, JCGM 100:2008 G.4.2).
 */
export function coverageFactorFor(p: number, dof: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`coverage probability must lie strictly between 0 and 1 (got ${p})`);
  return studentTQuantile((1 + p) / 2, dof);
}

/**
 * The two-sided coverage probability of a coverage factor k for a
 * t-distribution with ν degrees of freedom: p = 2·F_ν(k) − 1 (the inverse of
 * coverageFactorFor, GUM G.3.4), with ν truncated as there (GUM G.4.1); the
 * normal probability for ν = ∞ (k = 2 → 0.9545, EA-4/02 M:2022 5.1).
 */
export function coverageProbabilityFor(k: number, dof: number): number {
  if (!(k > 0 && Number.isFinite(k))) throw new RangeError(`coverage factor must be finite and greater than 0 (got ${k})`);
  if (!(dof > 0)) throw new RangeError(`degrees of freedom must be greater than 0 (got ${dof})`);
  const nu = dof === Infinity ? Infinity : dof >= 1 ? Math.floor(dof) : dof;
  const F = nu > NORMAL_LIMIT_DOF ? jStat.normal.cdf(k, 0, 1) : jStat.studentt.cdf(k, nu);
  return 2 * F - 1;
}
