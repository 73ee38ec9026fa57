import { describe, expect, it } from 'vitest';
import { numericalTolerance, validateGumInterval, validationNotPossible } from '../../shared/montecarlo/validation';

describe('numericalTolerance (JCGM 101:2008 8.2)', () => {
  it('u = 2 (printed "2.0") with n_dig = 2: c = 20, ℓ = −1, δ = 0.05 (JCGM 101:2008 9.2.2, from memory)', () => {
    expect(numericalTolerance(2, 2)).toBeCloseTo(0.05, 15);
  });

  it('u = 0.0539 mg with n_dig = 2: c = 54, ℓ = −3, δ = 0.0005 mg (JCGM 101:2008 clause 9 mass example, from memory)', () => {
    expect(numericalTolerance(0.0539, 2)).toBeCloseTo(0.0005, 15);
  });

  it('follows u = c·10^ℓ, δ = ½·10^ℓ at one and three digits and at powers of ten', () => {
    expect(numericalTolerance(0.0539, 1)).toBeCloseTo(0.005, 15); // c = 5, ℓ = −2
    expect(numericalTolerance(0.0539, 3)).toBeCloseTo(0.00005, 15); // c = 539, ℓ = −4
    expect(numericalTolerance(1000, 2)).toBeCloseTo(50, 12); // c = 10, ℓ = 2
    expect(numericalTolerance(0.1, 1)).toBeCloseTo(0.05, 15); // c = 1, ℓ = −1
    expect(numericalTolerance(1e-9, 2)).toBeCloseTo(5e-11, 24);
  });

  it('carries when c rounds up to n_dig + 1 digits (0.0996 → 0.10)', () => {
    expect(numericalTolerance(0.0996, 2)).toBeCloseTo(0.005, 15); // c = 10, ℓ = −2
  });

  it('refuses a zero or non-finite u and a bad digit count', () => {
    expect(() => numericalTolerance(0, 2)).toThrow(RangeError);
    expect(() => numericalTolerance(Infinity, 2)).toThrow(RangeError);
    expect(() => numericalTolerance(1, 0)).toThrow(RangeError);
  });
});

describe('validateGumInterval (JCGM 101:2008 8.3)', () => {
  it('passes when both end-point differences are within δ', () => {
    // Additive model of four N(0,1): GUM 0 ± 3.92, Monte Carlo [−3.92, 3.92] (JCGM 101:2008 9.2.2, from memory).
    const r = validateGumInterval({ y: 0, U: 3.92 }, [-3.92, 3.92], 2.0, 2);
    expect(r).toEqual({ significantDigits: 2, tolerance: r.tolerance, dLow: 0, dHigh: 0, passed: true, verdict: 'validated' });
    expect(r.tolerance!).toBeCloseTo(0.05, 15);
  });

  it('fails on one side only and reports both differences', () => {
    const r = validateGumInterval({ y: 1.234, U: 0.106 }, [1.0844, 1.3835], 0.0754, 2);
    expect(r.tolerance).toBeCloseTo(0.0005, 15);
    expect(r.dLow).toBeCloseTo(Math.abs(1.234 - 0.106 - 1.0844), 12);
    expect(r.dHigh).toBeCloseTo(Math.abs(1.234 + 0.106 - 1.3835), 12);
    expect(r.passed).toBe(false);
    const oneSide = validateGumInterval({ y: 0, U: 1 }, [-1.01, 1.2], 0.5, 1); // δ = 0.05
    expect(oneSide.dLow).toBeLessThanOrEqual(oneSide.tolerance!);
    expect(oneSide.passed).toBe(false);
  });
});

describe("a verdict that accounts for the Monte Carlo endpoints' numerical uncertainty (JCGM 101:2008 7.9, 8)", () => {
  // δ = 0.05 (u = 2.0, n_dig = 2); a verdict holds only when d ± 2u(endpoint) lies wholly on one side of δ (2: the factor of 7.9.4).
  const at = (d: number, uEnd: number) => validateGumInterval({ y: 0, U: 3.92 }, [-3.92 + d, 3.92], 2.0, 2, { endpointUncertainty: [uEnd, uEnd], trials: 100_000 });

  it('validated when d + 2u ≤ δ: d = 0.04, u = 0.004', () => {
    expect(at(0.04, 0.004)).toMatchObject({ verdict: 'validated', passed: true, endpointUncertainty: [0.004, 0.004] });
  });

  it('inconclusive when δ lies within d ± 2u: d = 0.045 or 0.055 with u = 0.004; the reason says what to do', () => {
    for (const d of [0.045, 0.055]) {
      const v = at(d, 0.004);
      expect(v.verdict).toBe('inconclusive');
      expect(v.passed).toBe(false);
      expect(v.reason).toMatch(/^inconclusive at 100000 trials: .* run more trials/);
    }
  });

  it('not validated when d − 2u > δ: d = 0.06, u = 0.004', () => {
    expect(at(0.06, 0.004)).toMatchObject({ verdict: 'not-validated', passed: false });
    expect(at(0.06, 0.004).reason).toMatch(/differs from the Monte Carlo interval by more than δ = 0.05/);
  });

  it('not possible without a Monte Carlo u: no δ, the reason as given, both d still stated', () => {
    const v = validationNotPossible({ y: 0, U: 1 }, [-1.1, 1.2], 2, 'why');
    expect(v).toEqual({ significantDigits: 2, tolerance: null, dLow: v.dLow, dHigh: v.dHigh, passed: false, verdict: 'not-possible', reason: 'why' });
    expect(v.dLow).toBeCloseTo(0.1, 12);
    expect(v.dHigh).toBeCloseTo(0.2, 12);
  });
});
