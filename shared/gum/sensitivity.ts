import type { CompiledModel, ScalarFunction } from '../model/compile-model';

export interface Sensitivities {
  /** c_i = ∂f/∂x_i at the estimates. */
  coefficients: number[];
  methods: ('symbolic' | 'numeric')[];
  /** The central-difference step h_i used for each input (0 for inputs the model does not use). */
  steps: number[];
  /** Inputs whose symbolic and numerical derivatives disagree (model not smooth at the estimates). */
  disagreements: string[];
}

const EPSILON = Number.EPSILON;
/** Relative accuracy a central difference is asked to reach against the rounding of the model value. */
const DIFFERENCE_ACCURACY = 1e-8;

/**
 * Step h for the central difference in x_i: the largest of
 * - 10⁻³·u(x_i), so that the derivative is taken well inside the input's spread
 *   (or 10⁻⁶·max(|x_i|, 1) where u = 0);
 * - √ε·|x_i| (ε = 2⁻⁵²), so that x_i ± h differ from x_i by many units in the last
 *   place: below it, x_i + h rounds and the step is not the one divided by;
 * - `resolutionFloor`, the step the model value's own rounding needs
 *   (`modelResolutionStep`).
 * At u/|x| = 10⁻¹² (frequency and time) the first alone is 10⁻¹⁵·|x|, under the
 * resolution of a double; the others then take over. Common practice of
 * numerical differentiation (step from the variable's magnitude and the
 * function's rounding error).
 */
export function differenceStep(x: number, u: number, resolutionFloor = 0): number {
  const local = u > 0 ? u * 1e-3 : Math.max(Math.abs(x), 1) * 1e-6;
  return Math.max(local, Math.sqrt(EPSILON) * Math.abs(x), resolutionFloor);
}

/**
 * The smallest step at which the central difference resolves the model value:
 * its rounding error ≈ ε·|y|/h must stay below 10⁻⁸ of the slope that matters,
 * max(|c_i|, s/u_i) with s = Σ|c_j|u_j (a slope that is negligible against the
 * combined uncertainty needs no more accuracy than that): h ≥ ε|y| / (10⁻⁸·slope).
 * 0 when nothing sets the slope.
 */
export function modelResolutionStep(y: number, slope: number, u: number, scale: number): number {
  const matters = Math.max(Math.abs(slope), u > 0 ? scale / u : 0);
  return matters > 0 ? (EPSILON * Math.abs(y)) / (DIFFERENCE_ACCURACY * matters) : 0;
}

/**
 * Central difference ∂f/∂x_i ≈ [f(x + h e_i) − f(x − h e_i)] / [(x_i + h) − (x_i − h)],
 * error O(h²) (JCGM 100:2008 5.1.3 allows sensitivity coefficients obtained
 * numerically). Dividing by the difference of the stored arguments, not 2h,
 * removes the rounding of x_i ± h.
 */
export function centralDifference(f: ScalarFunction, x: ArrayLike<number>, i: number, h: number): number {
  const at = Array.from(x);
  const above = x[i] + h;
  const below = x[i] - h;
  at[i] = above;
  const up = f(at);
  at[i] = below;
  const down = f(at);
  return (up - down) / (above - below);
}

/**
 * Sensitivity coefficients c_i = ∂f/∂X_i evaluated at the estimates
 * (JCGM 100:2008 5.1.3, eq. 11a): the compiled symbolic derivative where
 * mathjs could form it and it is finite, otherwise a central difference with
 * the step of `differenceStep`, its resolution floor from a first estimate of
 * the slope. Each symbolic value is cross-checked against the central
 * difference; a disagreement larger than the difference's own rounding error
 * (≈ 4ε|y|/h) that matters against the combined uncertainty is reported.
 */
export function sensitivityCoefficients(model: CompiledModel, x: readonly number[], u: readonly number[]): Sensitivities {
  const used = (i: number) => model.usedSymbols.has(model.inputSymbols[i]);
  const y = model.value(x);
  const symbolic = x.map((_, i) => {
    const partial = model.partials[i];
    return partial ? partial(x) : NaN;
  });
  // First estimate of each slope: the symbolic one, or a difference at the local step.
  const first = x.map((xi, i) => {
    if (!used(i)) return 0;
    return Number.isFinite(symbolic[i]) ? symbolic[i] : centralDifference(model.value, x, i, differenceStep(xi, u[i]));
  });
  const firstScale = first.reduce((s, c, i) => s + (Number.isFinite(c) ? Math.abs(c * u[i]) : 0), 0);
  const steps = x.map((xi, i) => (used(i) ? differenceStep(xi, u[i], modelResolutionStep(y, Number.isFinite(first[i]) ? first[i] : 0, u[i], firstScale)) : 0));
  const numeric = x.map((_, i) => (used(i) ? centralDifference(model.value, x, i, steps[i]) : 0));

  const methods: ('symbolic' | 'numeric')[] = symbolic.map((s) => (Number.isFinite(s) ? 'symbolic' : 'numeric'));
  const coefficients = symbolic.map((s, i) => (methods[i] === 'symbolic' ? s : numeric[i]));
  const scale = coefficients.reduce((s, c, i) => s + Math.abs(c * u[i]), 0);
  const disagreements = model.inputSymbols.filter((_, i) => {
    if (methods[i] !== 'symbolic' || u[i] === 0 || !used(i)) return false;
    const rounding = (4 * EPSILON * Math.abs(y)) / steps[i];
    const diff = Math.max(Math.abs(coefficients[i] - numeric[i]) - rounding, 0);
    return diff * u[i] > 1e-6 * scale + 1e-12 * Math.abs(coefficients[i] * u[i]) && diff > 1e-4 * Math.abs(coefficients[i]);
  });
  return { coefficients, methods, steps, disagreements };
}
