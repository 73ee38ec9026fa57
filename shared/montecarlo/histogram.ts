import type { HistogramBins } from '../budget/result';

/** Default number of bins for the Monte Carlo histogram (common practice for 10⁵–10⁷ values). */
export const DEFAULT_BIN_COUNT = 100;

/**
 * Equal-width histogram of the model values from their minimum to their
 * maximum (a display of the distribution function of JCGM 101:2008 7.5).
 * Bin b holds start + b·width ≤ y < start + (b + 1)·width; the maximum goes in
 * the last bin. When all values are equal there is one bin of width 0.
 * `range` passes min and max when the caller has them already (one pass fewer).
 */
export function histogramBins(
  values: Float64Array,
  binCount: number = DEFAULT_BIN_COUNT,
  range?: { min: number; max: number },
): HistogramBins {
  if (!(Number.isInteger(binCount) && binCount >= 1)) throw new RangeError(`bin count must be a whole number ≥ 1 (got ${binCount})`);
  const M = values.length;
  if (M === 0) return { start: 0, width: 0, counts: [] };
  let min = Infinity;
  let max = -Infinity;
  if (range) ({ min, max } = range);
  else {
    for (let r = 0; r < M; r++) {
      const y = values[r];
      if (y < min) min = y;
      if (y > max) max = y;
    }
  }
  if (!(max > min)) return { start: min, width: 0, counts: [M] };
  const width = (max - min) / binCount;
  const perUnit = binCount / (max - min);
  // (y − min)·perUnit ≥ 0, so truncation is the floor; it reaches binCount at the maximum
  // (or just below it, by rounding), so one extra slot is counted and folded into the last bin.
  const counts = new Int32Array(binCount + 1);
  for (let r = 0; r < M; r++) counts[((values[r] - min) * perUnit) | 0]++;
  counts[binCount - 1] += counts[binCount];
  return { start: min, width, counts: Array.from(counts.subarray(0, binCount)) };
}
