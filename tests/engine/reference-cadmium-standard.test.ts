import { describe, expect, it } from 'vitest';
import { computeBudget } from '../../shared/compute/compute-budget';
import { budget, N } from '../support/budget-builder';

/*
 * EURACHEM/CITAC Guide CG 4 (QUAM, 3rd ed.) example A1, preparation of a
 * cadmium calibration standard, c = 1000·m·P/V (from memory):
 * m = 100.28 mg (u 0.05 mg), P = 0.9999 (u 0.000058), V = 100.0 mL (u 0.066 mL)
 * give c = 1002.7 mg/L with u_c = 0.83 mg/L (0.9 mg/L as reported).
 */
describe('EURACHEM/CITAC QUAM A1 cadmium standard', () => {
  it('with the guide’s factor 1000 and no units', () => {
    const r = computeBudget(budget('c = 1000 * m * P / V', { m: N(100.28, 0.05), P: N(0.9999, 0.000058), V: N(100.0, 0.066) }), { monteCarlo: false }).gum;
    expect(r.estimate).toBeCloseTo(1002.7, 1);
    expect(r.standardUncertainty).toBeCloseTo(0.83, 2);
  });

  it('with units: mg and mL convert to the measurand unit mg/L without the factor', () => {
    const doc = budget('c = m * P / V', { m: [N(100.28, 0.05), 'mg'], P: N(0.9999, 0.000058), V: [N(100.0, 0.066), 'mL'] });
    doc.measurand.unit = 'mg/L';
    const r = computeBudget(doc, { monteCarlo: false });
    expect(r.measurand.unit).toBe('mg/L');
    expect(r.gum.estimate).toBeCloseTo(1002.7, 1);
    expect(r.gum.standardUncertainty).toBeCloseTo(0.83, 2);
    // c_V = −c/V in (mg/L)/mL: −1002.7/100 ≈ −10.03 (JCGM 100:2008 5.1.3)
    expect(r.gum.contributions[2].sensitivity).toBeCloseTo(-10.027, 2);
  });
});
