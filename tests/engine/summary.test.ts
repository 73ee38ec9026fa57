import { describe, expect, it } from 'vitest';
import { compileModel } from '../../shared/model/compile-model';
import { blockSums, MomentAccumulator, meanAndStandardDeviation } from '../../shared/montecarlo/summary';
import { UniformGenerator } from '../../shared/random/uniform-generator';

describe('meanAndStandardDeviation (JCGM 101:2008 7.6, eqs. 12–13)', () => {
  it.each([1, 2, 3, 4, 5, 7, 8, 9, 1001])('agrees with the textbook two-pass formulas and gives min and max, M = %i', (M) => {
    const y = new Float64Array(M);
    new UniformGenerator(`sum-${M}`).fill(y, M, 100, 0.5);
    let mean = 0;
    for (const v of y) mean += v / M;
    let ss = 0;
    for (const v of y) ss += (v - mean) ** 2;
    const s = meanAndStandardDeviation(y);
    expect(s.mean).toBeCloseTo(mean, 12);
    expect(s.standardDeviation).toBeCloseTo(M > 1 ? Math.sqrt(ss / (M - 1)) : 0, 12);
    expect(s.min).toBe(Math.min(...y));
    expect(s.max).toBe(Math.max(...y));
  });

  it('covers a sub-range [start, end) only', () => {
    const y = Float64Array.from([1000, 1, 2, 3, 4, 5, -1000]);
    const s = meanAndStandardDeviation(y, 1, 6);
    expect(s.mean).toBe(3);
    expect(s.standardDeviation).toBeCloseTo(Math.sqrt(2.5), 14); // s² of 1..5 is 2.5
    expect([s.min, s.max]).toEqual([1, 5]);
  });
});

describe('MomentAccumulator (JCGM 101:2008 7.6, eqs. 12–13, block by block)', () => {
  it.each([1, 7, 4096, 10_001])('agrees with the two-pass formulas over all values, blocks of %i', (block) => {
    const M = 50_003;
    const y = new Float64Array(M);
    // A large offset with a small spread: the case where a naive one-pass sum loses the digits of u.
    new UniformGenerator('blocks').fill(y, M, 1e8, 1e-3);
    const acc = new MomentAccumulator();
    for (let start = 0; start < M; start += block) acc.add(y, start, Math.min(M, start + block));
    const all = meanAndStandardDeviation(y);
    const s = acc.result();
    expect(s.mean).toBeCloseTo(all.mean, 6);
    expect(Math.abs(s.standardDeviation / all.standardDeviation - 1)).toBeLessThan(1e-9);
    expect([s.min, s.max]).toEqual([all.min, all.max]);
  });

  it('merges accumulators as if all values had been added to one', () => {
    const y = Float64Array.from([1, 2, 3, 4, 5, 6, 7, 8]);
    const a = new MomentAccumulator();
    const b = new MomentAccumulator();
    a.add(y, 0, 3);
    b.add(y, 3, 8);
    a.merge(b);
    expect(a.result().mean).toBe(4.5);
    expect(a.result().standardDeviation).toBeCloseTo(Math.sqrt(6), 14); // s² of 1..8 is 6
  });

  it('returns a non-finite block mean when a value is not finite', () => {
    expect(new MomentAccumulator().add(Float64Array.from([1, NaN, 3]), 0, 3)).toBeNaN();
    expect(new MomentAccumulator().add(Float64Array.from([1, Infinity, 3]), 0, 3)).toBe(Infinity);
  });
});

describe('the model kernel gathers a block’s moment sums while it evaluates (JCGM 101:2008 7.6, eqs. 12–13)', () => {
  it('gives the same values and the same Σ(y − K), Σ(y − K)², min and max as a separate pass', () => {
    const model = compileModel({ model: 'y = a * b / (1 + b^2)', measurand: { symbol: 'y' }, inputs: [{ symbol: 'a' }, { symbol: 'b' }], constants: [] });
    const n = 1001;
    const a = new Float64Array(n);
    const b = new Float64Array(n);
    new UniformGenerator('kernel-a').fill(a, n, 10, 1);
    new UniformGenerator('kernel-b').fill(b, n, -2, 4);
    const plain = new Float64Array(n);
    const fused = new Float64Array(n);
    expect(model.evaluateBlock([a, b], plain, 0, n)).toBe(false);
    const sums = blockSums();
    const K = 1.5;
    sums[0] = K;
    expect(model.evaluateBlock([a, b], fused, 0, n, sums)).toBe(true);
    expect(Array.from(fused)).toEqual(Array.from(plain));
    let d = 0;
    let dd = 0;
    for (const y of plain) {
      d += y - K;
      dd += (y - K) ** 2;
    }
    expect(sums[1]).toBeCloseTo(d, 10);
    expect(sums[2]).toBeCloseTo(dd, 10);
    expect(sums[3]).toBe(Math.min(...plain));
    expect(sums[4]).toBe(Math.max(...plain));
    // Checked by hand: a = 10.5, b = 1 gives 10.5·1/2.
    expect(model.value([10.5, 1])).toBe(5.25);
  });
});
