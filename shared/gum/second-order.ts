import type { ScalarFunction } from '../model/compile-model';

/**
 * The higher-order terms of the note to JCGM 100:2008 5.1.2 (added to eq. 10
 * when the model is markedly non-linear):
 *   Σ_i Σ_j [ ½ (∂²f/∂x_i∂x_j)² + ∂f/∂x_i · ∂³f/∂x_i∂x_j² ] u²(x_i) u²(x_j).
 * The second and third derivatives are central differences of the first
 * derivatives g_i = `partials[i]` (symbolic where possible): with step h_j,
 *   ∂²f/∂x_i∂x_j ≈ [g_i(x + h_j e_j) − g_i(x − h_j e_j)] / 2h_j,
 *   ∂³f/∂x_i∂x_j² ≈ [g_i(x + h_j e_j) − 2 g_i(x) + g_i(x − h_j e_j)] / h_j².
 * `reads[i]` lists the inputs g_i reads, so that pairs with ∂g_i/∂x_j = 0
 * cost nothing: N² evaluations become about 2·Σ|reads[i]|.
 */
export function secondOrderVarianceTerms(
  partials: readonly ScalarFunction[],
  reads: readonly (readonly number[] | null)[],
  x: readonly number[],
  u: readonly number[],
): number {
  const N = x.length;
  // A derivative g_i whose code does not read x_j gives exactly g_i(x) at x ± h_j e_j: both of its
  // differences are 0, so it is not evaluated (null reads: may read anything).
  const readers: number[][] = Array.from({ length: N }, () => []);
  for (let i = 0; i < N; i++) {
    const r = reads[i];
    if (r === null) for (let j = 0; j < N; j++) readers[j].push(i);
    else for (const j of r) readers[j].push(i);
  }
  const g0 = partials.map((g) => g(x));
  let sum = 0;
  const at = x.slice();
  for (let j = 0; j < N; j++) {
    if (!(u[j] > 0)) continue;
    const h = u[j] * 1e-2;
    for (const i of readers[j]) {
      if (!(u[i] > 0)) continue;
      at[j] = x[j] + h;
      const up = partials[i](at);
      at[j] = x[j] - h;
      const down = partials[i](at);
      at[j] = x[j];
      const fij = (up - down) / (2 * h);
      const fijj = (up - 2 * g0[i] + down) / (h * h);
      sum += (0.5 * fij * fij + g0[i] * fijj) * u[i] * u[i] * u[j] * u[j];
    }
  }
  return sum;
}
