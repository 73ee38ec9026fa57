import { describe, expect, it } from 'vitest';
import { computeBudget } from '../../shared/compute/compute-budget';
import { budget, N, R } from '../support/budget-builder';

/*
 * JCGM 101:2008 9.2, the additive model Y = X₁ + X₂ + X₃ + X₄, p = 95 %.
 * Check values from JCGM 101:2008 Tables 2–4 (from memory).
 */
const model = 'Y = X1 + X2 + X3 + X4';
const run = (inputs: Parameters<typeof budget>[1]) => computeBudget(budget(model, inputs, { monteCarlo: { trials: 1000000, seed: 'additive-9.2' } }));

describe('JCGM 101:2008 9.2 additive model', () => {
  it('9.2.2: four N(0,1): GUF and MCM both give [−3.92, 3.92]', () => {
    const r = run({ X1: N(0, 1), X2: N(0, 1), X3: N(0, 1), X4: N(0, 1) });
    expect(r.gum.standardUncertainty).toBeCloseTo(2, 10);
    expect(r.gum.interval[1]).toBeCloseTo(3.92, 2);
    expect(r.monteCarlo!.interval[0]).toBeCloseTo(-3.92, 1);
    expect(r.monteCarlo!.interval[1]).toBeCloseTo(3.92, 1);
    expect(r.monteCarlo!.standardUncertainty).toBeCloseTo(2, 2);
  });

  it("9.2.3: four rectangular with u = 1: GUF [−3.92, 3.92], MCM [−3.88, 3.88]; at 10⁶ trials d is within the endpoints' numerical uncertainty of δ", () => {
    const a = Math.sqrt(3);
    const r = run({ X1: R(0, a), X2: R(0, a), X3: R(0, a), X4: R(0, a) });
    expect(r.gum.interval[1]).toBeCloseTo(3.92, 2);
    expect(Math.abs(r.monteCarlo!.interval[0] + 3.88)).toBeLessThan(0.01);
    expect(Math.abs(r.monteCarlo!.interval[1] - 3.88)).toBeLessThan(0.01);
    expect(r.validation!.tolerance).toBeCloseTo(0.05, 10); // u = 2.0 → δ = 0.05
    // Exactly (Irwin–Hall distribution, scipy brentq on its cdf): y_low = −3.8794, so d = 3.9199 − 3.8794 = 0.0405, and at
    // 10⁶ trials the endpoint's numerical standard uncertainty is √(0.025·0.975/10⁶)/g(y_low) = 0.0048 (g = 0.0328):
    // d + 2u = 0.0500 = δ, so at 10⁶ trials the verdict is a matter of the seed (this seed gives d_low = 0.049).
    expect(r.validation!.verdict).toBe('inconclusive');
    expect(r.validation!.endpointUncertainty![0]).toBeCloseTo(0.0048, 3);
    expect(r.validation!.passed).toBe(false);
  });

  it('9.2.3 at 10⁷ trials: the endpoints are accurate to 2u ≈ 0.003, and the GUF is validated (d ≈ 0.0405 < δ = 0.05)', () => {
    const a = Math.sqrt(3);
    const doc = budget(model, { X1: R(0, a), X2: R(0, a), X3: R(0, a), X4: R(0, a) }, { monteCarlo: { trials: 10_000_000, seed: 'additive-9.2' } });
    const r = computeBudget(doc);
    expect(r.validation!.endpointUncertainty![0]).toBeCloseTo(0.0015, 3); // 0.0048/√10
    expect(Math.abs(r.validation!.dLow - 0.0405)).toBeLessThan(0.005);
    expect(r.validation!.verdict).toBe('validated');
    expect(r.validation!.passed).toBe(true);
  });

  it('9.2.4: three N(0,1) and one rectangular with u = 10: u = 10.15, GUF [−19.9, 19.9], MCM [−17.0, 17.0], not validated', () => {
    const r = run({ X1: N(0, 1), X2: N(0, 1), X3: N(0, 1), X4: R(0, 10 * Math.sqrt(3)) });
    expect(r.gum.standardUncertainty).toBeCloseTo(10.15, 2);
    expect(r.gum.interval[1]).toBeCloseTo(19.9, 1);
    expect(Math.abs(r.monteCarlo!.interval[1] - 17.0)).toBeLessThan(0.1);
    expect(Math.abs(r.monteCarlo!.interval[0] + 17.0)).toBeLessThan(0.1);
    expect(r.validation!.passed).toBe(false);
    expect(r.validation!.verdict).toBe('not-validated'); // d ≈ 2.9 ≫ δ = 0.05 + 2u
  });

  it('MCM agrees with the GUF for a linear Gaussian model with correlated inputs (JCGM 101:2008 9.4.1: exact for linear Gaussian)', () => {
    const doc = budget(
      'Y = X1 + 2*X2',
      { X1: N(1, 1), X2: N(2, 0.5) },
      {
        correlations: [{ between: ['X1', 'X2'], r: 0.5 }],
        monteCarlo: { trials: 400000, seed: 'linear' },
      },
    );
    const r = computeBudget(doc);
    // u² = 1 + 1 + 2·1·2·1·0.5·0.5 = 3 (JCGM 100:2008 5.2.2 eq. 16)
    expect(r.gum.standardUncertainty).toBeCloseTo(Math.sqrt(3), 10);
    expect(r.monteCarlo!.standardUncertainty).toBeCloseTo(Math.sqrt(3), 2);
    expect(r.monteCarlo!.estimate).toBeCloseTo(5, 2);
    expect(r.validation!.passed).toBe(true);
    expect(r.gum.standardUncertaintySecondOrder).toBeNull();
  });
});
