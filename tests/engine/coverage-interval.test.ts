import { describe, expect, it } from 'vitest';
import { coverageCount, coverageIntervals, probabilisticallySymmetricInterval, quickselect, shortestInterval } from '../../shared/montecarlo/coverage-interval';
import { histogramBins, histogramFromBuckets } from '../../shared/montecarlo/histogram';
import { bucketCountFor, countInBuckets } from '../../shared/montecarlo/value-buckets';
import { meanAndStandardDeviation } from '../../shared/montecarlo/summary';
import { UniformGenerator } from '../../shared/random/uniform-generator';
import { fillStandardNormal } from '../../shared/random/ziggurat-normal';

/**
 * Reference by full sort, straight from the wording of JCGM 101:2008 7.7.1–7.7.3 (1-based ranks),
 * and the endpoints' numerical uncertainty: (y_(k+s) − y_(k−s))/2 with s = ⌈√(Mα(1 − α))⌉,
 * α = k/M, the binomial spread of the rank of the α-quantile (ranks kept within each tail's M − q values).
 */
function byFullSort(values: Float64Array, p: number): { symmetric: [number, number]; shortest: [number, number]; symmetricUncertainty: [number, number] } {
  const y = Float64Array.from(values).sort();
  const M = y.length;
  const pM = p * M;
  const q = Math.abs(pM - Math.round(pM)) < 1e-9 ? Math.round(pM) : Math.floor(pM + 0.5);
  const r = Number.isInteger((M - q) / 2) ? (M - q) / 2 : (M - q + 1) / 2;
  let best = 1;
  for (let s = 1; s <= M - q; s++) if (y[s + q - 1] - y[s - 1] < y[best + q - 1] - y[best - 1]) best = s;
  const spread = (k: number, first: number, last: number) => {
    const s = Math.max(1, Math.ceil(Math.sqrt(k * (1 - k / M))));
    const lo = Math.max(first, k - s);
    const hi = Math.min(last, k + s);
    return hi === lo ? 0 : ((y[hi - 1] - y[lo - 1]) * s) / (hi - lo);
  };
  return {
    symmetric: [y[r - 1], y[r + q - 1]],
    shortest: [y[best - 1], y[best + q - 1]],
    symmetricUncertainty: [spread(r, 1, M - q), spread(r + q, q + 1, M)],
  };
}

function uniforms(seed: string, n: number): Float64Array {
  const x = new Float64Array(n);
  new UniformGenerator(seed).fill(x);
  return x;
}

describe('coverageCount (JCGM 101:2008 7.7.1)', () => {
  it('q = pM when integer, else ⌊pM + ½⌋', () => {
    expect(coverageCount(1_000_000, 0.95)).toBe(950_000);
    expect(coverageCount(10_000, 0.9545)).toBe(9545);
    expect(coverageCount(1001, 0.95)).toBe(951); // 950.95 → 951
    expect(coverageCount(1010, 0.95)).toBe(960); // 959.5 → 960
  });

  it('refuses too few trials for the coverage probability', () => {
    expect(() => coverageIntervals(uniforms('few', 10), 0.95)).toThrow(/too few/);
    expect(() => coverageIntervals(uniforms('few', 10), 1)).toThrow(RangeError);
  });
});

describe('quickselect', () => {
  it('places the k-th order statistic and partitions around it, also with many ties', () => {
    const g = new UniformGenerator('qs');
    for (const n of [1, 2, 17, 100, 1000]) {
      for (const ties of [false, true]) {
        const x = new Float64Array(n);
        g.fill(x);
        if (ties) for (let i = 0; i < n; i++) x[i] = Math.floor(x[i] * 4);
        const sorted = Float64Array.from(x).sort();
        for (const k of [0, n >> 1, n - 1]) {
          const y = Float64Array.from(x);
          quickselect(y, k);
          expect(y[k]).toBe(sorted[k]);
          for (let i = 0; i < k; i++) expect(y[i]).toBeLessThanOrEqual(y[k]);
          for (let i = k + 1; i < n; i++) expect(y[i]).toBeGreaterThanOrEqual(y[k]);
        }
      }
    }
  });
});

describe('coverage intervals against a full sort: exactly the same order statistics', () => {
  const cases: [string, number, number][] = [];
  for (const M of [1000, 2001, 4096, 5000]) for (const p of [0.3, 0.5, 0.6827, 0.9, 0.95, 0.99]) cases.push([`M=${M} p=${p}`, M, p]);
  it.each(cases)('%s', (_label, M, p) => {
    const z = new Float64Array(M);
    fillStandardNormal(new UniformGenerator(`cmp-${M}-${p}`), z, M);
    // A skewed model value so that the shortest and symmetric intervals differ.
    for (let i = 0; i < M; i++) z[i] = Math.exp(z[i]);
    const reference = byFullSort(z, p);
    expect(coverageIntervals(Float64Array.from(z), p)).toEqual(reference);
    expect(probabilisticallySymmetricInterval(Float64Array.from(z), p)).toEqual(reference.symmetric);
    expect(shortestInterval(Float64Array.from(z), p)).toEqual(reference.shortest);
  });

  it('with ties (values rounded to a coarse grid)', () => {
    const x = uniforms('ties', 3000).map((v) => Math.round(v * 20) / 20);
    for (const p of [0.5, 0.95]) expect(coverageIntervals(Float64Array.from(x), p)).toEqual(byFullSort(x, p));
  });

  it('keeps the multiset of values (reorders only)', () => {
    const x = uniforms('keep', 4000);
    const y = Float64Array.from(x);
    coverageIntervals(y, 0.95);
    expect(Array.from(y.sort())).toEqual(Array.from(Float64Array.from(x).sort()));
  });
});

describe('known answers', () => {
  it('U(0, 1) at 10⁶ values: symmetric 95 % interval ≈ [0.025, 0.975], shortest of length ≈ 0.95', () => {
    // Quantile standard error √(P(1 − P)/M)/f with f = 1 (common practice): 1.6e-4; tolerance 5σ.
    const M = 1_000_000;
    const { symmetric, shortest } = coverageIntervals(uniforms('u01', M), 0.95);
    const tol = 5 * Math.sqrt((0.025 * 0.975) / M);
    expect(Math.abs(symmetric[0] - 0.025)).toBeLessThan(tol);
    expect(Math.abs(symmetric[1] - 0.975)).toBeLessThan(tol);
    expect(Math.abs(shortest[1] - shortest[0] - 0.95)).toBeLessThan(tol);
  });

  it('N(0, 1) at 10⁶ values: 95 % intervals ≈ ±1.959964 (normal quantile, handbook value)', () => {
    const M = 1_000_000;
    const z = new Float64Array(M);
    fillStandardNormal(new UniformGenerator('n01'), z, M);
    const { symmetric, shortest } = coverageIntervals(z, 0.95);
    // SE of the 2.5 % quantile: √(0.025·0.975/M)/φ(1.96) ≈ 0.0027.
    const tol = (5 * Math.sqrt((0.025 * 0.975) / M)) / 0.05845;
    expect(Math.abs(symmetric[0] + 1.959964)).toBeLessThan(tol);
    expect(Math.abs(symmetric[1] - 1.959964)).toBeLessThan(tol);
    // The shortest interval is never longer than the symmetric one (JCGM 101:2008 7.7.3); for a
    // symmetric density its length is well determined but its position wanders along the flat optimum.
    expect(shortest[1] - shortest[0]).toBeLessThanOrEqual(symmetric[1] - symmetric[0]);
    expect(Math.abs(shortest[1] - shortest[0] - 2 * 1.959964)).toBeLessThan(tol);
    expect(Math.abs(shortest[0] + 1.959964)).toBeLessThan(0.1);
  });
});

describe('summary (JCGM 101:2008 7.6) and histogram', () => {
  it('mean and standard deviation with M − 1, under a large offset', () => {
    const { mean, standardDeviation } = meanAndStandardDeviation(Float64Array.from([1e9 + 1, 1e9 + 2, 1e9 + 3, 1e9 + 4]));
    expect(mean).toBe(1e9 + 2.5);
    expect(standardDeviation).toBeCloseTo(Math.sqrt(5 / 3), 9);
  });

  it('histogram: equal widths from min to max, every value counted once', () => {
    const x = Float64Array.from([0, 0.1, 0.25, 0.5, 0.99, 1]);
    const h = histogramBins(x, 4);
    expect(h).toEqual({ start: 0, width: 0.25, counts: [2, 1, 1, 2] });
    const big = histogramBins(uniforms('h', 100_000));
    expect(big.counts).toHaveLength(100);
    expect(big.counts.reduce((a, b) => a + b, 0)).toBe(100_000);
    expect(histogramBins(Float64Array.from([3, 3, 3]))).toEqual({ start: 3, width: 0, counts: [3] });
  });

  it('histogram from the shared bucket counts equals the histogram of the values (JCGM 101:2008 7.5)', () => {
    const x = uniforms('hb', 100_000);
    const { min, max } = meanAndStandardDeviation(x);
    for (const bins of [1, 7, 100, 5000]) {
      const buckets = countInBuckets(x, bucketCountFor(bins), min, max)!;
      expect(buckets.bucketCount % bins).toBe(0);
      expect(buckets.bucketCount).toBeGreaterThanOrEqual(4096);
      expect(histogramFromBuckets(buckets, bins)).toEqual(histogramBins(x, bins, { min, max }));
    }
    expect(countInBuckets(Float64Array.from([3, 3]), 4096, 3, 3)).toBeNull();
  });

  it('intervals from the shared bucket counts equal those found alone (JCGM 101:2008 7.7)', () => {
    const x = uniforms('ib', 100_000);
    const { min, max } = meanAndStandardDeviation(x);
    const alone = coverageIntervals(Float64Array.from(x), 0.95);
    expect(coverageIntervals(Float64Array.from(x), 0.95, { min, max }, countInBuckets(x, bucketCountFor(100), min, max))).toEqual(alone);
  });
});
