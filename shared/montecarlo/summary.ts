/**
 * Estimate and standard uncertainty from M model values:
 * ỹ = (1/M)·Σ y_r and u²(ỹ) = (1/(M − 1))·Σ (y_r − ỹ)² (JCGM 101:2008 7.6, eqs. 12–13).
 * Two passes with the corrected sum of squares, so a large offset of the
 * values costs no digits of the spread. The first pass also gives the
 * smallest and largest value, which the histogram and the interval search need.
 */
export function meanAndStandardDeviation(
  values: Float64Array,
  start = 0,
  end = values.length,
): { mean: number; standardDeviation: number; min: number; max: number } {
  const M = end - start;
  if (M < 1) throw new RangeError('needs at least one model value');
  let sum = 0;
  let min = Infinity;
  let max = -Infinity;
  for (let r = start; r < end; r++) {
    const y = values[r];
    sum += y;
    if (y < min) min = y;
    if (y > max) max = y;
  }
  const first = sum / M;
  let sumOfDeviations = 0;
  let sumOfSquares = 0;
  for (let r = start; r < end; r++) {
    const d = values[r] - first;
    sumOfDeviations += d;
    sumOfSquares += d * d;
  }
  const mean = first + sumOfDeviations / M;
  if (M < 2) return { mean, standardDeviation: 0, min, max };
  const variance = (sumOfSquares - (sumOfDeviations * sumOfDeviations) / M) / (M - 1);
  return { mean, standardDeviation: Math.sqrt(Math.max(variance, 0)), min, max };
}
