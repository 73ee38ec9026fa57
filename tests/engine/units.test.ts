import { create, createUnitDependencies, unitDependencies } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { BudgetError } from '../../shared/budget/budget-error';
import { computeBudget } from '../../shared/compute/compute-budget';
import { describeDimension, parseUnit, toMathUnit, withBudgetUnits } from '../../shared/model/units';
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
    expect(parseUnit('kg/m^3').dimension).toEqual(parseUnit('g/L').dimension);
    expect(describeDimension(parseUnit('kg/m^3').dimension)).toBe('kg m^-3');
    expect(parseUnit('degC').factor).toBe(1); // a Celsius difference has the size of the kelvin
    expect(parseUnit('%').factor).toBe(0.01);
    expect(() => parseUnit('furlongs per fortnight')).toThrow(/unknown unit/);
  });

  it('reads units as typeset: superscript exponents, the minus sign, · and × between units', () => {
    expect(parseUnit('m²').dimension).toEqual(parseUnit('m^2').dimension);
    expect(parseUnit('kg·m⁻³').factor).toBe(1);
    expect(parseUnit('kg·m⁻³').dimension).toEqual(parseUnit('kg/m^3').dimension);
    expect(parseUnit('m·s^−2').dimension).toEqual(parseUnit('m/s^2').dimension);
    expect(parseUnit('mm²').factor).toBeCloseTo(1e-6, 21);
    expect(parseUnit('N×m').dimension).toEqual(parseUnit('J').dimension);
    expect(parseUnit('µs⁻¹').factor).toBeCloseTo(1e6, 6);
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

  it('labels a result in kΩ with the unit its value is in', () => {
    // the value 2 kΩ × 3 is 6 kΩ: label and number must say the same (formerly "1" beside 6000 Ω)
    const r = computeBudget(budget('R = a * b', { a: [N(2, 0.01), 'kΩ'], b: [N(3, 0.01), '1'] }), { monteCarlo: false });
    expect(r.measurand.unit).toBe('kohm');
    expect(r.gum.estimate).toBeCloseTo(6, 12);
    expect(parseUnit('kΩ').factor).toBe(1000);
  });

  it('falls back to SI base units, with the value in them, where the model unit cannot be told from the inputs', () => {
    // exp of a value in ppm is a number to the engine but a unit to mathjs: the label is the dimension, the value in Ω
    const r = computeBudget(budget('R = a * exp(b)', { a: [N(2, 0.01), 'kohm'], b: [N(0, 1), 'ppm'] }), { monteCarlo: false });
    expect(r.measurand.unit).toBe('kg m^2 s^-3 A^-2');
    expect(r.gum.estimate).toBeCloseTo(2000, 9);
  });
});

describe('units budgets write that mathjs lacks or misreads', () => {
  it('reads %, ppm and ppb as the numbers 1e-2, 1e-6, 1e-9, also per kelvin (SI Brochure 9th ed. 5.4.7, from memory)', () => {
    expect(parseUnit('ppm/K').factor).toBeCloseTo(1e-6, 21);
    expect(parseUnit('ppm/K').dimension).toEqual(parseUnit('1/K').dimension);
    expect(parseUnit('%/K').factor).toBeCloseTo(1e-2, 17);
    expect(parseUnit('ppm/degC').factor).toBeCloseTo(1e-6, 21);
    expect(parseUnit('ppb').factor).toBeCloseTo(1e-9, 24);
    // R(t) = R0 (1 + α (t − t0)): 100 Ω, α = 3 900 ppm/K, 5 K above t0 → 101.95 Ω (closed form)
    const doc = budget('R = R0 * (1 + alpha * (t - t0))', {
      R0: [N(100, 0.001), 'ohm'],
      alpha: [N(3900, 1), 'ppm/K'],
      t: [N(25, 0.01), 'degC'],
      t0: [N(20, 0), 'degC'],
    });
    doc.measurand.unit = 'ohm';
    const r = gum(doc);
    expect(r.estimate).toBeCloseTo(101.95, 10);
    expect(r.contributions[1].sensitivity).toBeCloseTo(100 * 1e-6 * 5, 15); // Ω per ppm/K
    const pct = budget('R = R0 * (1 + alpha * (t - t0))', {
      R0: [N(100, 0.001), 'ohm'],
      alpha: [N(0.39, 0.001), '%/K'],
      t: [N(25, 0.01), 'degC'],
      t0: [N(20, 0), 'degC'],
    });
    pct.measurand.unit = 'ohm';
    expect(gum(pct).estimate).toBeCloseTo(101.95, 10);
  });

  it('reads rpm as 1/60 s⁻¹ (ISO 80000-3 rotational frequency: one revolution per minute) and lx as cd/m² with sr = 1 (SI Brochure 9th ed., table 4, from memory)', () => {
    expect(parseUnit('rpm').factor).toBeCloseTo(1 / 60, 15);
    const speed = budget('f = n', { n: [N(3000, 1), 'rpm'] });
    speed.measurand.unit = 'Hz';
    expect(gum(speed).estimate).toBeCloseTo(50, 12);
    // inverse-square law E = I/d²: 100 cd at 2 m → 25 lx
    const light = budget('E = I / d^2', { I: [N(100, 1), 'cd'], d: [N(2, 0.001), 'm'] });
    light.measurand.unit = 'lx';
    expect(gum(light).estimate).toBeCloseTo(25, 12);
    expect(parseUnit('klx').factor).toBe(1000);
  });

  it('keeps dB a level that adds only to levels in dB', () => {
    const doc = budget('L = L1 + dL', { L1: [N(20, 0.01), 'dB'], dL: [N(0.05, 0.01), 'dB'] });
    doc.measurand.unit = 'dB';
    expect(gum(doc).estimate).toBeCloseTo(20.05, 12);
    expect(refusal(budget('L = L1 + r', { L1: [N(20, 0.01), 'dB'], r: [N(1, 0.01), '1'] })).message).toContain('their units differ');
    expect(refusal(budget('r = 10^(L1 / 10)', { L1: [N(20, 0.01), 'dB'] })).message).toContain('must be dimensionless');
    // a ratio: the level without unit, converted in the model (10^(20/10) = 100)
    expect(gum(budget('r = 10^(L1 / 10)', { L1: N(20, 0.01) })).estimate).toBeCloseTo(100, 10);
  });

  const misread: [string, RegExp][] = [
    ['pH', /"pH" is a quantity, not a unit: leave the unit of a pH value empty .* write "picohenry"/],
    ['%RH', /write "%" and say "relative humidity"/],
    ['ppt', /write "1e-12"/],
    ['dBm', /write "dB" for a level/],
    ['pH/K', /"pH" is a quantity/],
  ];
  it.each(misread)('refuses "%s" and says what to write instead', (unit, message) => {
    expect(() => parseUnit(unit)).toThrow(message);
    const e = refusal(budget('Y = a', { a: [N(7, 0.01), unit] }));
    expect(e.field).toBe('inputs[0].unit');
    expect(e.message).toMatch(message);
  });

  it('still reads the inductance as "picohenry" and a pH value without unit', () => {
    expect(parseUnit('picohenry').factor).toBeCloseTo(1e-12, 27);
    expect(gum(budget('pH = a', { a: N(7.01, 0.01) })).estimate).toBe(7.01);
  });
});

describe('the temperature rule (°C and °F without offset; scales never mixed)', () => {
  it('refuses 50 °C − 323 K instead of giving −273 K, naming both quantities', () => {
    // SI Brochure 2.3.1: t/°C = T/K − 273.15, so 50 °C is 323.15 K; without the offset the difference would read −273 K
    const doc = budget('d = t1 - T2', { t1: [N(50, 0.1), 'degC'], T2: [N(323, 0.1), 'K'] });
    doc.measurand.unit = 'mK';
    const e = refusal(doc);
    expect(e.code).toBe('unit');
    expect(e.message).toContain('"t1" is a temperature in °C and "T2" one in K');
    expect(e.message).toContain('the temperature rule');
    expect(e.location).toEqual({ line: 1, token: '-' });
    // the same in one unit: 50 °C − 49.85 °C = 150 mK
    const same = budget('d = t1 - t2', { t1: [N(50, 0.1), 'degC'], t2: [N(49.85, 0.1), 'degC'] });
    same.measurand.unit = 'mK';
    expect(gum(same).estimate).toBeCloseTo(150, 9);
  });

  it('refuses a correction in mK added to a reading in °C, and min/max across scales', () => {
    expect(refusal(budget('t = t_r + dt', { t_r: [N(20, 0.01), 'degC'], dt: [N(5, 1), 'mK'] })).message).toContain('0.005 degC');
    expect(refusal(budget('t = max(t1, T2)', { t1: [N(20, 0.01), 'degC'], T2: [N(293, 1), 'K'] })).message).toContain('the temperature rule');
    expect(refusal(budget('t = t1 - t2', { t1: [N(68, 0.01), 'degF'], t2: [N(20, 0.01), 'degC'] })).message).toContain('°F');
  });

  it('lets a difference of temperatures on one scale meet any scale and any unit', () => {
    const doc = budget('dT = t1 - t2\nT = T0 + dT', { t1: [N(25, 0.01), 'degC'], t2: [N(20, 0.01), 'degC'], T0: [N(293.15, 0.01), 'K'] });
    doc.measurand.unit = 'K';
    const r = gum(doc);
    expect(r.estimate).toBeCloseTo(298.15, 10);
    expect(r.intermediates[0].unit).toBe('K'); // a difference: the same in K and °C
    // 68 °F − 50 °F = 18 °F = 10 K (an interval of 1 °F is 5/9 K)
    const f = budget('d = t1 - t2', { t1: [N(68, 0.01), 'degF'], t2: [N(50, 0.01), 'degF'] });
    f.measurand.unit = 'K';
    expect(gum(f).estimate).toBeCloseTo(10, 12);
  });

  it('computes a thermodynamic temperature from one in °C as T0 + (t − t0) (SI Brochure 2.3.1: T = t + 273.15 K)', () => {
    // ideal gas density ρ = p·M/(R·T): 101 325 Pa, 28.96 g/mol, 20 °C → 1.2041 kg/m³ (closed form below)
    const doc = budget('T = T0 + (t - t0)\nrho = p * M / (R * T)', { t: [N(20, 0.01), 'degC'], p: [N(101325, 1), 'Pa'], M: [N(28.96, 0.001), 'g/mol'] }, {
      constants: [
        { symbol: 'T0', value: 273.15, unit: 'K' },
        { symbol: 't0', value: 0, unit: 'degC' },
        { symbol: 'R', value: 8.314462618, unit: 'J/(mol K)' },
      ],
    } as never);
    doc.measurand.unit = 'kg/m^3';
    const r = gum(doc);
    expect(r.intermediates[0]).toMatchObject({ symbol: 'T', unit: 'K' });
    expect(r.intermediates[0].value).toBeCloseTo(293.15, 12);
    expect(r.estimate).toBeCloseTo((101325 * 0.02896) / (8.314462618 * 293.15), 12);
    // the shortcut T0 + t is the mix the rule refuses
    const mix = budget('T = T0 + t', { t: [N(20, 0.01), 'degC'] }, { constants: [{ symbol: 'T0', value: 273.15, unit: 'K' }] } as never);
    expect(refusal(mix).message).toContain('T0 + (t - t0)');
  });

  it('states a Celsius result in °C, and refuses to show it in K', () => {
    const inputs = { t_r: [N(20, 0.01), 'degC'], dt: [N(0.005, 0.001), 'degC'] } as const;
    const r = computeBudget(budget('t = t_r + dt', { ...inputs } as never), { monteCarlo: false });
    expect(r.measurand.unit).toBe('degC');
    expect(r.gum.estimate).toBeCloseTo(20.005, 12);
    const inK = budget('t = t_r + dt', { ...inputs } as never);
    inK.measurand.unit = 'K';
    const e = refusal(inK);
    expect(e.field).toBe('measurand.unit');
    expect(e.message).toContain('write the measurand unit as degC');
    // an intermediate on the Fahrenheit scale is stated in °F, not in 5/9 of its value
    const f = computeBudget(budget('tf = t1 + t2\nY = tf - t2', { t1: [N(68, 0.01), 'degF'], t2: [N(1, 0.01), 'degF'] }), { monteCarlo: false });
    expect(f.gum.intermediates[0]).toMatchObject({ unit: 'degF' });
    expect(f.gum.intermediates[0].value).toBeCloseTo(69, 12);
  });
});

describe('the unit system on number arithmetic', () => {
  // The parsing instance makes its Unit class from mathjs's number-only arithmetic (it is faster to make); every unit must read as
  // with mathjs's own arithmetic: the same SI factor, the same exponent of every base dimension, the same units, the same refusals.
  const shipped = withBudgetUnits(create({ unitDependencies, createUnitDependencies }));
  const UNITS = [
    ...['1/degC', 'V', 'degC', 'g/mL', 'kg/m^3', 'mg', 'mm', 'nm', 'uL', 'uV'], // the units of the examples
    ...['µm', 'kΩ', 'mΩ', 'uohm', 'degF', '%', 'ppm', 'ppb', 'rpm', 'lx', 'klx', 'lm', 'dB', 'mol/L', 'mmol/mL', 'J/(mol K)', 'Pa', 'hPa', 'bar', 'mmHg', 'psi'],
    ...['m²', 'kg·m⁻³', 'N×m', 'µs⁻¹', 'm·s^−2', 'm^0.5', 'Hz^-0.5', 'ppm/K', '%/K', 'ppm/degC', 'mm/degC', 'um/m', 'kWh', 'eV', 'inch', 'deg', 'rad/s', 'mol/(kg s)', 'cd', 'bit', 'kB', 'lbm', 'gal'],
  ];
  it.each(UNITS)('reads %s as mathjs with its full arithmetic does', (text) => {
    const lean = toMathUnit(text);
    const full = toMathUnit(text, shipped);
    expect(lean.value).toBe(full.value);
    expect(lean.dimensions).toEqual(full.dimensions);
    expect(lean.units.map((u) => [u.unit.name, u.power])).toEqual(full.units.map((u) => [u.unit.name, u.power]));
    expect(lean.toString()).toBe(full.toString());
  });
  it.each(['blorbs', 'pH', 'ppt', 'dBm', 'm +', '%RH'])('refuses %s as mathjs with its full arithmetic does', (text) => {
    const why = (read: () => unknown) => {
      try {
        read();
      } catch (e) {
        return (e as Error).message;
      }
      return 'read';
    };
    expect(why(() => toMathUnit(text))).toBe(why(() => toMathUnit(text, shipped)));
    expect(why(() => toMathUnit(text))).not.toBe('read');
  });
});
