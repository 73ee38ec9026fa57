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
  // Four partial sums per quantity: one running sum waits on the latency of each addition.
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  let min = Infinity;
  let max = -Infinity;
  const stop4 = start + ((M >> 2) << 2);
  let r = start;
  for (; r < stop4; r += 4) {
    const a = values[r];
    const b = values[r + 1];
    const c = values[r + 2];
    const d = values[r + 3];
    s0 += a;
    s1 += b;
    s2 += c;
    s3 += d;
    const lo = a < b ? a : b;
    const lo2 = c < d ? c : d;
    const hi = a > b ? a : b;
    const hi2 = c > d ? c : d;
    if (lo < min) min = lo;
    if (lo2 < min) min = lo2;
    if (hi > max) max = hi;
    if (hi2 > max) max = hi2;
  }
  for (; r < end; r++) {
    const y = values[r];
    s0 += y;
    if (y < min) min = y;
    if (y > max) max = y;
  }
  const first = (s0 + s1 + (s2 + s3)) / M;
  let d0 = 0;
  let d1 = 0;
  let q0 = 0;
  let q1 = 0;
  for (r = start; r < stop4; r += 4) {
    const a = values[r] - first;
    const b = values[r + 1] - first;
    const c = values[r + 2] - first;
    const d = values[r + 3] - first;
    d0 += a + b;
    d1 += c + d;
    q0 += a * a + b * b;
    q1 += c * c + d * d;
  }
  for (; r < end; r++) {
    const a = values[r] - first;
    d0 += a;
    q0 += a * a;
  }
  const sumOfDeviations = d0 + d1;
  const sumOfSquares = q0 + q1;
  const mean = first + sumOfDeviations / M;
  if (M < 2) return { mean, standardDeviation: 0, min, max };
  const variance = (sumOfSquares - (sumOfDeviations * sumOfDeviations) / M) / (M - 1);
  return { mean, standardDeviation: Math.sqrt(Math.max(variance, 0)), min, max };
}
