/*
 * Coverage intervals from M model values (JCGM 101:2008 7.7). Only the order
 * statistics y_(r), y_(r+q) are needed, so instead of sorting all M values the
 * array is partitioned by quickselect and only the two tails of M − q values
 * each are sorted. The functions REORDER `values` IN PLACE (the multiset of
 * values is unchanged, so mean, u and histogram are not affected).
 */

/**
 * Number of values inside the interval: q = pM if that is an integer, else
 * ⌊pM + ½⌋ (JCGM 101:2008 7.7.1). pM counts as an integer when it is within
 * rounding error of one (0.95·10⁶ is not exact in binary).
 */
export function coverageCount(M: number, p: number): number {
  const pM = p * M;
  const nearest = Math.round(pM);
  if (Math.abs(pM - nearest) <= 1e-9 * Math.max(1, M)) return nearest;
  return Math.floor(pM + 0.5);
}

/** 1-based r of the probabilistically symmetric interval: (M − q)/2 if an integer, else (M − q + 1)/2 (JCGM 101:2008 7.7.2). */
function symmetricRank(M: number, q: number): number {
  return (M - q) % 2 === 0 ? (M - q) / 2 : (M - q + 1) / 2;
}

function checkArguments(M: number, p: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`coverage probability must lie strictly between 0 and 1 (got ${p})`);
  const q = coverageCount(M, p);
  if (q < 1 || q >= M) {
    throw new RangeError(
      `${M} trials are too few for a ${p * 100} % coverage interval: need M > q = ${q}; use at least ${Math.ceil(1 / (1 - p))} trials`,
    );
  }
  return q;
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
}

/**
 * Rearranges a[lo..hi] so that a[k] is the value of 0-based rank k within that
 * range, every a[lo..k) ≤ a[k] and every a(k..hi] ≥ a[k]. Hoare partition with a
 * median-of-three pivot; equal values split evenly, so ties cost nothing extra.
 */
export function quickselect(a: Float64Array, k: number, lo = 0, hi = a.length - 1): void {
  while (hi > lo) {
    if (hi - lo < 16) {
      // Insertion sort finishes small ranges.
      for (let i = lo + 1; i <= hi; i++) {
        const v = a[i];
        let j = i - 1;
        while (j >= lo && a[j] > v) {
          a[j + 1] = a[j];
          j--;
        }
        a[j + 1] = v;
      }
      return;
    }
    const mid = lo + ((hi - lo) >> 1);
    if (a[mid] < a[lo]) swap(a, mid, lo);
    if (a[hi] < a[lo]) swap(a, hi, lo);
    if (a[hi] < a[mid]) swap(a, hi, mid);
    const pivot = a[mid];
    let i = lo - 1;
    let j = hi + 1;
    for (;;) {
      do i++;
      while (a[i] < pivot);
      do j--;
      while (a[j] > pivot);
      if (i >= j) break;
      swap(a, i, j);
    }
    // Now a[lo..j] ≤ pivot ≤ a[j+1..hi].
    if (k <= j) hi = j;
    else lo = j + 1;
  }
}

/**
 * Puts the lowest `tail` and highest `tail` values of `values` at its two ends,
 * each sorted ascending; the middle is left partitioned but unsorted.
 */
function sortTails(values: Float64Array, tail: number): void {
  const M = values.length;
  if (2 * tail >= M) {
    values.sort();
    return;
  }
  quickselect(values, tail - 1, 0, M - 1);
  quickselect(values, M - tail, tail, M - 1);
  values.subarray(0, tail).sort();
  values.subarray(M - tail, M).sort();
}

/** r* in 1..M−q minimising y_(r+q) − y_(r), with the tails sorted (JCGM 101:2008 7.7.3). */
function shortestFromSortedTails(values: Float64Array, q: number): [number, number] {
  const M = values.length;
  let best = 0;
  let bestLength = Infinity;
  for (let r = 0; r < M - q; r++) {
    const length = values[r + q] - values[r];
    if (length < bestLength) {
      bestLength = length;
      best = r;
    }
  }
  return [values[best], values[best + q]];
}

function symmetricFromSortedTails(values: Float64Array, q: number): [number, number] {
  const r = symmetricRank(values.length, q);
  return [values[r - 1], values[r - 1 + q]];
}

/**
 * Both coverage intervals for coverage probability p from M model values
 * (JCGM 101:2008 7.7): with y_(1) ≤ … ≤ y_(M), the interval is [y_(r), y_(r+q)];
 * symmetric: r = (M − q)/2 or (M − q + 1)/2 (7.7.2); shortest: the r* that
 * minimises y_(r+q) − y_(r) (7.7.3). Reorders `values` in place.
 * Cost: two quickselects plus sorting 2·(M − q) values.
 */
export function coverageIntervals(values: Float64Array, p: number): { symmetric: [number, number]; shortest: [number, number] } {
  const q = checkArguments(values.length, p);
  sortTails(values, values.length - q);
  return { symmetric: symmetricFromSortedTails(values, q), shortest: shortestFromSortedTails(values, q) };
}

/** Probabilistically symmetric 100p % coverage interval (JCGM 101:2008 7.7.2). Reorders `values` in place. */
export function probabilisticallySymmetricInterval(values: Float64Array, p: number): [number, number] {
  const M = values.length;
  const q = checkArguments(M, p);
  const r = symmetricRank(M, q);
  // Two order statistics only: select rank r − 1, then rank r − 1 + q in the part above it.
  quickselect(values, r - 1, 0, M - 1);
  quickselect(values, r - 1 + q, r, M - 1);
  return [values[r - 1], values[r - 1 + q]];
}

/** Shortest 100p % coverage interval (JCGM 101:2008 7.7.3). Reorders `values` in place. */
export function shortestInterval(values: Float64Array, p: number): [number, number] {
  const q = checkArguments(values.length, p);
  sortTails(values, values.length - q);
  return shortestFromSortedTails(values, q);
}
