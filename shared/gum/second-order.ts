import type { ScalarFunction } from '../model/compile-model';

/**
 * The higher-order terms of the note to JCGM 100:2008 5.1.2 (added to eq. 10
 * when the model is markedly non-linear):
 *   Σ_i Σ_j [ ½ (∂²f/∂x_i∂x_j)² + ∂f/∂x_i · ∂³f/∂x_i∂x_j² ] u²(x_i) u²(x_j).
 * The second and third derivatives are central differences of the first
 * derivatives `gradient` (symbolic where possible): with step h_j,
 *   ∂²f/∂x_i∂x_j ≈ [g_i(x + h_j e_j) − g_i(x − h_j e_j)] / 2h_j,
 *   ∂³f/∂x_i∂x_j² ≈ [g_i(x + h_j e_j) − 2 g_i(x) + g_i(x − h_j e_j)] / h_j².
 */
export function secondOrderVarianceTerms(gradient: (x: readonly number[]) => number[], x: readonly number[], u: readonly number[]): number {
  const g0 = gradient(x);
  let sum = 0;
  for (let j = 0; j < x.length; j++) {
    if (!(u[j] > 0)) continue;
    const h = u[j] * 1e-2;
    const at = x.slice();
    at[j] = x[j] + h;
    const gUp = gradient(at);
    at[j] = x[j] - h;
    const gDown = gradient(at);
    for (let i = 0; i < x.length; i++) {
      if (!(u[i] > 0)) continue;
      const fij = (gUp[i] - gDown[i]) / (2 * h);
      const fijj = (gUp[i] - 2 * g0[i] + gDown[i]) / (h * h);
      sum += (0.5 * fij * fij + g0[i] * fijj) * u[i] * u[i] * u[j] * u[j];
    }
  }
  return sum;
}

/** Builds the gradient function from per-input partial derivatives. */
export function gradientOf(partials: readonly ScalarFunction[]): (x: readonly number[]) => number[] {
  return (x) => partials.map((p) => p(x));
}
