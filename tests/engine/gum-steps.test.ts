import { describe, expect, it } from 'vitest';
import { combinedVariance } from '../../shared/gum/combined-uncertainty';
import { formatAtExponent, roundResult, roundUncertainty } from '../../shared/gum/rounding';
import { certificateStatement } from '../../shared/gum/statement';
import { effectiveDegreesOfFreedom } from '../../shared/gum/welch-satterthwaite';
import { computeBudget } from '../../shared/compute/compute-budget';
import { budget, N } from '../support/budget-builder';
import stdlibTQuantile from '@stdlib/stats-base-dists-t-quantile';

describe('steps of the law of propagation', () => {
  it('combined variance with a correlation (JCGM 100:2008 5.2.2 eq. 16)', () => {
    // c = (1, 1), u = (3, 4), r = 0: 25; r = 1: 49; r = −1: 1
    expect(combinedVariance([1, 1], [3, 4], null)).toBe(25);
    expect(
      combinedVariance(
        [1, 1],
        [3, 4],
        [
          [1, 1],
          [1, 1],
        ],
      ),
    ).toBe(49);
    expect(
      combinedVariance(
        [1, 1],
        [3, 4],
        [
          [1, -1],
          [-1, 1],
        ],
      ),
    ).toBe(1);
  });

  it('Welch–Satterthwaite (JCGM 100:2008 G.4.1 eq. G.2b)', () => {
    // two equal contributions with ν = 10 each: ν_eff = (2u²)²/(2u⁴/10) = 20
    expect(effectiveDegreesOfFreedom([1, 1], [1, 1], [10, 10], null)).toBeCloseTo(20, 12);
    expect(effectiveDegreesOfFreedom([1], [1], [Infinity], null)).toBe(Infinity);
  });

  it('ν from the relative uncertainty of u: 25 % → ν = 8 (JCGM 100:2008 G.4.2 eq. G.3)', () => {
    const r = computeBudget(budget('Y = a', { a: N(1, 0.1, { relativeUncertaintyOfU: 0.25 }) }), { monteCarlo: false });
    expect(r.gum.effectiveDof).toBeCloseTo(8, 12);
    // t₉₅(8) = 2.31 (JCGM 100:2008 Table G.2, from memory)
    expect(r.gum.coverageFactor).toBeCloseTo(2.306, 3);
  });

  it('k = t_p at the real ν_eff, not truncated (JCGM 100:2008 G.4.1 note allows interpolation)', () => {
    const r = computeBudget(budget('Y = a + b', { a: N(0, 1, { dof: 4 }), b: N(0, 1, { dof: 4 }) }), { monteCarlo: false });
    expect(r.gum.effectiveDof).toBeCloseTo(8, 10);
    // one more ∞ input of small u: ν_eff = (2.0529)²/(2/4) = 8.43, and k follows it below t(8)
    const r2 = computeBudget(budget('Y = a + b + c', { a: N(0, 1, { dof: 4 }), b: N(0, 1, { dof: 4 }), c: N(0, 0.23) }), { monteCarlo: false });
    expect(r2.gum.effectiveDof!).toBeCloseTo((2 + 0.23 ** 2) ** 2 / 0.5, 10);
    // @stdlib/stats-base-dists-t-quantile at the same real ν (jStat agrees to a few parts in 10⁸)
    const reference = stdlibTQuantile(0.975, r2.gum.effectiveDof!);
    expect(Math.abs(r2.gum.coverageFactor - reference)).toBeLessThan(1e-7 * reference);
    expect(r2.gum.coverageFactor).toBeLessThan(r.gum.coverageFactor);
  });

  it('rounds to two significant digits and the estimate to the same place (JCGM 100:2008 7.2.6)', () => {
    expect(roundUncertainty(0.0539)).toEqual({ value: 0.054, exponent: -3 });
    expect(roundUncertainty(0.0996)).toEqual({ value: 0.1, exponent: -2 });
    expect(roundUncertainty(92.6)).toEqual({ value: 93, exponent: 0 });
    expect(roundUncertainty(1234)).toEqual({ value: 1200, exponent: 2 });
    expect(formatAtExponent(0.1, -2)).toBe('0.10');
    // JCGM 100:2008 7.2.2: m_S = 100.021 47 g with u_c = 0.35 mg
    expect(roundResult(100.02147, 0.00035)).toEqual({ estimate: '100.02147', uncertainty: '0.00035', exponent: -5 });
    expect(roundResult(1.23404, 0.1057)).toEqual({ estimate: '1.23', uncertainty: '0.11', exponent: -2 });
  });

  it('with U = 0 keeps the estimate to its own significant digits (JCGM 100:2008 7.2.6 sets the place from U, which 0 does not)', () => {
    // difference of two fully correlated inputs: y = 0.5, U = 0 — never "(1 ± 0)"
    expect(roundResult(0.5, 0)).toEqual({ estimate: '0.5', uncertainty: '0.0', exponent: -1 });
    // the binary noise of 0.1 + 0.2 = 0.30000000000000004 is not a significant digit (15 digits of a double)
    expect(roundResult(0.1 + 0.2, 0)).toEqual({ estimate: '0.3', uncertainty: '0.0', exponent: -1 });
    expect(roundResult(100.02147, 0)).toEqual({ estimate: '100.02147', uncertainty: '0.00000', exponent: -5 });
    expect(roundResult(1200, 0)).toEqual({ estimate: '1200', uncertainty: '0', exponent: 0 });
    expect(roundResult(0, 0)).toEqual({ estimate: '0', uncertainty: '0', exponent: 0 });
  });

  it('writes the certificate statement (EA-4/02 M:2022 5.2 wording)', () => {
    const r = computeBudget(budget('Y = a', { a: N(10.0123, 0.0151, { dof: 9 }) }), { monteCarlo: false });
    const s = certificateStatement({ symbol: 'Y', unit: 'mm' }, r.reported!, r.gum.effectiveDof);
    expect(s).toContain('Y = (10.012 ± 0.034) mm'); // k = t₉₅(9) = 2.26 (Table G.2, from memory)
    expect(s).toContain('k = 2.26');
    expect(s).toContain('ν_eff = 9');
  });
});
