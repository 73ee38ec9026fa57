import { describe, expect, it } from 'vitest';
import { fieldChanges } from '../../server/budgets/budget-diff';
import { fieldName } from '../../shared/presentation/field-names';

describe('fields of a budget file in words', () => {
  it('names the fields of an input by the quantity and its symbol (JCGM 100:2008 4.3.7, 6.2, G.3)', () => {
    expect(fieldName('distribution.halfWidth')).toBe('half-width a');
    expect(fieldName('distribution.U')).toBe('expanded uncertainty U');
    expect(fieldName('distribution.u')).toBe('standard uncertainty u');
    expect(fieldName('distribution.k')).toBe('coverage factor k');
    expect(fieldName('distribution.p')).toBe('coverage probability p');
    expect(fieldName('distribution.dof')).toBe('degrees of freedom ν');
    expect(fieldName('distribution.stated.as')).toBe('stated as');
    expect(fieldName('distribution.uncertaintyUnit')).toBe('uncertainty unit');
    expect(fieldName('unit')).toBe('unit');
    expect(fieldName('description')).toBe('description');
    expect(fieldName('r')).toBe('correlation coefficient r');
  });

  it('names the settings of the budget, the Monte Carlo ones as JCGM 101:2008 7.2 and 7.9 write them', () => {
    expect(fieldName('model')).toBe('model');
    expect(fieldName('coverageProbability')).toBe('coverage probability p');
    expect(fieldName('monteCarlo.trials')).toBe('trials M');
    expect(fieldName('monteCarlo.seed')).toBe('seed');
    expect(fieldName('reporting.k')).toBe('coverage factor k');
  });

  it('gives a path it does not know as it is, also one that names a property every object has', () => {
    expect(fieldName('distribution.skewness')).toBe('distribution.skewness');
    expect(fieldName('laboratoryNote')).toBe('laboratoryNote');
    expect(fieldName('toString')).toBe('toString');
    expect(fieldName('constructor')).toBe('constructor');
  });

  it('words every path the comparison reports for a changed input', () => {
    const before = { symbol: 'dL_res', unit: 'um', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.05, stated: { as: 'resolution' } } };
    const after = { symbol: 'dL_res', unit: 'nm', distribution: { kind: 'normal', value: 0, U: 0.04, k: 2, dof: 12, stated: { as: 'certificate', source: 'KF-2291' } } };
    const names = fieldChanges(before, after).map((c) => fieldName(c.field));
    expect(names).toEqual(['expanded uncertainty U', 'degrees of freedom ν', 'half-width a', 'coverage factor k', 'distribution', 'stated as', 'source of the statement', 'unit']);
  });
});
