import { describe, expect, it } from 'vitest';
import { radixSortFloat64, sortFloat64 } from '../../shared/montecarlo/sort-float64';
import { coverageIntervals } from '../../shared/montecarlo/coverage-interval';
import { UniformGenerator } from '../../shared/random/uniform-generator';
import { fillStandardNormal } from '../../shared/random/ziggurat-normal';

function normals(seed: string, n: number): Float64Array {
  const z = new Float64Array(n);
  fillStandardNormal(new UniformGenerator(seed), z, n);
  return z;
}

/** The definition of the order statistics y_(1) ≤ … ≤ y_(M) (JCGM 101:2008 7.7.1) by the built-in sort. */
function byBuiltInSort(values: Float64Array): number[] {
  return Array.from(Float64Array.from(values).sort());
}

const crowded = normals('rs-crowd', 20_000);
crowded[7] = 1e9; // one far value crowds the rest into the first buckets: the radix path

describe.each([
  ['sortFloat64', sortFloat64],
  ['radixSortFloat64', radixSortFloat64],
])('%s', (_name, sort) => {
  it.each([
    ['normal values', normals('rs-n', 50_000)],
    ['positive values with a large offset', normals('rs-off', 20_000).map((z) => 1e5 + 0.05 * z)],
    ['negative values only', normals('rs-neg', 5_000).map((z) => -1 - Math.abs(z))],
    ['values spanning many binades', normals('rs-exp', 30_000).map((z) => Math.exp(20 * z) * Math.sign(z))],
    ['ties on a coarse grid', normals('rs-ties', 10_000).map((z) => Math.round(z * 4) / 4)],
    ['values already sorted', Float64Array.from(byBuiltInSort(normals('rs-sorted', 4_000)))],
    ['a short array (built-in path)', normals('rs-short', 100)],
    ['values crowded by one far value', crowded],
    ['all values equal', new Float64Array(3000).fill(2.5)],
  ])('orders %s exactly as the built-in sort', (_label, x) => {
    const expected = byBuiltInSort(x);
    const y = Float64Array.from(x);
    sort(y);
    expect(Array.from(y)).toEqual(expected);
  });

  it('sorts a subarray view in place and leaves the rest alone', () => {
    const x = normals('rs-view', 6_000);
    const head = Array.from(x.subarray(0, 1000));
    const expected = byBuiltInSort(x.subarray(1000, 5000));
    sort(x.subarray(1000, 5000));
    expect(Array.from(x.subarray(1000, 5000))).toEqual(expected);
    expect(Array.from(x.subarray(0, 1000))).toEqual(head);
  });
});

describe('coverage intervals at large M: same order statistics as a full sort (JCGM 101:2008 7.7)', () => {
  function byFullSort(values: Float64Array, p: number) {
    const s = byBuiltInSort(values);
    const M = s.length;
    const q = Math.round(p * M); // pM is an integer here (7.7.1)
    const r = (M - q) % 2 === 0 ? (M - q) / 2 : (M - q + 1) / 2; // 7.7.2
    let best = 0;
    for (let k = 1; k < M - q; k++) if (s[k + q] - s[k] < s[best + q] - s[best]) best = k; // 7.7.3
    return { symmetric: [s[r - 1], s[r - 1 + q]], shortest: [s[best], s[best + q]] };
  }

  it('skewed values, 2·10⁵ (bucket path)', () => {
    const y = normals('ci-skew', 200_000).map((z) => Math.exp(0.5 * z));
    for (const p of [0.9, 0.95, 0.99]) expect(coverageIntervals(Float64Array.from(y), p)).toMatchObject(byFullSort(y, p));
  });

  it('a far outlier that crowds all values into one bucket (quickselect path)', () => {
    const y = normals('ci-outlier', 100_000);
    y[123] = 1e12;
    expect(coverageIntervals(Float64Array.from(y), 0.95)).toMatchObject(byFullSort(y, 0.95));
  });

  it('leaves the values in trial order on the bucket path', () => {
    const y = normals('ci-order', 50_000);
    const copy = Float64Array.from(y);
    coverageIntervals(copy, 0.95);
    expect(copy).toEqual(y);
  });
});
