import { describe, expect, it } from 'vitest';
import { BudgetError } from '../../shared/budget/budget-error';
import { computeBudget } from '../../shared/compute/compute-budget';
import { unitSymbol } from '../../shared/format/unit-symbols';
import { parseUnit } from '../../shared/model/units';
import { budget, N } from '../support/budget-builder';

/*
 * Names of Object.prototype members (and __proto__) are ordinary symbols: a
 * table looked up with `name in table` or `table[name]` would find the
 * inherited member instead of nothing, and accept what it should refuse.
 */
const NAMES = [...new Set([...Object.getOwnPropertyNames(Object.prototype), '__proto__'])];

function refusal(doc: ReturnType<typeof budget>): BudgetError {
  try {
    computeBudget(doc, { monteCarlo: false });
  } catch (e) {
    if (e instanceof BudgetError) return e;
    throw e;
  }
  throw new Error('accepted');
}

describe('symbols named after Object.prototype members', () => {
  it('covers every member', () => {
    expect(NAMES).toEqual(expect.arrayContaining(['constructor', 'toString', 'valueOf', 'hasOwnProperty', '__proto__', '__defineGetter__']));
  });

  it.each(NAMES)('"%s" as an input keeps its unit through the dimensional check', (name) => {
    // exp of a length is refused like for any other name
    const e = refusal(budget(`Y = exp(${name})`, { [name]: [N(1, 0.1), 'm'] }));
    expect(e.code).toBe('unit');
    expect(e.message).toBe(`model line 1: "exp" needs a dimensionless argument, but "${name}" has unit m`);
    // mm · mm is an area: 2 mm × 3 mm = 6 mm², and cannot be stored as mm
    const area = budget(`Y = a * ${name}`, { a: [N(2, 0.1), 'mm'], [name]: [N(3, 0.1), 'mm'] });
    const r = computeBudget(area, { monteCarlo: false });
    expect(r.measurand.unit).toBe('mm mm');
    expect(r.gum.estimate).toBeCloseTo(6, 12);
    area.measurand.unit = 'mm';
    expect(refusal(area).field).toBe('measurand.unit');
    area.measurand.unit = 'mm^2';
    expect(computeBudget(area, { monteCarlo: false }).gum.contributions.map((c) => c.sensitivity)).toEqual([3, 2]);
  });

  it.each(NAMES)('"%s" as a constant carries its value and unit', (name) => {
    const doc = budget(`Y = a * ${name}`, { a: [N(2, 0.1), 'mm'] }, { constants: [{ symbol: name, value: 3, unit: 'cm' }] } as never);
    doc.measurand.unit = 'mm^2';
    expect(computeBudget(doc, { monteCarlo: false }).gum.estimate).toBeCloseTo(60, 12); // 2 mm × 30 mm
  });

  it.each(NAMES)('"%s" as an intermediate line and as the measurand', (name) => {
    const r = computeBudget(budget(`${name} = a * 2\nY = ${name} + a`, { a: [N(2, 0.1), 'g'] }), { monteCarlo: false });
    expect(r.gum.estimate).toBeCloseTo(6, 12);
    expect(r.gum.contributions[0].sensitivity).toBeCloseTo(3, 12);
    expect(r.gum.intermediates[0]).toMatchObject({ symbol: name, unit: 'kg' });
    const m = budget(`${name} = a / 2`, { a: N(3, 0.1) });
    expect(computeBudget(m, { monteCarlo: false }).gum.estimate).toBe(1.5);
  });

  it.each(NAMES)('"%s" as a function is refused by name, without code in the message', (name) => {
    const e = refusal(budget(`Y = ${name}(a)`, { a: N(2, 0.1) }));
    expect(e.code).toBe('model_forbidden');
    expect(e.message).toBe(`model line 1: the function "${name}" is not allowed; allowed are sqrt, exp, log, log10, sin, cos, tan, asin, acos, atan, atan2, abs, min, max`);
    expect(e.location).toEqual({ line: 1, token: name });
  });

  it.each(NAMES)('"%s" as a unit is unknown, and typesets as itself', (name) => {
    expect(() => parseUnit(name)).toThrow(`unknown unit "${name}"`);
    expect(unitSymbol(name)).toBe(name);
  });
});
