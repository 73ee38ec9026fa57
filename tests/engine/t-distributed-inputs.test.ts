import { describe, expect, it } from 'vitest';
import type { Distribution } from '../../shared/budget/schema';
import { computeBudget } from '../../shared/compute/compute-budget';
import { certificateStatement } from '../../shared/gum/statement';
import { budget, N } from '../support/budget-builder';

/*
 * Inputs drawn from the scaled and shifted t-distribution t_ν(μ, σ²) of
 * JCGM 101:2008 6.4.9: it has an expectation only for ν > 1 and a variance
 * νσ²/(ν − 2) only for ν > 2 (6.4.9.2, from memory; the t moments are in any
 * statistics handbook, e.g. scipy.stats.t(1).var() = inf, t(2).var() = inf).
 * t quantiles: scipy.stats.t.ppf(0.975, ν) = 12.7062 (ν = 1), 4.3027 (ν = 2),
 * 3.1824 (ν = 3), 2.5706 (ν = 5); GUM Table G.2 gives the same to 2 decimals (from memory).
 */
const observations = (values: number[]): Distribution => ({ kind: 'observations', values });

describe('few observations: ν = n − 1 ≤ 2 leaves the Monte Carlo u undefined (JCGM 101:2008 6.4.9)', () => {
  // Spread 0.1: s = 0.0707 (n = 2), 0.05 (n = 3); s/√n = 0.05, 0.0289.
  const two = computeBudget(budget('Y = a', { a: observations([10.0, 10.1]) }, { monteCarlo: { trials: 200_000, seed: 'few' } }));
  const three = computeBudget(budget('Y = a', { a: observations([10.0, 10.1, 10.05]) }, { monteCarlo: { trials: 200_000, seed: 'few' } }));

  it('the sample standard deviation of the run is no u: with n = 2 it is > 100× s/√n = 0.05 (a Cauchy sample)', () => {
    // This number changes with the seed without bound; it is what "validated" used to rest on.
    expect(two.monteCarlo!.standardUncertainty).toBeGreaterThan(100 * 0.05);
    expect(two.monteCarlo!.undefinedMoments).toMatchObject({ smallestDof: 1, symbols: ['a'] });
    expect(three.monteCarlo!.undefinedMoments).toMatchObject({ smallestDof: 2, symbols: ['a'] });
  });

  it('refuses to validate: verdict not-possible, reason "variance of t_ν is undefined for ν ≤ 2", no δ', () => {
    for (const r of [two, three]) {
      expect(r.validation!.verdict).toBe('not-possible');
      expect(r.validation!.passed).toBe(false);
      expect(r.validation!.tolerance).toBeNull();
      expect(r.validation!.reason).toMatch(/variance of t_ν is undefined for ν ≤ 2/);
    }
  });

  it('warns for n ≤ 3 and not for n = 4 (ν = 3 has a variance)', () => {
    expect(two.warnings.some((w) => w.code === 'dof-undefined-variance' && /only 2 observations \(ν = 1\)/.test(w.message))).toBe(true);
    expect(three.warnings.some((w) => w.code === 'dof-undefined-variance' && /only 3 observations \(ν = 2\)/.test(w.message))).toBe(true);
    const four = computeBudget(budget('Y = a', { a: observations([10.0, 10.1, 10.05, 10.02]) }), { monteCarlo: false });
    expect(four.warnings.some((w) => w.code === 'dof-undefined-variance')).toBe(false);
  });

  it('the quantiles still exist: the Monte Carlo interval is x̄ ± t_0.975(ν)·s/√n (12.706·0.05, 4.3027·0.0289)', () => {
    // binomial spread of the 2.5 % order statistic at 2·10⁵ draws: ν = 1, √(0.025·0.975/2e5)/g = 0.00035/0.039 = 0.009 (g = t₁ density at 12.706, /0.05)
    expect(two.monteCarlo!.interval[0]).toBeCloseTo(10.05 - 12.7062 * 0.05, 1);
    expect(Math.abs(three.monteCarlo!.interval[1] - (10.05 + (4.3027 * 0.05) / Math.sqrt(3)))).toBeLessThan(0.005);
  });

  it('reports the GUM figures (k = t_p(ν) holds for a Type A input) and says they could not be validated', () => {
    const reported = three.reported!;
    expect(reported).toMatchObject({ basis: 't-effective-dof', unvalidated: true, replacedGum: false, validationVerdict: 'not-possible' });
    expect(reported.coverageFactor).toBeCloseTo(4.3027, 4);
    const statement = certificateStatement({ symbol: 'Y', unit: 'mm' }, reported, three.gum.effectiveDof);
    expect(statement).toContain('Y = (10.05 ± 0.12) mm');
    expect(statement).toMatch(/could not validate it: the variance of t_ν is undefined for ν ≤ 2/);
  });

  it('when the lab reports the Monte Carlo interval instead, u is null and the estimate is f(x), not the Cauchy average', () => {
    const r = computeBudget(budget('Y = a', { a: observations([10.0, 10.1]) }, { monteCarlo: { trials: 200_000, seed: 'few' }, reporting: { whenNotValidated: 'report-monte-carlo' } }));
    expect(r.reported).toMatchObject({ basis: 'monte-carlo', replacedGum: true, standardUncertainty: null, estimate: 10.05, coverageFactor: null });
    expect(r.reported!.interval).toEqual(r.monteCarlo!.interval);
    const statement = certificateStatement({ symbol: 'Y', unit: 'mm' }, r.reported!, r.gum.effectiveDof);
    // U = the larger half-width ≈ 12.706·0.05 = 0.64 → two digits, the hundredths
    expect(statement).toMatch(/^Y = 10\.05 mm, with the coverage interval \[9\.4\d, 10\.6\d\] mm for a coverage probability of 95 %/);
    expect(statement).toMatch(/replaces the result of the law of propagation .* could not be validated: the variance of t_ν/);
    expect(statement).not.toMatch(/standard uncertainty is/);
  });

  it('an adaptive run falls back to a fixed number of trials: its criterion needs u (JCGM 101:2008 7.9.4)', () => {
    const r = computeBudget(budget('Y = a', { a: observations([10.0, 10.1, 10.05]) }), { trials: 'adaptive', trialsCap: 50_000 });
    expect(r.monteCarlo).toMatchObject({ adaptive: false, trials: 50_000 });
    expect(r.monteCarlo!.stability).toBeUndefined();
    expect(r.warnings.some((w) => w.code === 'adaptive-not-possible' && /adaptive Monte Carlo procedure judges stability by the standard uncertainty/.test(w.message))).toBe(true);
  });

  it('the same for a student-t input with dof ≤ 2 and a normal input stated with ν = 2', () => {
    for (const d of [
      { kind: 'student-t', value: 1, scale: 0.1, dof: 2 },
      { kind: 'normal', value: 1, U: 0.43, k: 4.3, dof: 2 },
    ] as Distribution[]) {
      const r = computeBudget(budget('Y = a + b', { a: d, b: N(0, 0.01) }, { monteCarlo: { trials: 50_000, seed: 't2' } }));
      expect(r.validation!.verdict).toBe('not-possible');
      expect(r.warnings.some((w) => w.code === 'dof-undefined-variance' && /t-distribution with ν = 2 ≤ 2/.test(w.message))).toBe(true);
    }
  });
});

describe('a normal input stated with U, k and ν is drawn from t_ν(x, (U/k)²) (JCGM 101:2008 6.4.9.7, from memory)', () => {
  // A certificate: U = 0.25706 with k = 2.5706 for ν_eff = 5, so u = 0.1 and the GUM interval is 5 ± 0.25706.
  const certificate: Distribution = { kind: 'normal', value: 5, U: 0.25706, k: 2.5706, dof: 5 };
  const r = computeBudget(budget('Y = a', { a: certificate }, { monteCarlo: { trials: 1_000_000, seed: 'certificate' } }));

  it('the Monte Carlo interval is 5 ± 0.1·t_0.975(5) = [4.7429, 5.2571], not the Gaussian 5 ± 0.196', () => {
    expect(r.gum.coverageFactor).toBeCloseTo(2.5706, 4);
    expect(Math.abs(r.monteCarlo!.interval[0] - 4.74294)).toBeLessThan(0.002);
    expect(Math.abs(r.monteCarlo!.interval[1] - 5.25706)).toBeLessThan(0.002);
    // the t standard deviation, 0.1·√(5/3) = 0.1291, not 0.1
    expect(r.monteCarlo!.standardUncertainty).toBeCloseTo(0.1291, 3);
  });

  it('so a correct budget is validated (d ≈ 0 against δ = 0.005 of u = 0.13)', () => {
    expect(r.validation!.tolerance).toBeCloseTo(0.005, 12);
    expect(r.validation!.dLow).toBeLessThan(0.002);
    expect(r.validation!.verdict).toBe('validated');
    expect(r.reported).toMatchObject({ basis: 't-effective-dof', unvalidated: false, replacedGum: false });
  });
});
