import { describe, expect, it } from 'vitest';
import { BudgetError } from '../../shared/budget/budget-error';
import { budgetProblems, validateBudget } from '../../shared/budget/budget-file';
import type { GumResult, MonteCarloResult, ValidationResult } from '../../shared/budget/result';
import type { BudgetDocument } from '../../shared/budget/schema';
import { computeBudget } from '../../shared/compute/compute-budget';
import { reportedResult, reportingChoice } from '../../shared/compute/reported-result';
import { certificateStatement, resultStatement } from '../../shared/gum/statement';
import { coverageProbabilityFor } from '../../shared/statistics/student-t';
import { budget, N, R } from '../support/budget-builder';

/*
 * The reporting choice of a lab (EA-4/02 M:2022 5; ILAC P14): k = t_p(ν_eff)
 * or a fixed k, and what is reported when the GUM result is not validated by
 * the Monte Carlo method (JCGM 101:2008 clause 8).
 */

describe('the budget file\'s "reporting" (zod, with messages that say what to do)', () => {
  const base = budget('Y = a', { a: N(1, 0.1) });

  it('is optional; absent, it is k = t_p(ν_eff) and the GUM figures reported', () => {
    expect(reportingChoice(validateBudget(base).reporting)).toEqual({ basis: 't-effective-dof', whenNotValidated: 'report-gum' });
  });

  it('k-fixed needs k, k needs k-fixed, and an unknown basis names the choices', () => {
    expect(budgetProblems({ ...base, reporting: { basis: 'k-fixed' } })).toEqual([
      { code: 'invalid_field', field: 'reporting.k', message: 'reporting.k: is required with basis "k-fixed": give the coverage factor, conventionally 2' },
    ]);
    expect(budgetProblems({ ...base, reporting: { k: 2 } })[0]).toMatchObject({ field: 'reporting.basis', message: expect.stringMatching(/must be "k-fixed" when k is given/) });
    expect(budgetProblems({ ...base, reporting: { basis: 'monte-carlo' } })[0].message).toMatch(/set whenNotValidated to "report-monte-carlo"/);
    expect(budgetProblems({ ...base, reporting: { whenNotValidated: 'drop' } })[0].field).toBe('reporting.whenNotValidated');
    expect(budgetProblems({ ...base, reporting: { basis: 'k-fixed', k: 0.5 } })[0].message).toMatch(/at least 1 \(conventionally 2\)/);
  });

  it('keeps fields it does not know', () => {
    const doc = validateBudget({ ...base, reporting: { basis: 'k-fixed', k: 2, note: 'lab procedure QP-7' } });
    expect(doc.reporting).toEqual({ basis: 'k-fixed', k: 2, note: 'lab procedure QP-7' });
  });
});

describe('coverageProbabilityFor: p = 2F_ν(k) − 1 (GUM G.3.4)', () => {
  it('k = 2: 0.9545 for a normal distribution (EA-4/02 M:2022 5.1; scipy 2·norm.cdf(2) − 1 = 0.954500), 0.9234 for ν = 9 (scipy 2·t.cdf(2, 9) − 1)', () => {
    expect(coverageProbabilityFor(2, Infinity)).toBeCloseTo(0.9545, 4);
    expect(coverageProbabilityFor(2, 9)).toBeCloseTo(0.923447, 5);
    expect(coverageProbabilityFor(2, 9.7)).toBeCloseTo(0.923447, 5); // ν truncated as for k (GUM G.4.1)
  });
});

describe('result.reported and the certificate statement', () => {
  it('t-effective-dof: the GUM figures as propagated (k = t_0.975(9) = 2.2622, GUM Table G.2 2.26 from memory; scipy 2.262157)', () => {
    const r = computeBudget(budget('Y = a', { a: N(10.0123, 0.0151, { dof: 9 }) }), { monteCarlo: false });
    expect(r.reported).toEqual({
      basis: 't-effective-dof',
      estimate: r.gum.estimate,
      standardUncertainty: r.gum.standardUncertainty,
      coverageProbability: 0.95,
      coverageFactor: r.gum.coverageFactor,
      expandedUncertainty: r.gum.expandedUncertainty,
      interval: r.gum.interval,
      replacedGum: false,
      unvalidated: false,
    });
    expect(r.reported!.coverageFactor).toBeCloseTo(2.262157, 5);
    const s = certificateStatement({ symbol: 'Y', unit: 'mm' }, r.reported!, r.gum.effectiveDof);
    expect(s).toBe(
      'Y = (10.012 ± 0.034) mm. The reported expanded uncertainty is the combined standard uncertainty multiplied by the coverage factor k = 2.26, ' +
        'which for a t-distribution with ν_eff = 9 effective degrees of freedom corresponds to a coverage probability of approximately 95 %.',
    );
  });

  it('k-fixed, k = 2: U = 2u_c; p is what k = 2 gives: 95 % for ν_eff = ∞ (EA-4/02 wording), 92 % for ν_eff = 9', () => {
    const normal = computeBudget(budget('Y = a', { a: N(10.0123, 0.0151) }, { reporting: { basis: 'k-fixed', k: 2 } }), { monteCarlo: false });
    expect(normal.reported).toMatchObject({ basis: 'k-fixed', coverageFactor: 2, expandedUncertainty: 0.0302 });
    expect(normal.reported!.coverageProbability).toBeCloseTo(0.9545, 4);
    expect(certificateStatement({ symbol: 'Y', unit: 'mm' }, normal.reported!, normal.gum.effectiveDof)).toBe(
      'Y = (10.012 ± 0.030) mm. The reported expanded uncertainty is the combined standard uncertainty multiplied by the coverage factor k = 2.00, ' +
        'which for a normal distribution corresponds to a coverage probability of approximately 95 %.',
    );
    const few = computeBudget(budget('Y = a', { a: N(10.0123, 0.0151, { dof: 9 }) }, { reporting: { basis: 'k-fixed', k: 2 } }), { monteCarlo: false });
    expect(few.reported!.coverageProbability).toBeCloseTo(0.923447, 5);
    expect(certificateStatement({ symbol: 'Y', unit: 'mm' }, few.reported!, few.gum.effectiveDof)).toMatch(/ν_eff = 9 .* approximately 92 %\.$/);
  });

  // JCGM 101:2008 9.2.4 (from memory): three N(0, 1) and one rectangular with u = 10; GUF ±19.9, MCM ±17.0: not validated.
  const notValidated = (reporting?: BudgetDocument['reporting']) =>
    computeBudget(
      budget(
        'Y = X1 + X2 + X3 + X4',
        { X1: N(0, 1), X2: N(0, 1), X3: N(0, 1), X4: R(0, 10 * Math.sqrt(3)) },
        {
          monteCarlo: { trials: 200_000, seed: 'reporting' },
          ...(reporting ? { reporting } : {}),
        },
      ),
    );

  it('not validated, default: the GUM figures, flagged unvalidated, and the statement says so', () => {
    const r = notValidated();
    expect(r.validation!.verdict).toBe('not-validated');
    expect(r.reported).toMatchObject({ basis: 't-effective-dof', unvalidated: true, replacedGum: false, validationVerdict: 'not-validated' });
    expect(r.reported!.expandedUncertainty).toBeCloseTo(19.9, 1);
    const s = certificateStatement({ symbol: 'Y' }, r.reported!, r.gum.effectiveDof);
    expect(s).toMatch(/^Y = \(0 ± 20\)\. /);
    expect(s).toMatch(/reported although the Monte Carlo method of JCGM 101:2008 did not validate it/);
  });

  it('not validated, "report-monte-carlo": the Monte Carlo interval ±17.0 replaces the GUM ±19.9, and the statement says so', () => {
    const r = notValidated({ whenNotValidated: 'report-monte-carlo' });
    expect(r.reported).toMatchObject({ basis: 'monte-carlo', replacedGum: true, unvalidated: false, coverageFactor: null, trials: 200_000 });
    expect(r.reported!.interval).toEqual(r.monteCarlo!.interval);
    expect(Math.abs(r.reported!.interval[1] - 17.0)).toBeLessThan(0.15);
    expect(r.reported!.standardUncertainty).toBe(r.monteCarlo!.standardUncertainty);
    const s = certificateStatement({ symbol: 'Y' }, r.reported!, r.gum.effectiveDof);
    // U = 17 (the larger half-width, two digits): y and the endpoints to the unit (JCGM 100:2008 7.2.6)
    expect(s).toMatch(/^Y = 0, with the coverage interval \[-17, 17\] for a coverage probability of 95 %/);
    expect(s).toMatch(/with 200000 trials\. The standard uncertainty is 10\. This interval replaces .* which the Monte Carlo method did not validate/);
  });

  it('validated: the GUM figures whatever whenNotValidated says (JCGM 101:2008 9.2.2: four N(0, 1))', () => {
    const r = computeBudget(
      budget(
        'Y = X1 + X2 + X3 + X4',
        { X1: N(0, 1), X2: N(0, 1), X3: N(0, 1), X4: N(0, 1) },
        {
          monteCarlo: { trials: 1_000_000, seed: 'additive-9.2' },
          reporting: { whenNotValidated: 'report-monte-carlo' },
        },
      ),
    );
    expect(r.validation!.verdict).toBe('validated');
    expect(r.reported).toMatchObject({ basis: 't-effective-dof', replacedGum: false, unvalidated: false });
  });
});

describe('reportedResult never reports GUM figures the engine knows to be unusable', () => {
  // Y = a² at a = 0, u(a) = 1: first-order u_c = 0, second-order u_c = √2 (GUM 5.1.2 note: ½c₁₁²u⁴ = ½·4 = 2).
  const model = 'Y = a^2';

  it('switches to the Monte Carlo interval (a χ²₁ output: [0.00098, 5.02], scipy chi2(1).ppf(0.025, 0.975))', () => {
    const r = computeBudget(budget(model, { a: N(0, 1) }, { monteCarlo: { trials: 200_000, seed: 'stationary' } }));
    expect(r.gum.standardUncertainty).toBe(0);
    expect(r.reported).toMatchObject({ basis: 'monte-carlo', replacedGum: true, validationVerdict: 'not-possible' });
    expect(r.reported!.validationReason).toMatch(/first-order law of propagation gives u_c = 0 but the higher-order terms give u_c = 1\.41/);
    expect(Math.abs(r.reported!.interval[1] - 5.0239)).toBeLessThan(0.05);
    expect(certificateStatement({ symbol: 'Y' }, r.reported!, r.gum.effectiveDof)).toMatch(/replaces .* which could not be validated: the first-order law/);
  });

  it('reports nothing without a Monte Carlo run, and the statement says why and what to do', () => {
    const r = computeBudget(budget(model, { a: N(0, 1) }), { monteCarlo: false });
    expect(r.reported).toBeNull();
    expect(r.warnings.some((w) => w.code === 'not-reportable' && w.message.startsWith('NOT REPORTABLE'))).toBe(true);
    expect(resultStatement({ symbol: 'Y' }, r)).toMatch(/^No expanded uncertainty can be stated for Y: .*every sensitivity coefficient vanishes.* Run the Monte Carlo method/);
  });

  it('refuses to build reported figures from unusable GUM figures without a Monte Carlo run', () => {
    const r = computeBudget(budget(model, { a: N(0, 1) }), { monteCarlo: false });
    let error: unknown;
    try {
      reportedResult(r.gum, null, null, reportingChoice(undefined));
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(BudgetError);
    expect(error).toMatchObject({ code: 'unreportable', field: 'monteCarlo' });
    expect((error as Error).message).toMatch(/every sensitivity coefficient vanishes.* Run the Monte Carlo method/);
  });

  it('refuses non-finite GUM figures the same way', () => {
    const gum = { estimate: 1, standardUncertainty: NaN, expandedUncertainty: NaN } as GumResult;
    expect(() => reportedResult(gum, null, null, reportingChoice(undefined))).toThrow(/not finite numbers/);
    const mc = { trials: 1000, estimate: 1, standardUncertainty: 0.1, interval: [0.8, 1.2] } as MonteCarloResult;
    const v = { verdict: 'not-validated', passed: false } as ValidationResult;
    expect(reportedResult({ ...gum, coverageProbability: 0.95 }, mc, v, reportingChoice(undefined))).toMatchObject({ basis: 'monte-carlo', interval: [0.8, 1.2] });
  });
});
