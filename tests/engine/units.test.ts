import { describe, expect, it } from 'vitest';
import { BudgetError } from '../../shared/budget/budget-error';
import { computeBudget } from '../../shared/compute/compute-budget';
import { parseUnit } from '../../shared/model/units';
import { budget, N } from '../support/budget-builder';

const gum = (doc: ReturnType<typeof budget>) => computeBudget(doc, { monteCarlo: false }).gum;
function refusal(doc: ReturnType<typeof budget>): BudgetError {
  try {
    computeBudget(doc, { monteCarlo: false });
  } catch (e) {
    if (e instanceof BudgetError) return e;
    throw e;
  }
  throw new Error('accepted');
}

describe('units (SI Brochure, 9th ed.: prefixes and derived units)', () => {
  it('parses SI prefixes and derived units to their SI factors', () => {
    expect(parseUnit('mg').factor).toBeCloseTo(1e-6, 20); // 1 mg = 10⁻⁶ kg
    expect(parseUnit('µm').factor).toBeCloseTo(1e-6, 20);
    expect(parseUnit('mol/mL').factor).toBeCloseTo(1e6, 6); // 1 mol/mL = 10⁶ mol/m³
    expect(parseUnit('kg/m^3').dimension).toEqual([1, -3, 0, 0, 0, 0, 0]);
    expect(parseUnit('degC').factor).toBe(1); // a Celsius difference has the size of the kelvin
    expect(parseUnit('%').factor).toBe(0.01);
    expect(() => parseUnit('furlongs per fortnight')).toThrow(/unknown unit/);
  });

  it('converts the result to the measurand unit: mol/mL → mol/L', () => {
    const doc = budget('c = n / V', { n: [N(2, 0.01), 'mmol'], V: [N(1, 0.001), 'mL'] });
    doc.measurand.unit = 'mol/L';
    expect(gum(doc).estimate).toBeCloseTo(2, 12); // 2 mmol/mL = 2 mol/L
  });

  it('adds mg and g correctly and reports c in measurand unit per input unit', () => {
    const doc = budget('m = a + b', { a: [N(1, 0.001), 'g'], b: [N(500, 1), 'mg'] });
    doc.measurand.unit = 'mg';
    const r = gum(doc);
    expect(r.estimate).toBeCloseTo(1500, 9);
    expect(r.contributions[0].sensitivity).toBeCloseTo(1000, 9); // mg per g
    expect(r.contributions[1].sensitivity).toBeCloseTo(1, 12);
    expect(r.standardUncertainty).toBeCloseTo(Math.SQRT2, 9);
  });

  it('treats degC as a temperature difference in sums and products', () => {
    const doc = budget('L = L0 * (1 + alpha * (t - t0))', {
      L0: [N(100, 0.001), 'mm'],
      alpha: [N(11.5e-6, 1e-6), '1/degC'],
      t: [N(25, 0.1), 'degC'],
      t0: [N(20, 0), 'degC'],
    });
    doc.measurand.unit = 'mm';
    expect(gum(doc).estimate).toBeCloseTo(100 * (1 + 11.5e-6 * 5), 10);
  });

  it('takes trigonometric arguments in radians, also when given in degrees', () => {
    const doc = budget('h = L * sin(phi)', { L: [N(2, 0.01), 'm'], phi: [N(30, 0.1), 'deg'] });
    doc.measurand.unit = 'm';
    expect(gum(doc).estimate).toBeCloseTo(1, 12);
  });

  it('refuses a sum of different dimensions and names both quantities', () => {
    const doc = budget('Y = a + b', { a: [N(1, 0.1), 'mg'], b: [N(1, 0.1), 'mm'] });
    const e = refusal(doc);
    expect(e.code).toBe('unit');
    expect(e.message).toContain('"a"');
    expect(e.message).toContain('"b"');
    expect(e.message).toContain('their units differ');
  });

  it('refuses a result that cannot be expressed in the measurand unit', () => {
    const doc = budget('Y = a * b', { a: [N(1, 0.1), 'V'], b: [N(1, 0.1), 'mA'] });
    doc.measurand.unit = 'ohm';
    const e = refusal(doc);
    expect(e.field).toBe('measurand.unit');
  });

  it('refuses exp of a quantity with a unit, and an exponent with a unit', () => {
    expect(refusal(budget('Y = exp(a)', { a: [N(1, 0.1), 's'] })).message).toContain('"exp" needs a dimensionless argument');
    expect(refusal(budget('Y = 2^a', { a: [N(1, 0.1), 's'] })).message).toContain('must be dimensionless');
  });

  it('refuses an unknown unit naming the field', () => {
    const e = refusal(budget('Y = a', { a: [N(1, 0.1), 'blorbs'] }));
    expect(e.field).toBe('inputs[0].unit');
  });

  it('keeps the unit the model yields when the measurand has none', () => {
    const r = computeBudget(budget('P = U * I', { U: [N(10, 0.1), 'V'], I: [N(2, 0.01), 'mA'] }), { monteCarlo: false });
    expect(r.measurand.unit).toBe('V mA');
    expect(r.gum.estimate).toBeCloseTo(20, 12);
  });
});
