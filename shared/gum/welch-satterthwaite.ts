import { combinedVariance } from './combined-uncertainty';
import { correlationGroups } from './correlation-groups';

/** One independent term of the combined variance: its variance u_t²(y) and its degrees of freedom ν_t (Infinity for ∞). */
export interface VarianceTerm {
  variance: number;
  dof: number;
}

/**
 * The Welch–Satterthwaite formula over independent terms (JCGM 100:2008 G.4.1,
 * eq. G.2b): ν_eff = (Σ u_t²)² / Σ u_t⁴/ν_t. Terms with ν_t = ∞ or u_t = 0
 * vanish from the denominator; Infinity when all do. Holds for independent
 * terms each of whose variance estimate is a scaled χ²_ν (G.4.1, G.3.3).
 * Always min ν_t ≤ ν_eff ≤ Σ ν_t over the terms with u_t > 0 (Cauchy–Schwarz).
 */
export function welchSatterthwaite(terms: readonly VarianceTerm[]): number {
  // The formula is homogeneous of degree 0 in the variances: dividing them by the largest keeps u_t⁴ within the double range.
  const largest = terms.reduce((m, t) => Math.max(m, t.variance), 0);
  if (!(largest > 0)) return Infinity;
  let total = 0;
  let denominator = 0;
  for (const t of terms) {
    const v = Math.max(t.variance, 0) / largest;
    total += v;
    if (Number.isFinite(t.dof) && v > 0) denominator += (v * v) / t.dof;
  }
  if (denominator === 0 || total === 0) return Infinity;
  return (total * total) / denominator;
}

/**
 * The independent terms of the combined variance: each group of correlated
 * inputs (`correlationGroups`) is one term whose variance is the group's own
 * combined variance with its covariances, u_G² = Σ_{i,j∈G} c_i c_j u_i u_j r_ij
 * (JCGM 100:2008 5.2.2 eq. 16), and whose ν is the common ν of its members
 * with c_i·u_i ≠ 0 — exact when they are the coefficients of one least-squares
 * fit, where any linear combination of them has a variance estimate s²·(const.)
 * with the fit's ν = n − p (JCGM 100:2008 H.3.6: the predicted correction of a
 * straight-line calibration, ν = n − 2 with r(y₁, y₂) = −0.930, from memory). When the ν of
 * a group's members differ, the group takes the smallest of them: a
 * conservative choice (a smaller ν gives a larger k). An uncorrelated input is
 * its own group, so without correlations this is eq. G.2b input by input.
 * Treating correlated inputs as combined terms follows the principle of
 * R. Willink, "A generalization of the Welch–Satterthwaite formula for use with
 * correlations between errors", Metrologia 44 (2007) 340–349 (from memory):
 * correlated errors are sums of common independent components.
 */
function varianceTerms(c: readonly number[], u: readonly number[], dofs: readonly number[], correlation: readonly (readonly number[])[] | null): VarianceTerm[] {
  return correlationGroups(c.length, correlation).map((members) => {
    const cG = members.map((i) => c[i]);
    const uG = members.map((i) => u[i]);
    const rG = correlation && members.length > 1 ? members.map((i) => members.map((j) => correlation[i][j])) : null;
    const contributing = members.filter((i) => c[i] * u[i] !== 0);
    const dof = contributing.length ? Math.min(...contributing.map((i) => dofs[i])) : Infinity;
    return { variance: combinedVariance(cG, uG, rG), dof };
  });
}

/**
 * Effective degrees of freedom of u_c(y): the Welch–Satterthwaite formula
 * (JCGM 100:2008 G.4.1 eq. G.2b) over the independent terms of `varianceTerms`,
 * so correlated inputs enter as their groups, never pairwise.
 */
export function effectiveDegreesOfFreedom(c: readonly number[], u: readonly number[], dofs: readonly number[], correlation: readonly (readonly number[])[] | null): number {
  return welchSatterthwaite(varianceTerms(c, u, dofs, correlation));
}
