import { describe, expect, it } from 'vitest';
import { parseBudgetFile, serializeBudget, validateBudget } from '../../shared/budget/budget-file';

const base = {
  format: 'dubito-budget/1',
  title: 'Weight KF-W200 by substitution',
  measurand: { symbol: 'm', unit: 'g' },
  model: 'm = m_ref + dm',
  inputs: [
    { symbol: 'm_ref', unit: 'g', distribution: { kind: 'normal', value: 200, U: 0.0001, k: 2 } },
    { symbol: 'dm', unit: 'g', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.00005 } },
  ],
};

describe('the record of the measurement in the budget file (ISO/IEC 17025 7.8)', () => {
  it('keeps procedure, equipment and environment through validation and export', () => {
    const doc = validateBudget({ ...base, procedure: 'KF-MAS-002 rev. 4', equipment: ['KF-BAL-3', 'KF-W200-REF'], environment: '(20.3 ± 0.5) °C' });
    const again = parseBudgetFile(serializeBudget(doc));
    expect(again.procedure).toBe('KF-MAS-002 rev. 4');
    expect(again.equipment).toEqual(['KF-BAL-3', 'KF-W200-REF']);
    expect(again.environment).toBe('(20.3 ± 0.5) °C');
  });

  it('are optional, and refused when of the wrong kind', () => {
    expect(validateBudget(base).equipment).toBeUndefined();
    expect(() => validateBudget({ ...base, equipment: 'KF-BAL-3' })).toThrow(/equipment/);
  });
});
