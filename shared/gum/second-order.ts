import type { ScalarFunction } from '../model/compile-model';

/** Kurtosis of the normal distribution, the shape the JCGM 100:2008 5.1.2 note assumes. */
export const NORMAL_KURTOSIS = 3;

/**
 * Step for differencing the first derivatives in x_j: 10⁻²·u(x_j), but at
 * least √ε·|x_j| so that x_j ± h is a different double (where u/|x| is that
 * small the terms are of relative size (u/x)² and vanish anyway).
 */
function gradientStep(x: number, u: number): number {
  return Math.max(u * 1e-2, Math.sqrt(Number.EPSILON) * Math.abs(x));
}

/**
 * The higher-order terms of the law of propagation for independent inputs with
 * symmetric distributions, to fourth order in u. For Gaussian inputs this is the
 * note to JCGM 100:2008 5.1.2 (eq. 10 + the terms):
 *   Σ_i Σ_j [ ½ (∂²f/∂x_i∂x_j)² + ∂f/∂x_i · ∂³f/∂x_i∂x_j² ] u²(x_i) u²(x_j).
 * The note's diagonal terms (i = j) use E[e⁴] = 3u⁴, true only for a normal
 * input; with the kurtosis β₂ = E[e⁴]/u⁴ of the input's shape the variance of
 * the Taylor expansion to that order gives for i = j instead
 *   [ ¼ (β₂ − 1) (∂²f/∂x_i²)² + (β₂/3) ∂f/∂x_i · ∂³f/∂x_i³ ] u⁴(x_i),
 * which is the note's term at β₂ = 3 (the mixed terms i ≠ j need only the
 * variances). For y = x², x rectangular 1 ± 1: the note gives u² = 4/3 + 2/9,
 * u = 1.247; with β₂ = 9/5, u² = 4/3 + 4/45, u = 1.193, the exact value.
 * An input with β₂ = ∞ (t with ν ≤ 4) has no fourth moment: where the model is
 * curved in it (∂²f/∂x_i²·u or ∂³f/∂x_i³·u² above 10⁻⁶ of ∂f/∂x_i) its diagonal term is left out and it
 * is listed in `omitted`; its mixed terms need only u² and stay.
 *
 * The second and third derivatives are central differences of the first
 * derivatives g_i = `partials[i]` (symbolic where possible): with step h_j,
 *   ∂²f/∂x_i∂x_j ≈ [g_i(x + h_j e_j) − g_i(x − h_j e_j)] / 2h_j,
 *   ∂³f/∂x_i∂x_j² ≈ [g_i(x + h_j e_j) − 2 g_i(x) + g_i(x − h_j e_j)] / h_j².
 * `reads[i]` lists the inputs g_i reads, so that pairs with ∂g_i/∂x_j = 0
 * cost nothing: N² evaluations become about 2·Σ|reads[i]|.
 * Holds for uncorrelated inputs whose distributions are symmetric (every kind of
 * the budget file), and only as far as the Taylor series to this order describes
 * the model over the inputs' spread.
 */
export function secondOrderVarianceTerms(
  partials: readonly ScalarFunction[],
  reads: readonly (readonly number[] | null)[],
  x: readonly number[],
  u: readonly number[],
  kurtosis: readonly number[] = x.map(() => NORMAL_KURTOSIS),
): number {
  return secondOrderTerms(partials, reads, x, u, kurtosis).variance;
}

/** `secondOrderVarianceTerms` with the indices of the inputs it had to leave out (β₂ = ∞). */
export function secondOrderTerms(
  partials: readonly ScalarFunction[],
  reads: readonly (readonly number[] | null)[],
  x: readonly number[],
  u: readonly number[],
  kurtosis: readonly number[],
): { variance: number; omitted: number[] } {
  const N = x.length;
  const omitted: number[] = [];
  const enters = x.map((_, i) => u[i] > 0);
  // A derivative g_i whose code does not read x_j gives exactly g_i(x) at x ± h_j e_j: both of its
  // differences are 0, so it is not evaluated (null reads: may read anything).
  const readers: number[][] = Array.from({ length: N }, () => []);
  for (let i = 0; i < N; i++) {
    const r = reads[i];
    if (r === null) for (let j = 0; j < N; j++) readers[j].push(i);
    else for (const j of r) readers[j].push(i);
  }
  const g0 = partials.map((g, i) => (enters[i] ? g(x) : 0));
  let sum = 0;
  const at = x.slice();
  for (let j = 0; j < N; j++) {
    if (!enters[j]) continue;
    const h = gradientStep(x[j], u[j]);
    const above = x[j] + h;
    const below = x[j] - h;
    const step = (above - below) / 2;
    for (const i of readers[j]) {
      if (!enters[i]) continue;
      at[j] = above;
      const up = partials[i](at);
      at[j] = below;
      const down = partials[i](at);
      at[j] = x[j];
      const fij = (up - down) / (2 * step);
      const fijj = (up - 2 * g0[i] + down) / (step * step);
      let term = 0.5 * fij * fij + g0[i] * fijj;
      if (i === j) {
        if (!Number.isFinite(kurtosis[i])) {
          // Straight in x_i over its spread (to 10⁻⁶ of the slope): the diagonal term is nil whatever β₂.
          const scale = 1e-6 * Math.abs(g0[i]);
          if (Math.abs(fij) * u[i] <= scale && Math.abs(fijj) * u[i] * u[i] <= scale) continue;
          omitted.push(i);
          continue;
        }
        term = 0.25 * (kurtosis[i] - 1) * fij * fij + (kurtosis[i] / 3) * g0[i] * fijj;
      }
      sum += term * u[i] * u[i] * u[j] * u[j];
    }
  }
  return { variance: sum, omitted };
}
