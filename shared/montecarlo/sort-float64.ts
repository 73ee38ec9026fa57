import { scratchFloat64, scratchInt32, scratchUint32 } from './scratch-buffers';

/*
 * Ascending sort of doubles without comparison sorting, whose mispredicted
 * branches make it several times slower on random model values: a bucket
 * sort over n equal buckets between min and max (model values have smooth
 * densities, so buckets hold a few values each), and, when some bucket is
 * crowded, a least-significant-digit radix sort on the 64-bit patterns.
 */

const LITTLE_ENDIAN = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;
/** Below this length the built-in sort is as fast and needs no buffers. */
const SMALL = 1024;
/** Six digits of 11, 11 and 10 bits over the low word, then the high word. */
const PASSES: readonly (readonly [word: 0 | 1, shift: number, bits: number])[] = [
  [0, 0, 11],
  [0, 11, 11],
  [0, 22, 10],
  [1, 0, 11],
  [1, 11, 11],
  [1, 22, 10],
];

/** A bucket may hold this many values before the bucket sort gives way to the radix sort (insertion sort is quadratic). */
const CROWDED = 48;

/**
 * Sorts `values` ascending in place, the order of Float64Array.prototype.sort
 * for finite values (NaN is not expected). Bucket b = ⌊(y − min)·n/(max − min)⌋
 * of n buckets; values are counted, scattered in bucket order into a buffer,
 * and each bucket is finished by insertion sort. Falls back to
 * radixSortFloat64 when a bucket holds more than 48 values. Cost: O(n) time for
 * smooth densities, 12·n bytes of buffers (kept from call to call, see scratch-buffers).
 */
export function sortFloat64(values: Float64Array): void {
  const n = values.length;
  if (n < SMALL) {
    values.sort();
    return;
  }
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n; i++) {
    const y = values[i];
    if (y < min) min = y;
    if (y > max) max = y;
  }
  const scale = n / (max - min);
  if (!(scale > 0 && scale < Infinity)) {
    radixSortFloat64(values);
    return;
  }
  // (y − min)·scale may reach n at the maximum: one extra bucket.
  const starts = scratchInt32('sort:starts', n + 2).fill(0);
  for (let i = 0; i < n; i++) starts[(((values[i] - min) * scale) | 0) + 1]++;
  let crowded = 0;
  for (let b = 1; b <= n + 1; b++) {
    if (starts[b] > crowded) crowded = starts[b];
    starts[b] += starts[b - 1];
  }
  if (crowded > CROWDED) {
    radixSortFloat64(values);
    return;
  }
  const sorted = scratchFloat64('sort:sorted', n);
  const next = scratchInt32('sort:next', n + 1);
  next.set(starts.subarray(0, n + 1));
  for (let i = 0; i < n; i++) {
    const y = values[i];
    sorted[next[((y - min) * scale) | 0]++] = y;
  }
  for (let b = 0; b <= n; b++) {
    const end = starts[b + 1];
    for (let i = starts[b] + 1; i < end; i++) {
      const y = sorted[i];
      let j = i - 1;
      while (j >= starts[b] && sorted[j] > y) {
        sorted[j + 1] = sorted[j];
        j--;
      }
      sorted[j + 1] = y;
    }
  }
  values.set(sorted);
}

/**
 * Sorts `values` ascending in place by LSD radix sort (the order of
 * Float64Array.prototype.sort for finite values; NaN is not expected). Each double becomes an unsigned
 * 64-bit key that orders like the number: a positive value gets its sign bit
 * set, a negative value has all bits inverted. Passes whose digit is the same
 * for every key (e.g. sign and exponent of values in a narrow range) are skipped.
 * Cost: O(n) time, 16·n bytes of buffers (kept from call to call).
 */
export function radixSortFloat64(values: Float64Array): void {
  const n = values.length;
  if (n < SMALL) {
    values.sort();
    return;
  }
  const words = new Uint32Array(values.buffer, values.byteOffset, 2 * n);
  const L = LITTLE_ENDIAN ? 0 : 1;
  const H = 1 - L;
  let hi = scratchUint32('radix:hi', n);
  let lo = scratchUint32('radix:lo', n);
  let hiNext = scratchUint32('radix:hi-next', n);
  let loNext = scratchUint32('radix:lo-next', n);
  for (let i = 0; i < n; i++) {
    const h = words[2 * i + H];
    const negative = h >> 31; // −1 for a negative value, else 0
    hi[i] = h ^ (negative | 0x80000000);
    lo[i] = words[2 * i + L] ^ negative;
  }
  const counts = new Int32Array(1 << 11);
  for (const [word, shift, bits] of PASSES) {
    const mask = (1 << bits) - 1;
    const keys = word === 0 ? lo : hi;
    counts.fill(0);
    for (let i = 0; i < n; i++) counts[(keys[i] >>> shift) & mask]++;
    if (counts[(keys[0] >>> shift) & mask] === n) continue;
    let sum = 0;
    for (let d = 0; d <= mask; d++) {
      const c = counts[d];
      counts[d] = sum;
      sum += c;
    }
    for (let i = 0; i < n; i++) {
      const at = counts[(keys[i] >>> shift) & mask]++;
      hiNext[at] = hi[i];
      loNext[at] = lo[i];
    }
    [hi, hiNext] = [hiNext, hi];
    [lo, loNext] = [loNext, lo];
  }
  for (let i = 0; i < n; i++) {
    const h = hi[i];
    const positive = h >> 31; // −1 when the key's top bit is set (a positive value)
    words[2 * i + H] = h ^ (~positive | 0x80000000);
    words[2 * i + L] = lo[i] ^ ~positive;
  }
}
