import { describe, expect, it } from 'vitest';
import { BudgetError } from '../../shared/budget/budget-error';
import { serializeBudget, validateBudget, parseBudgetFile } from '../../shared/budget/budget-file';
import type { Distribution, InputQuantity } from '../../shared/budget/schema';
import { statedValueOf } from '../../shared/budget/stated-value';
import { computeBudget } from '../../shared/compute/compute-budget';
import { normalCoverageFactor } from '../../shared/distributions/normal';
import { gumTreatment, samplerFor } from '../../shared/distributions/registry';
import { inValueUnit, uncertaintyScale } from '../../shared/distributions/uncertainty-unit';
import { budget } from '../support/budget-builder';

const D = (d: Record<string, unknown>) => d as Distribution;
const input = (unit: string | undefined, d: Record<string, unknown>): InputQuantity => ({ symbol: 'x', unit, distribution: D(d) });

function refusal(run: () => unknown): BudgetError {
  try {
    run();
  } catch (e) {
    if (e instanceof BudgetError) return e;
    throw e;
  }
  throw new Error('accepted');
}

describe('U stated with its coverage probability p instead of k', () => {
  it('takes k = z_{(1+p)/2} without ν and t_{(1+p)/2}(ν) with ν (GUM G.3.4, G.6.4; EA-4/02 M:2022 5.3)', () => {
    // z_0.975 = 1.959964 and t_0.975(9) = 2.262157 (GUM Table G.2: 1.960, 2.26; recomputed with scipy.stats norm.ppf / t.ppf)
    expect(normalCoverageFactor({ U: 0.03, p: 0.95 })).toBeCloseTo(1.959964, 5);
    expect(normalCoverageFactor({ U: 0.03, p: 0.95, dof: 9 })).toBeCloseTo(2.262157, 5);
    expect(normalCoverageFactor({ U: 0.03, k: 2 })).toBe(2);
    expect(normalCoverageFactor({ u: 0.01 })).toBeNull();
    // u = U/k = 0.030/2.262157 = 0.0132617 (scipy)
    expect(gumTreatment(D({ kind: 'normal', value: 0.052, U: 0.03, p: 0.95, dof: 9 })).standardUncertainty).toBeCloseTo(0.0132617, 6);
  });

  it('refuses k and p together, and U without either, naming the field', () => {
    const bad = (d: Record<string, unknown>) => refusal(() => validateBudget(budget('Y = x', { x: D(d) })));
    expect(bad({ kind: 'normal', value: 1, U: 0.1, k: 2, p: 0.95 }).field).toBe('inputs[0].distribution.p');
    expect(bad({ kind: 'normal', value: 1, U: 0.1 }).field).toBe('inputs[0].distribution.k');
    expect(bad({ kind: 'normal', value: 1, U: 0.1, p: 95 }).message).toMatch(/write 0.95 for 95 %/);
    expect(bad({ kind: 'normal', value: 1, u: 0.1, p: 0.95 }).field).toBe('inputs[0].distribution.u');
  });

  it('computes the budget with that k: y = x gives u_c = U/t_0.975(9) and ν_eff = 9', () => {
    const r = computeBudget(budget('Y = x', { x: [D({ kind: 'normal', value: 0.052, U: 0.03, p: 0.95, dof: 9 }), 'mg'] }), { monteCarlo: false });
    expect(r.gum.standardUncertainty).toBeCloseTo(0.0132617, 6);
    expect(r.gum.effectiveDof).toBe(9);
  });

  it('draws value + (U/k)·t_9, so the Monte Carlo 95 % interval is y ± U as the certificate states (JCGM 101:2008 6.4.9.7)', () => {
    const r = computeBudget(budget('Y = x', { x: [D({ kind: 'normal', value: 0.052, U: 0.03, p: 0.95, dof: 9 }), 'mg'] }), { trials: 100_000, seed: 'stated-p' });
    const [low, high] = r.monteCarlo!.interval;
    // the 2.5 % and 97.5 % quantiles of 0.052 + 0.0132617·t_9 are 0.052 ∓ 0.030; their sampling standard
    // deviation at 10⁵ trials is √(0.025·0.975/10⁵)/f ≈ 1.6×10⁻⁴ mg (f, the density there, from scipy t(9).pdf(2.262)/0.0132617)
    expect(Math.abs(low - 0.022)).toBeLessThan(1e-3);
    expect(Math.abs(high - 0.082)).toBeLessThan(1e-3);
  });
});

describe('an uncertainty in its own unit (ISO 80000-1 quantity calculus)', () => {
  it('converts U = 12 mK with k = 2 on a value in °C to u = 0.006 °C', () => {
    // 12 mK = 0.012 K, and a Celsius difference has the size of the kelvin: u = 0.012/2 °C
    const d = D({ kind: 'normal', value: 20.3, U: 12, k: 2, uncertaintyUnit: 'mK' });
    expect(gumTreatment(d, 'degC').standardUncertainty).toBeCloseTo(0.006, 15);
    const r = computeBudget(budget('Y = t', { t: [d, 'degC'] }, { measurand: { symbol: 'Y', unit: 'degC' } }), {
      trials: 100_000,
      seed: 'stated-mK',
    });
    expect(r.gum.standardUncertainty).toBeCloseTo(0.006, 12);
    // the sampler draws in °C too: the Monte Carlo u agrees with 0.006 to sampling error (≈ 0.006/√(2·10⁵) relative ≈ 0.2 %)
    expect(r.monteCarlo!.standardUncertainty).toBeGreaterThan(0.006 * 0.99);
    expect(r.monteCarlo!.standardUncertainty).toBeLessThan(0.006 * 1.01);
  });

  it('converts u = 0.5 µm for a value in mm to 0.0005 mm, and a °F difference by 5/9', () => {
    expect(gumTreatment(D({ kind: 'normal', value: 25, u: 0.5, uncertaintyUnit: 'µm' }), 'mm').standardUncertainty).toBeCloseTo(5e-4, 15);
    // 1.8 °F is a difference of 1 K (°F has the size 5/9 K, no offset)
    expect(gumTreatment(D({ kind: 'normal', value: 300, u: 1.8, uncertaintyUnit: 'degF' }), 'K').standardUncertainty).toBeCloseTo(1, 12);
  });

  it('reads %, ppm and ppb relative to |value| for a value with a dimension: ± 5 ppm of 100 Ω gives u = 2.886 751×10⁻⁴ Ω', () => {
    // a = 5×10⁻⁶ · 100 Ω = 5×10⁻⁴ Ω, u = a/√3 = 2.886751×10⁻⁴ Ω (GUM 4.3.7; scipy-free closed form)
    const d = D({ kind: 'rectangular', value: 100, halfWidth: 5, uncertaintyUnit: 'ppm', stated: { as: 'specification' } });
    expect(gumTreatment(d, 'ohm').standardUncertainty).toBeCloseTo(2.886751e-4, 10);
    expect(uncertaintyScale('ppm', 'ohm')).toEqual({ factor: 1e-6, relative: true });
    // relative to |value|: a negative value gives the same u
    expect(gumTreatment(D({ kind: 'normal', value: -100, u: 1, uncertaintyUnit: '%' }), 'mV').standardUncertainty).toBeCloseTo(1, 12);
  });

  it('reads a ratio unit as an absolute amount for a value in a ratio unit: 2 % of a value in % is 2 %', () => {
    expect(uncertaintyScale('%', '%')).toEqual({ factor: 1, relative: false });
    expect(gumTreatment(D({ kind: 'normal', value: 45, U: 2, k: 2, uncertaintyUnit: '%' }), '%').standardUncertainty).toBe(1);
    expect(uncertaintyScale('%', 'ppm').factor).toBeCloseTo(1e4, 8);
  });

  it('refuses kg for a value in m, naming the field', () => {
    const e = refusal(() => computeBudget(budget('Y = x', { x: [D({ kind: 'normal', value: 1, u: 1, uncertaintyUnit: 'kg' }), 'm'] }), { monteCarlo: false }));
    expect(e.field).toBe('inputs[0].distribution.uncertaintyUnit');
    expect(e.message).toMatch(/^inputs\[0\]\.distribution\.uncertaintyUnit: "kg" \(kg\) cannot state an uncertainty of a value in "m" \(m\)/);
  });

  it('refuses a ratio unit for a value without unit (absolute or relative cannot be told) and a relative u of a value 0', () => {
    expect(() => uncertaintyScale('ppm', undefined)).toThrow(/absolute amount or one relative/);
    expect(refusal(() => inValueUnit(D({ kind: 'normal', value: 0, u: 5, uncertaintyUnit: 'ppm' }), 'ohm')).message).toMatch(/value 0/);
    expect(refusal(() => inValueUnit(D({ kind: 'normal', value: 1, u: 5, uncertaintyUnit: 'furlong' }), 'm')).code).toBe('unit');
  });

  it('converts every uncertainty field of a kind and nothing else', () => {
    const c = inValueUnit(D({ kind: 'curvilinear-trapezoidal', value: 10, halfWidth: 20, halfWidthUncertainty: 4, uncertaintyUnit: 'um' }), 'mm');
    expect(c).toMatchObject({ value: 10, halfWidth: 0.02, halfWidthUncertainty: 0.004 });
    expect('uncertaintyUnit' in c).toBe(false);
    const o = inValueUnit(D({ kind: 'observations', values: [1, 2, 3], pooledSd: 100, pooledDof: 20, uncertaintyUnit: 'mg' }), 'g');
    expect(o).toMatchObject({ values: [1, 2, 3], pooledSd: 0.1 });
    // the sampler refuses a spec still in its own unit rather than draw in the wrong unit
    expect(() => samplerFor(D({ kind: 'normal', value: 1, u: 1, uncertaintyUnit: 'mm' }))).toThrow(/inValueUnit/);
  });

  it('refuses uncertaintyUnit where no uncertainty field takes it', () => {
    const bad = (d: Record<string, unknown>) => refusal(() => validateBudget(budget('Y = x', { x: D(d) })));
    expect(bad({ kind: 'constant', value: 1, uncertaintyUnit: 'mm' }).field).toBe('inputs[0].distribution.uncertaintyUnit');
    expect(bad({ kind: 'rectangular', lower: 1, upper: 2, uncertaintyUnit: 'mm' }).field).toBe('inputs[0].distribution.uncertaintyUnit');
    expect(bad({ kind: 'observations', values: [1, 2], uncertaintyUnit: 'mm' }).field).toBe('inputs[0].distribution.uncertaintyUnit');
  });
});

describe('how a value was stated, kept in the budget file', () => {
  const doc = budget(
    'Y = t + d + r',
    {
      t: [D({ kind: 'normal', value: 20.3, U: 12, p: 0.95, dof: 9, uncertaintyUnit: 'mK', stated: { as: 'certificate', source: 'certificate KF-0423' } }), 'degC'],
      d: [D({ kind: 'rectangular', value: 0, halfWidth: 0.005, stated: { as: 'resolution' } }), 'degC'],
      r: [D({ kind: 'rectangular', value: 0, halfWidth: 0.02, stated: { as: 'specification', source: 'manual of the bath' } }), 'degC'],
    },
    { measurand: { symbol: 'Y', unit: 'degC' } },
  );

  it('survives serializeBudget → parseBudgetFile → validateBudget unchanged', () => {
    const back = parseBudgetFile(serializeBudget(validateBudget(doc)));
    expect(back).toEqual(doc);
    expect(back.inputs[0].distribution).toMatchObject({ U: 12, p: 0.95, dof: 9, uncertaintyUnit: 'mK', stated: { as: 'certificate', source: 'certificate KF-0423' } });
    expect('k' in back.inputs[0].distribution).toBe(false);
  });

  it('refuses a resolution that is not a rectangular half-width, and an unknown form', () => {
    const bad = (d: Record<string, unknown>) => refusal(() => validateBudget(budget('Y = x', { x: D(d) })));
    expect(bad({ kind: 'normal', value: 1, u: 1, stated: { as: 'resolution' } }).field).toBe('inputs[0].distribution.stated');
    expect(bad({ kind: 'normal', value: 1, u: 1, stated: { as: 'hearsay' } }).field).toBe('inputs[0].distribution.stated.as');
  });
});

describe('statedValueOf: the input as stated, its divisor and u (GUM 4.3)', () => {
  it('a certificate with U, p and ν: divisor k = t_0.975(9) = 2.262, u in the value unit', () => {
    const s = statedValueOf(input('degC', { kind: 'normal', value: 20.3, U: 12, p: 0.95, dof: 9, uncertaintyUnit: 'mK', stated: { as: 'certificate', source: 'KF-0423' } }));
    expect(s).toMatchObject({ as: 'certificate', source: 'KF-0423', amount: 12, amountUnit: 'mK', relative: false, coverageProbability: 0.95, statedDof: 9, divisorText: '2.262' });
    expect(s.text).toBe('U = 12 mK, p = 95 %, ν = 9 (k = 2.262, t)');
    expect(s.divisor).toBeCloseTo(2.262157, 5);
    // 0.012 °C / 2.262157 = 0.00530467 °C (scipy)
    expect(s.standardUncertainty).toBeCloseTo(0.00530467, 7);
  });

  it('a certificate with U and k, and u given directly', () => {
    const s = statedValueOf(input('degC', { kind: 'normal', value: 20.3, U: 12, k: 2, uncertaintyUnit: 'mK' }));
    expect(s).toMatchObject({ as: null, text: 'U = 12 mK, k = 2', divisor: 2, divisorText: '2' });
    expect(s.standardUncertainty).toBeCloseTo(0.006, 15);
    expect(statedValueOf(input('mm', { kind: 'normal', value: 1, u: 0.5, uncertaintyUnit: 'um' })).text).toBe('u = 0.5 µm');
    expect(statedValueOf(input('mg', { kind: 'normal', value: 0.052, U: 0.03, k: 2.28, dof: 8 }))).toMatchObject({ text: 'U = 0.03 mg, k = 2.28, ν = 8', statedDof: 8 });
  });

  it('a resolution r: a = r/2 and the divisor of r is 2√3 (GUM F.2.2.1): r = 0.01 °C gives u = 0.002 886 75 °C', () => {
    const s = statedValueOf(input('degC', { kind: 'rectangular', value: 0, halfWidth: 0.005, stated: { as: 'resolution' } }));
    expect(s).toMatchObject({ as: 'resolution', amount: 0.01, text: 'r = 0.01 °C (a = r/2)', divisorText: '2√3' });
    expect(s.divisor).toBeCloseTo(3.4641016, 6);
    expect(s.standardUncertainty).toBeCloseTo(0.002886751, 8); // 0.01/(2√3), closed form
  });

  it('a specification ± 5 ppm of 100 Ω: relative, divisor √3', () => {
    const s = statedValueOf(input('ohm', { kind: 'rectangular', value: 100, halfWidth: 5, uncertaintyUnit: 'ppm', stated: { as: 'specification' } }));
    expect(s).toMatchObject({ relative: true, text: '± 5 ppm of the value', divisorText: '√3' });
    expect(s.standardUncertainty).toBeCloseTo(2.886751e-4, 10);
  });

  it('n readings: s and the divisor √n (GUM 4.2.3)', () => {
    // values 1, 2, 3, 4: s = 1.290994 (sample standard deviation, closed form √(5/3)), u = s/2 = 0.645497
    const s = statedValueOf(input('g', { kind: 'observations', values: [1, 2, 3, 4], stated: { as: 'observations' } }));
    expect(s).toMatchObject({ text: '4 readings, s = 1.29 g', divisorText: '√4', divisor: 2 });
    expect(s.standardUncertainty).toBeCloseTo(Math.sqrt(5 / 3) / 2, 12);
  });

  it('the other shapes: triangular √6, arcsine √2, trapezoidal √(6/(1 + β²)), constant without divisor', () => {
    expect(statedValueOf(input('mm', { kind: 'triangular', value: 0, halfWidth: 6 })).divisorText).toBe('√6');
    expect(statedValueOf(input('mm', { kind: 'arcsine', value: 0, halfWidth: 2 })).divisor).toBeCloseTo(Math.SQRT2, 15);
    // β = 0.5: √(6/1.25) = 2.190890 (closed form)
    expect(statedValueOf(input('mm', { kind: 'trapezoidal', value: 0, halfWidth: 1, beta: 0.5 })).divisorText).toBe('2.191');
    const c = statedValueOf(input('mm', { kind: 'constant', value: 3 }));
    expect(c).toMatchObject({ divisor: null, text: '3 mm, exact', standardUncertainty: 0 });
    // every divisor reproduces the engine's u from the stated amount
    const ct = statedValueOf(input('mm', { kind: 'curvilinear-trapezoidal', value: 0, halfWidth: 3, halfWidthUncertainty: 1 }));
    expect(3 / ct.divisor!).toBeCloseTo(ct.standardUncertainty, 14);
  });
});
