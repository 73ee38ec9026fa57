import { describe, expect, it } from 'vitest';
import stdlibTQuantile from '@stdlib/stats-base-dists-t-quantile';
import { coverageFactorFor, studentTQuantile } from '../../shared/statistics/student-t';

const PROBABILITIES = [0.6827, 0.9, 0.95, 0.9545, 0.99, 0.9973];
const DOFS = [1, 2, 3, 4, 5, 7, 10, 15, 20, 30, 50, 100, 1000];

describe('studentTQuantile against @stdlib/stats-base-dists-t-quantile', () => {
  for (const p of PROBABILITIES) {
    it.each(DOFS)(`two-sided p = ${p}, ν = %s`, (nu) => {
      const P = (1 + p) / 2;
      const reference = stdlibTQuantile(P, nu);
      expect(Math.abs(studentTQuantile(P, nu) - reference)).toBeLessThan(1e-7 * Math.abs(reference));
      expect(Math.abs(coverageFactorFor(p, nu) - reference)).toBeLessThan(1e-7 * Math.abs(reference));
    });
  }

  it('lower-tail and central quantiles and real ν', () => {
    for (const [P, nu] of [
      [0.025, 4],
      [0.5, 3],
      [0.1, 2.5],
      [0.8, 0.7],
    ] as const) {
      const reference = stdlibTQuantile(P, nu);
      expect(Math.abs(studentTQuantile(P, nu) - reference)).toBeLessThan(1e-7 * Math.max(1, Math.abs(reference)));
    }
  });
});

describe('coverage factors of GUM Table G.2 (from memory)', () => {
  const table: [number, number[]][] = [
    [0.9545, [13.97, 4.53, 3.31, 2.65, 2.28, 2.13, 2.0]],
    [0.95, [12.71, 4.3, 3.18, 2.57, 2.23, 2.09, 1.96]],
    [0.99, [63.66, 9.92, 5.84, 4.03, 3.17, 2.85, 2.58]],
  ];
  const nus = [1, 2, 3, 5, 10, 20, Infinity];
  for (const [p, factors] of table) {
    it.each(nus.map((nu, i) => [nu, factors[i]]))(`p = ${p}, ν = %s → %s`, (nu, k) => {
      // The table prints two decimals (three significant digits at ν = ∞ for p = 95.45 %: 2.00).
      expect(Math.abs(coverageFactorFor(p, nu) - k)).toBeLessThanOrEqual(0.005 + 1e-9);
    });
  }
});

describe('coverageFactorFor', () => {
  it('takes t_p at the real ν, as the note to GUM G.4.1 allows (interpolation), so k matches the ν_eff stated', () => {
    // scipy.stats.t.ppf(0.975, ν) (scipy 1.17, recomputed for this test):
    // ν = 18.9987 → 2.093033747757869, between t(19) = 2.093024 and t(18) = 2.100922 (the old truncation)
    const scipy: [number, number][] = [
      [2.5, 3.5746548420036817],
      [7.3, 2.345066736547703],
      [18.9987, 2.093033747757869],
      [42.42, 2.0174899064769707],
    ];
    for (const [nu, k] of scipy) {
      expect(Math.abs(coverageFactorFor(0.95, nu) - k)).toBeLessThan(1e-7 * k);
      expect(Math.abs(coverageFactorFor(0.95, nu) - stdlibTQuantile(0.975, nu))).toBeLessThan(1e-7 * k);
    }
    expect(coverageFactorFor(0.95, 18.9987)).toBeLessThan(coverageFactorFor(0.95, 18));
    expect(coverageFactorFor(0.95, 18.9987)).toBeGreaterThan(coverageFactorFor(0.95, 19));
    for (const nu of [1.5, 3.3, 4.01, 10.9, 99.5, 1234.5]) {
      expect(Math.abs(coverageFactorFor(0.9545, nu) - stdlibTQuantile((1 + 0.9545) / 2, nu))).toBeLessThan(1e-7 * stdlibTQuantile((1 + 0.9545) / 2, nu));
    }
  });

  it('gives the normal factor 1.959964 for ν = ∞ (handbook value of the normal quantile)', () => {
    expect(coverageFactorFor(0.95, Infinity)).toBeCloseTo(1.959964, 6);
    expect(coverageFactorFor(0.95, 1e9)).toBeCloseTo(1.959964, 6);
  });

  it('refuses invalid p and ν', () => {
    expect(() => coverageFactorFor(1, 10)).toThrow(RangeError);
    expect(() => studentTQuantile(0.5, 0)).toThrow(RangeError);
  });
});
