import type { HistogramBins } from '../budget/result';
import type { ValueBuckets } from './value-buckets';
import { valueRange } from './value-range';

/** Default number of bins for the Monte Carlo histogram (common practice for 10⁵–10⁷ values). */
export const DEFAULT_BIN_COUNT = 100;

/**
 * Equal-width histogram of the model values from their minimum to their
 * maximum (a display of the distribution function of JCGM 101:2008 7.5).
 * Bin b holds start + b·width ≤ y < start + (b + 1)·width; the maximum goes in
 * the last bin. When all values are equal there is one bin of width 0.
 * `range` passes min and max when the caller has them already (one pass fewer).
 */
export function histogramBins(values: Float64Array, binCount: number = DEFAULT_BIN_COUNT, range?: { min: number; max: number }): HistogramBins {
  if (!(Number.isInteger(binCount) && binCount >= 1)) throw new RangeError(`bin count must be a whole number ≥ 1 (got ${binCount})`);
  const M = values.length;
  if (M === 0) return { start: 0, width: 0, counts: [] };
  const { min, max } = range ?? valueRange(values);
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

/**
 * The same histogram from bucket counts (see value-buckets) whose bucket count
 * is a multiple of binCount: bin b sums buckets b·k … (b + 1)·k − 1, k =
 * bucketCount/binCount, and the maximum's slot goes to the last bin. No pass
 * over the values.
 */
export function histogramFromBuckets(buckets: ValueBuckets, binCount: number = DEFAULT_BIN_COUNT): HistogramBins {
  const { counts, bucketCount, min, max } = buckets;
  if (!(Number.isInteger(binCount) && binCount >= 1 && bucketCount % binCount === 0)) {
    throw new RangeError(`bin count must be a whole number ≥ 1 that divides ${bucketCount} (got ${binCount})`);
  }
  const k = bucketCount / binCount;
  const bins = new Array<number>(binCount).fill(0);
  for (let j = 0; j < bucketCount; j++) bins[(j / k) | 0] += counts[j];
  bins[binCount - 1] += counts[bucketCount];
  return { start: min, width: (max - min) / binCount, counts: bins };
}
