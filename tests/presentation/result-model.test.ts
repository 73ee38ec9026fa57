import { describe, expect, it } from 'vitest';
import type { BudgetResult, ValidationResult } from '../../shared/budget/result';
import { validateBudget } from '../../shared/budget/budget-file';
import { computeBudget } from '../../shared/compute/compute-budget';
import { compareResults } from '../../shared/presentation/compare';
import { modelValues, presentResult } from '../../shared/presentation/result-model';
import { STATUS_WORDS, labOf, versionStatus } from '../../shared/presentation/status';
import { unitText } from '../../shared/presentation/units';
import { verdictView } from '../../shared/presentation/verdict';

// invented demo data: a difference of two temperatures in mK
const document = validateBudget({
  format: 'dubito-budget/1',
  title: 'Gradient of bath KF-BATH1',
  measurand: { symbol: 'dT', unit: 'mK' },
  model: 't_mean = (t_a + t_b) / 2\ndT = t_a - t_b',
  inputs: [
    { symbol: 't_a', unit: 'degC', description: 'upper probe', distribution: { kind: 'normal', value: 20.012, u: 0.003 } },
    { symbol: 't_b', unit: 'degC', description: 'lower probe', distribution: { kind: 'rectangular', value: 20.004, halfWidth: 0.005 } },
  ],
});
const result = computeBudget(document, { monteCarlo: false });

describe('the result model', () => {
  it('reads the GUM figures as reported when a stored result has no reporting basis', () => {
    const m = presentResult(document, { ...result, reported: undefined });
    expect(m.reported.basis).toBe('t-effective-dof');
    // u_c = √(3² + (5/√3)²) mK = 4.163 mK (closed form); k = 1.96 (ν = ∞, normal quantile 0.975)
    expect(m.reported.standardUncertainty.text).toBe('4.2');
    expect(m.reported.coverageFactor?.text).toBe('1.96');
    expect(m.reported.expandedUncertainty.text).toBe('8.2');
    // y = 20.012 °C − 20.004 °C = 8 mK, at the place of U
    expect(m.reported.estimate.text).toBe('8.0');
    expect(m.statement.text).toMatch(/^dT = \(8\.0 ± 8\.2\) mK\. /);
  });

  it('shows the Monte Carlo basis without a coverage factor, and says why it replaced the GUM figures', () => {
    const reported: BudgetResult['reported'] = {
      basis: 'monte-carlo',
      estimate: 12.01,
      standardUncertainty: 4.3,
      coverageProbability: 0.95,
      coverageFactor: null,
      expandedUncertainty: 8.6,
      interval: [3.5, 20.6],
      replacedGum: true,
      unvalidated: false,
    };
    const m = presentResult(document, { ...result, reported });
    expect(m.reported.coverageFactor).toBeNull();
    expect(m.reported.expandedUncertainty.text).toBe('8.6');
    expect(m.reported.interval.text).toBe('[3.5, 20.6]');
    expect(m.reported.notes.join(' ')).toMatch(/Monte Carlo coverage interval is reported/);
  });

  it('writes the c_i of temperatures in °C for a result in mK as −1 and 1, and ranks the terms', () => {
    const m = presentResult(document, result);
    expect(m.budget.rows.map((r) => r.sensitivity.figure.text)).toEqual(['1', '\u22121']);
    expect(m.budget.rows.every((r) => r.sensitivity.unit.text === '')).toBe(true);
    // shares 9/17.33 = 52 % and 8.33/17.33 = 48 %
    expect(m.budget.ranked.map((t) => `${t.symbol} ${t.share.text} ${t.cumulative.text}`)).toEqual(['t_a 52 % 52 %', 't_b 48 % 100 %']);
    expect(m.budget.dominant.text).toBe('u(t_a) contributes 52 % of the variance u_c².');
  });

  it('ranks equal shares by their symbols, whatever the order of the inputs', () => {
    // y = a + b + c with u(a) = u(b) = u(c): each a third of the variance (closed form)
    const tied = validateBudget({
      format: 'dubito-budget/1',
      title: 'Three equal terms',
      measurand: { symbol: 'y', unit: 'mm' },
      model: 'y = x_b + x_c + x_a',
      inputs: ['x_c', 'x_a', 'x_b'].map((symbol) => ({ symbol, unit: 'mm', distribution: { kind: 'normal', value: 1, u: 0.1 } })),
    });
    const m = presentResult(tied, computeBudget(tied, { monteCarlo: false }));
    expect(m.budget.ranked.map((t) => `${t.symbol} ${t.share.text}`)).toEqual(['x_a 33 %', 'x_b 33 %', 'x_c 33 %']);
  });

  it('gives each quantity the model defines its value in the budget’s own unit', () => {
    const m = presentResult(document, result);
    expect(modelValues(m)).toEqual({ t_mean: '20.008 °C', dT: '8.0 mK' });
  });
});

describe('the validation verdict in words (JCGM 101:2008 8)', () => {
  const base: ValidationResult = { significantDigits: 2, tolerance: 0.05, dLow: 0.01, dHigh: 0.02, passed: true };
  const mK = unitText('mK');
  it('validated, not validated, inconclusive, not possible', () => {
    expect(verdictView(base, mK).headline).toBe('The GUM result is validated by the Monte Carlo method.');
    const no = verdictView({ ...base, dHigh: 0.08, passed: false }, mK);
    expect(no.tone).toBe('warning');
    expect(no.detail.text).toMatch(/^At the upper end/);
    expect(no.detail.markup).toContain('d_{high} = 0.080 mK');
    expect(verdictView({ ...base, passed: false, verdict: 'inconclusive' }, mK).headline).toMatch(/inconclusive/);
    // The engine's inconclusive verdict carries the endpoints' numerical uncertainties: the figures come with the unit, in both writings.
    const unsure = verdictView({ ...base, dLow: 0.00015, dHigh: 0.038, passed: false, verdict: 'inconclusive', endpointUncertainty: [0.00021, 0.0225], reason: 'inconclusive at 10 trials' }, mK);
    expect(unsure.detail.text).toContain('d_low = 1.5×10⁻⁴ mK, d_high = 0.038 mK, δ = 0.050 mK');
    expect(unsure.detail.text).toContain('2u(y_low) = 4.2×10⁻⁴ mK, 2u(y_high) = 0.045 mK');
    expect(unsure.detail.markup).toContain('2u(y_{low}) = ');
    expect(unsure.detail.markup).not.toMatch(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁻]/);
    const impossible = verdictView({ ...base, passed: false, verdict: 'not-possible', reason: 'The input q has ν = 2: its t-distribution has no variance.' }, mK);
    expect(impossible.detail.text).toBe('The input q has ν = 2: its t-distribution has no variance.');
  });
});

describe('status words and the laboratory', () => {
  it('the status of a version follows the budget and the approval', () => {
    const budget = { currentVersion: 3, status: 'draft' as const, returned: true };
    expect(versionStatus(budget, { number: 3, approvedAt: null })).toBe('returned');
    expect(versionStatus(budget, { number: 2, approvedAt: null })).toBe('superseded');
    expect(versionStatus(budget, { number: 1, approvedAt: 1 })).toBe('approved');
    expect(STATUS_WORDS.superseded).toBe('Superseded draft');
    expect(labOf({ lab: ' Kestrel Fen Metrology Laboratory ' })).toBe('Kestrel Fen Metrology Laboratory');
    expect(labOf({})).toBe('Kestrel Fen Metrology Laboratory');
  });
});

describe('two versions compared', () => {
  it('each version’s figures as its own result shows them, and the change', () => {
    const d = (from: number, to: number) => ({ from, to, delta: to - from });
    const rows = compareResults({
      estimate: d(12.004, 12.01),
      standardUncertainty: d(4.163, 4.4),
      expandedUncertainty: d(8.16, 8.62),
      coverageFactor: d(1.96, 1.96),
      effectiveDof: d(2004, 57.3),
      monteCarlo: null,
      contributions: [],
    });
    const byLabel = Object.fromEntries(rows.map((r) => [r.label, r]));
    expect(rows.map((r) => r.symbol)).toEqual(['y', 'u_c', 'U', 'k', 'nu_eff']);
    expect(byLabel['Estimate'].from?.text).toBe('12.0');
    expect(byLabel['Expanded uncertainty'].to?.text).toBe('8.6');
    expect(byLabel['Expanded uncertainty'].change?.text).toBe('+0.46');
    expect(byLabel['Expanded uncertainty'].relative?.text).toBe('+5.6 %');
    expect(byLabel['Effective degrees of freedom'].from?.text).toBe('> 1000');
    expect(byLabel['Effective degrees of freedom'].to?.text).toBe('57.3');
    expect(byLabel['Coverage factor'].change).toBeNull();
  });
});

describe('an adaptive Monte Carlo run', () => {
  it('says how stable its figures are (JCGM 101:2008 7.9.4)', async () => {
    const { presentMonteCarlo } = await import('../../shared/presentation/result-model');
    const mc = computeBudget(document, { trials: 10_000, seed: 'adaptive-words' }).monteCarlo!;
    const stability = { sequenceLength: 10_000, sequences: 24, spread: { estimate: 0.004, standardUncertainty: 0.003, low: 0.011, high: 0.012 }, tolerance: 0.05, stabilized: true };
    const view = presentMonteCarlo({ ...result, monteCarlo: { ...mc, adaptive: true, trials: 240_000, stability } }).monteCarlo!;
    expect(view.heading).toBe('240\u202f000 trials (adaptive)');
    expect(view.stability).toBe(
      'Stable: 24 sequences of 10\u202f000 trials; twice the standard deviation of the sequence averages (y 0.0080 mK, u 0.0060 mK, ends 0.022 mK and 0.024 mK) is within the tolerance δ = 0.050 mK (JCGM 101:2008 7.9.4).',
    );
  });
});
