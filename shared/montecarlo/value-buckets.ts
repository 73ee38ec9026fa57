/**
 * Counts of M model values in equal buckets between their minimum and
 * maximum: one pass that both the histogram (JCGM 101:2008 7.5, a display of
 * the distribution function) and the coverage-interval search (7.7) read, so
 * the values are counted once.
 */
export interface ValueBuckets {
  /** counts[k] = number of values with ⌊(y − min)·bucketCount/(max − min)⌋ = k; the last slot holds the values that reach bucketCount (the maximum). */
  counts: Int32Array;
  /** Number of buckets (counts has one slot more). */
  bucketCount: number;
  min: number;
  max: number;
}

/** Fewest buckets for the interval search; the count is rounded up to a multiple of the histogram's bins. */
const MIN_BUCKETS = 4096;

/** Buckets for `binCount` histogram bins: binCount·⌈4096/binCount⌉, so that each bin is a whole number of buckets. */
export function bucketCountFor(binCount: number): number {
  return binCount * Math.ceil(MIN_BUCKETS / binCount);
}

/**
 * Counts values in bucketCount equal buckets over [min, max] (max > min):
 * bucket k = ⌊(y − min)·bucketCount/(max − min)⌋. Null when that scale is not
 * a finite positive number (all values equal, or a range that overflows).
 */
export function countInBuckets(values: Float64Array, bucketCount: number, min: number, max: number): ValueBuckets | null {
  const scale = bucketCount / (max - min);
  if (!(scale > 0 && scale < Infinity)) return null;
  // (y − min)·scale ≤ bucketCount after rounding, hence one extra slot.
  const counts = new Int32Array(bucketCount + 1);
  const M = values.length;
  let r = 0;
  for (const first4 = M & 3; r < first4; r++) counts[((values[r] - min) * scale) | 0]++;
  // Four values a step: about twice as fast as one, the loop's own checks shared by four counts.
  for (; r < M; r += 4) {
    counts[((values[r] - min) * scale) | 0]++;
    counts[((values[r + 1] - min) * scale) | 0]++;
    counts[((values[r + 2] - min) * scale) | 0]++;
    counts[((values[r + 3] - min) * scale) | 0]++;
  }
  return { counts, bucketCount, min, max };
}
