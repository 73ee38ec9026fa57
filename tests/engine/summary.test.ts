import { describe, expect, it } from 'vitest';
import { meanAndStandardDeviation } from '../../shared/montecarlo/summary';
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
