import { scratchFloat64 } from './scratch-buffers';
import { sortFloat64 } from './sort-float64';
import { bucketCountFor, countInBuckets, type ValueBuckets } from './value-buckets';
import { valueRange } from './value-range';

/*
 * Coverage intervals from M model values (JCGM 101:2008 7.7). Only the order
 * statistics y_(1..M−q) and y_(q+1..M) are needed, so instead of sorting all
 * M values the two tails are found and only they are sorted. Usually one
 * counting pass over fine buckets finds the tails and a second, branch-free
 * pass copies them out; `values` is then left as it is. When the values are
 * too concentrated for the buckets, `values` is partitioned by quickselect
 * instead, which REORDERS it IN PLACE (the multiset of values is unchanged,
 * so mean, u and histogram are not affected).
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
    throw new RangeError(`${M} trials are too few for a ${p * 100} % coverage interval: need M > q = ${q}; use at least ${Math.ceil(1 / (1 - p))} trials`);
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

/** The lowest and highest order statistics: y_(k) = low[k − 1] for k ≤ low.length, y_(k) = high[k − 1 − (M − high.length)] for k > M − high.length. */
interface Tails {
  low: Float64Array;
  high: Float64Array;
  M: number;
}

/** y_(k), 1-based, for k in one of the two tails. */
function orderStatistic(t: Tails, k: number): number {
  return k <= t.low.length ? t.low[k - 1] : t.high[k - 1 - (t.M - t.high.length)];
}

/**
 * The lowest and highest `tail` (or a few more) values, each sorted, from the
 * counts of the values in about 4096 equal buckets between min and max
 * (counted here unless `buckets` brings them); null when a tail's buckets hold
 * far more than `tail` values (a very concentrated distribution). `values` is
 * not changed.
 */
function tailsByBuckets(values: Float64Array, tail: number, range?: { min: number; max: number }, buckets?: ValueBuckets | null): Tails | null {
  const M = values.length;
  if (!buckets) {
    const { min, max } = range ?? valueRange(values);
    buckets = countInBuckets(values, bucketCountFor(1), min, max);
    if (!buckets) return null;
  }
  const { counts, bucketCount: BUCKETS, min, max } = buckets;
  const scale = BUCKETS / (max - min);
  let lowBucket = 0;
  let lowCount = counts[0];
  while (lowCount < tail) lowCount += counts[++lowBucket];
  let highBucket = BUCKETS;
  let highCount = counts[BUCKETS];
  while (highCount < tail) highCount += counts[--highBucket];
  const limit = 2 * tail + (M >> 6);
  if (lowCount > limit || highCount > limit || lowBucket >= highBucket) return null;
  const low = scratchFloat64('tail:low', lowCount);
  const high = scratchFloat64('tail:high', highCount);
  // x < lowBucket + 1 and x ≥ highBucket are the bucket tests of the count (⌊x⌋ ≤ lowBucket, ⌊x⌋ ≥ highBucket for x ≥ 0),
  // so exactly lowCount and highCount values are copied. Nine values in ten go to neither tail: a branch that is
  // mostly predicted costs half as much as writing every value to both buffers.
  const lowEdge = lowBucket + 1;
  let nLow = 0;
  let nHigh = 0;
  for (let r = 0; r < M; r++) {
    const y = values[r];
    const x = (y - min) * scale;
    if (x < lowEdge) low[nLow++] = y;
    else if (x >= highBucket) high[nHigh++] = y;
  }
  // Counted elsewhere (a caller's buckets) yet not these values: leave it to selection.
  if (nLow !== lowCount || nHigh !== highCount) return null;
  const lowTail = low.subarray(0, lowCount);
  const highTail = high.subarray(0, highCount);
  sortFloat64(lowTail);
  sortFloat64(highTail);
  return { low: lowTail, high: highTail, M };
}

/**
 * The lowest and highest `tail` values by quickselect: they end up at the two
 * ends of `values`, each sorted; the middle is left partitioned but unsorted.
 */
function tailsBySelection(values: Float64Array, tail: number): Tails {
  const M = values.length;
  quickselect(values, tail - 1, 0, M - 1);
  quickselect(values, M - tail, tail, M - 1);
  const low = values.subarray(0, tail);
  const high = values.subarray(M - tail, M);
  sortFloat64(low);
  sortFloat64(high);
  return { low, high, M };
}

/** Both tails of M − q values each (the whole array sorted when they overlap). */
function tailsOf(values: Float64Array, q: number, range?: { min: number; max: number }, buckets?: ValueBuckets | null): Tails {
  const M = values.length;
  const tail = M - q;
  if (2 * tail >= M) {
    sortFloat64(values);
    return { low: values, high: values, M };
  }
  return tailsByBuckets(values, tail, range, buckets) ?? tailsBySelection(values, tail);
}

/** r* in 1..M−q minimising y_(r+q) − y_(r) (JCGM 101:2008 7.7.3); the first such r on ties. */
function shortestFromTails(t: Tails, q: number): [number, number] {
  let best = 1;
  let bestLength = Infinity;
  for (let r = 1; r <= t.M - q; r++) {
    const length = orderStatistic(t, r + q) - orderStatistic(t, r);
    if (length < bestLength) {
      bestLength = length;
      best = r;
    }
  }
  return [orderStatistic(t, best), orderStatistic(t, best + q)];
}

function symmetricFromTails(t: Tails, q: number): [number, number] {
  const r = symmetricRank(t.M, q);
  return [orderStatistic(t, r), orderStatistic(t, r + q)];
}

/**
 * Numerical standard uncertainty of the order statistic y_(k) as an estimate
 * of the α = k/M quantile η_α of the output, without assuming its shape: the
 * number of the M values below η_α is binomial, mean Mα and standard deviation
 * s = √(Mα(1 − α)), so η_α lies between y_(k−s) and y_(k+s) with about 68 %
 * probability, and u(y_(k)) ≈ (y_(k+s) − y_(k−s))/2. This is the distribution-free
 * form of √(α(1 − α)/M)/g(η_α), g the output density (asymptotic normality of
 * sample quantiles). Ranks are kept within the M − q values of the tail that
 * holds y_(k); the half-width is then scaled to s ranks.
 */
function orderStatisticUncertainty(t: Tails, q: number, k: number): number {
  const { M } = t;
  const alpha = k / M;
  const s = Math.max(1, Math.ceil(Math.sqrt(M * alpha * (1 - alpha))));
  // Both tails hold at least their M − q values, whichever way they were found.
  const [first, last] = k <= M - q ? [1, M - q] : [q + 1, M];
  const below = Math.max(first, k - s);
  const above = Math.min(last, k + s);
  if (above === below) return 0;
  return ((orderStatistic(t, above) - orderStatistic(t, below)) * s) / (above - below);
}

function symmetricUncertaintyFromTails(t: Tails, q: number): [number, number] {
  const r = symmetricRank(t.M, q);
  return [orderStatisticUncertainty(t, q, r), orderStatisticUncertainty(t, q, r + q)];
}

/**
 * Both coverage intervals for coverage probability p from M model values
 * (JCGM 101:2008 7.7): with y_(1) ≤ … ≤ y_(M), the interval is [y_(r), y_(r+q)];
 * symmetric: r = (M − q)/2 or (M − q + 1)/2 (7.7.2); shortest: the r* that
 * minimises y_(r+q) − y_(r) (7.7.3). `symmetricUncertainty` gives the numerical
 * standard uncertainties of the symmetric endpoints (see orderStatisticUncertainty).
 * May reorder `values` in place.
 * `range` passes min and max when the caller has them already, `buckets` the
 * counts of the values when the caller has counted them (see value-buckets).
 * Cost: two or three passes over the M values plus sorting 2·(M − q) values.
 */
export function coverageIntervals(
  values: Float64Array,
  p: number,
  range?: { min: number; max: number },
  buckets?: ValueBuckets | null,
): { symmetric: [number, number]; shortest: [number, number]; symmetricUncertainty: [number, number] } {
  const q = checkArguments(values.length, p);
  const tails = tailsOf(values, q, range, buckets);
  return {
    symmetric: symmetricFromTails(tails, q),
    shortest: shortestFromTails(tails, q),
    symmetricUncertainty: symmetricUncertaintyFromTails(tails, q),
  };
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

/** Shortest 100p % coverage interval (JCGM 101:2008 7.7.3). May reorder `values` in place. */
export function shortestInterval(values: Float64Array, p: number): [number, number] {
  const q = checkArguments(values.length, p);
  return shortestFromTails(tailsOf(values, q), q);
}
