/**
 * Effective degrees of freedom by the Welch–Satterthwaite formula
 * (JCGM 100:2008 G.4.1, eq. G.2b): ν_eff = u_c⁴(y) / Σ u_i⁴(y)/ν_i, with
 * u_i(y) = |c_i| u(x_i). Terms with ν_i = ∞ vanish; returns Infinity when all
 * do (or when u_c = 0).
 */
export function effectiveDegreesOfFreedom(combinedStandardUncertainty: number, contributions: readonly number[], dofs: readonly number[]): number {
  let denominator = 0;
  for (let i = 0; i < contributions.length; i++) {
    if (Number.isFinite(dofs[i]) && contributions[i] !== 0) denominator += contributions[i] ** 4 / dofs[i];
  }
  if (denominator === 0 || combinedStandardUncertainty === 0) return Infinity;
  return combinedStandardUncertainty ** 4 / denominator;
}
