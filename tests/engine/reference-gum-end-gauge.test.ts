import { describe, expect, it } from 'vitest';
import { computeBudget } from '../../shared/compute/compute-budget';
import { validateBudget } from '../../shared/budget/budget-file';

/*
 * JCGM 100:2008 Annex H.1, calibration of an end gauge of nominal length 50 mm.
 * Inputs and check values recalled from the standard (from memory) and
 * recomputed by hand: contributions 25, 9.7, 2.9, 16.6 nm; u_c = 32 nm;
 * ν_eff = 16; k₉₉ = 2.92; U₉₉ = 93 nm; l = 50.000 838 mm; with the
 * second-order terms of H.1.7, u_c = 34 nm.
 */
const endGauge = validateBudget({
  format: 'dubito-budget/1',
  title: 'End gauge, JCGM 100:2008 H.1',
  measurand: { symbol: 'l', unit: 'mm' },
  model: 'l = l_s + d - l_s * (dalpha * theta + alpha_s * dtheta)',
  inputs: [
    { symbol: 'l_s', unit: 'mm', distribution: { kind: 'normal', value: 50.000623, U: 0.000075, k: 3, dof: 18 } },
    { symbol: 'd', unit: 'nm', distribution: { kind: 'normal', value: 215, u: 9.7, dof: 25.6 } },
    { symbol: 'alpha_s', unit: '1/degC', distribution: { kind: 'rectangular', value: 11.5e-6, halfWidth: 2e-6 } },
    { symbol: 'theta', unit: 'degC', distribution: { kind: 'normal', value: -0.1, u: 0.41 } },
    { symbol: 'dalpha', unit: '1/degC', distribution: { kind: 'rectangular', value: 0, halfWidth: 1e-6, dof: 50 } },
    { symbol: 'dtheta', unit: 'degC', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.05, dof: 2 } },
  ],
  coverageProbability: 0.99,
});

describe('JCGM 100:2008 H.1 end gauge', () => {
  const r = computeBudget(endGauge, { monteCarlo: false }).gum;
  const nm = (symbol: string) => (r.contributions.find((c) => c.symbol === symbol)?.contribution ?? NaN) * 1e6;

  it('gives the contributions of Table H.1 in nm', () => {
    expect(nm('l_s')).toBeCloseTo(25, 1); // H.1.3.1: u(l_s) = 25 nm
    expect(nm('d')).toBeCloseTo(9.7, 1); // H.1.3.2: u(d) = 9.7 nm
    expect(nm('dalpha')).toBeCloseTo(2.9, 1); // H.1.3.5: 2.9 nm
    expect(nm('dtheta')).toBeCloseTo(16.6, 1); // H.1.3.6: 16.6 nm
    expect(nm('alpha_s')).toBeCloseTo(0, 6); // c = −l_s·δθ = 0 at the estimates
    expect(nm('theta')).toBeCloseTo(0, 6); // c = −l_s·δα = 0
  });

  it('gives l = 50.000 838 mm, u_c = 32 nm, ν_eff = 16.7, k = t₉₉(16.7) = 2.90, U = 92 nm (H.1.4–H.1.6, k interpolated as the G.4.1 note allows)', () => {
    expect(r.estimate).toBeCloseTo(50.000838, 6);
    expect(Math.round(r.standardUncertainty * 1e6)).toBe(32);
    expect(Math.floor(r.effectiveDof as number)).toBe(16);
    // H.1.6 truncates ν_eff = 16.7 to 16 (k = t₉₉(16) = 2.92); the G.4.1 note also allows interpolation in
    // Table G.2, which t_p at the real ν_eff does exactly: between t₉₉(17) = 2.90 and t₉₉(16) = 2.92
    // (scipy.stats.t.ppf(0.995, 16.7) = 2.9047), so U = 2.90·31.7 nm = 92 nm instead of 93 nm.
    expect(r.coverageFactor).toBeGreaterThan(2.898);
    expect(r.coverageFactor).toBeLessThan(2.9208);
    expect(r.expandedUncertainty * 1e6).toBeGreaterThanOrEqual(91.5);
    expect(r.expandedUncertainty * 1e6).toBeLessThanOrEqual(93.5);
  });

  it('gives u_c = 34 nm with the second-order terms (H.1.7)', () => {
    expect(Math.round((r.standardUncertaintySecondOrder as number) * 1e6)).toBe(34);
  });
});
