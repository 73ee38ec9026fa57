import type { CompiledModel, ScalarFunction } from '../model/compile-model';

export interface Sensitivities {
  /** c_i = ∂f/∂x_i at the estimates. */
  coefficients: number[];
  methods: ('symbolic' | 'numeric')[];
  /** Inputs whose symbolic and numerical derivatives disagree (model not smooth at the estimates). */
  disagreements: string[];
}

/** Step for differences: a small fraction of u(x_i), or of |x_i| where u is 0. */
export function differenceStep(x: number, u: number): number {
  if (u > 0) return u * 1e-3;
  return Math.max(Math.abs(x), 1) * 1e-6;
}

/**
 * Central difference ∂f/∂x_i ≈ [f(x + h e_i) − f(x − h e_i)] / 2h, error O(h²)
 * (JCGM 100:2008 5.1.3 allows sensitivity coefficients obtained numerically).
 */
export function centralDifference(f: ScalarFunction, x: ArrayLike<number>, i: number, h: number): number {
  const at = Array.from(x);
  at[i] = x[i] + h;
  const up = f(at);
  at[i] = x[i] - h;
  const down = f(at);
  return (up - down) / (2 * h);
}

/**
 * Sensitivity coefficients c_i = ∂f/∂X_i evaluated at the estimates
 * (JCGM 100:2008 5.1.3, eq. 11a): the compiled symbolic derivative where
 * mathjs could form it and it is finite, otherwise a central difference.
 * Each symbolic value is cross-checked against the central difference; a
 * disagreement that matters against the combined uncertainty is reported.
 */
export function sensitivityCoefficients(model: CompiledModel, x: readonly number[], u: readonly number[]): Sensitivities {
  const coefficients: number[] = [];
  const methods: ('symbolic' | 'numeric')[] = [];
  const numeric = x.map((xi, i) => (model.usedSymbols.has(model.inputSymbols[i]) ? centralDifference(model.value, x, i, differenceStep(xi, u[i])) : 0));
  x.forEach((_, i) => {
    const partial = model.partials[i];
    const symbolic = partial ? partial(x) : NaN;
    if (Number.isFinite(symbolic)) {
      coefficients.push(symbolic);
      methods.push('symbolic');
    } else {
      coefficients.push(numeric[i]);
      methods.push('numeric');
    }
  });
  const scale = coefficients.reduce((s, c, i) => s + Math.abs(c * u[i]), 0);
  const disagreements = model.inputSymbols.filter((_, i) => {
    if (methods[i] !== 'symbolic' || u[i] === 0) return false;
    const diff = Math.abs(coefficients[i] - numeric[i]) * u[i];
    return diff > 1e-6 * scale + 1e-12 * Math.abs(coefficients[i] * u[i]) && diff > 1e-4 * Math.abs(coefficients[i]) * u[i];
  });
  return { coefficients, methods, disagreements };
}
