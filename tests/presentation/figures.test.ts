import type { InputQuantity } from '../../shared/budget/schema';
import { describe, expect, it } from 'vitest';
import { coefficient, count, coverageFactor, dof, estimate, given, interval, probability, relativeChange, share, uncertainty } from '../../shared/presentation/figures';
import { divisor, statedAs } from '../../shared/presentation/stated';
import { sensitivityShown } from '../../shared/presentation/units';

// U+202F separates digit groups, U+2212 is the minus sign (SI Brochure 5.4.4)
const plain = (s: string) => s.replace(/\u202f/g, ' ').replace(/\u2212/g, '-');

describe('one formatter per kind of figure', () => {
  it('a coverage probability keeps the digits that distinguish the conventional choices', () => {
    // p for k = 3 and k = 2 of a normal distribution, JCGM 100:2008 G.1.3 (99.73 %, 95.45 %)
    expect(probability(0.9973).text).toBe('99.73 %');
    expect(probability(0.9545).text).toBe('95.45 %');
    expect(probability(0.95).text).toBe('95 %');
    expect(probability(0.6827).text).toBe('68.27 %');
    expect(probability(0.99).text).toBe('99 %');
  });

  it('a share of the variance only ranks terms: two digits', () => {
    expect(share(0.9973).text).toBe('100 %');
    expect(share(0.05977).text).toBe('6.0 %');
    expect(share(0.3736).text).toBe('37 %');
    expect(share(0.0004).text).toBe('< 0.1 %');
    expect(share(0).text).toBe('0 %');
  });

  it('an uncertainty has two significant digits (JCGM 100:2008 7.2.6)', () => {
    expect(uncertainty(0.016043119).text).toBe('0.016');
    expect(uncertainty(19.37).text).toBe('19');
    // rounding carries into a new leading digit: 0.0996 → 0.10, not 0.100
    expect(uncertainty(0.0996).text).toBe('0.10');
    expect(plain(uncertainty(123456).text)).toBe('120 000');
    expect(uncertainty(0).text).toBe('0');
    expect(uncertainty(2.3e-9).text).toBe('2.3×10⁻⁹');
    expect(uncertainty(2.3e-9).markup).toBe('2.3×10^{−9}');
  });

  it('an estimate is rounded at the place of U', () => {
    // y = 36.24 mK with U = 19 mK is stated (36 ± 19) mK, never 36.2 beside it
    expect(estimate(36.24, 19.3).text).toBe('36');
    expect(estimate(0.02625, 0.016043).text).toBe('0.026');
    // u = 0.0020 (two significant digits) puts the last digit at 10⁻⁴
    expect(plain(estimate(100.18225, 0.002).text)).toBe('100.1822');
    expect(plain(estimate(-12.3456, 0.04).text)).toBe('-12.346');
    expect(plain(estimate(1234.5678, 0).text)).toBe('1234.57');
  });

  it('an interval writes both ends at one place', () => {
    expect(interval([0.01020688, 0.04229312], -3).text).toBe('[0.010, 0.042]');
    expect(plain(interval([-0.0012, 0.0034], -4).text)).toBe('[-0.0012, 0.0034]');
  });

  it('degrees of freedom as k uses them: the real ν_eff to one decimal below 100, and "> 1000" where more digits say nothing', () => {
    // JCGM 100:2008 G.4.1 note: t_p at a non-integer ν_eff by interpolation, so the shown ν_eff is the one k was read at
    expect(dof(16.7).text).toBe('16.7');
    expect(dof(18.9987).text).toBe('19.0');
    expect(dof(123.4).text).toBe('123');
    expect(dof(29).text).toBe('29');
    expect(dof(1000).text).toBe('1000');
    expect(dof(2004.0).text).toBe('> 1000');
    expect(dof(null).text).toBe('∞');
    expect(dof(Infinity).text).toBe('∞');
  });

  it('a coverage factor has two decimals', () => {
    // t_0.975(∞) = 1.959964 (normal quantile, scipy.stats.norm.ppf(0.975)); Table G.2 gives 1.96
    expect(coverageFactor(1.959964).text).toBe('1.96');
    expect(coverageFactor(2).text).toBe('2.00');
    expect(coverageFactor(2.8693).text).toBe('2.87');
  });

  it('a sensitivity coefficient drops zeros that claim nothing', () => {
    expect(plain(coefficient(-1).text)).toBe('-1');
    expect(coefficient(11.5).text).toBe('11.5');
    expect(coefficient(2.3).text).toBe('2.3');
    expect(coefficient(0.5).text).toBe('0.5');
  });

  it('counts, entered numbers and relative changes', () => {
    expect(plain(count(1_000_000).text)).toBe('1 000 000');
    expect(plain(given(100.183).text)).toBe('100.183');
    expect(plain(relativeChange(0.123).text)).toBe('+12.3 %');
    expect(plain(relativeChange(-0.004).text)).toBe('-0.40 %');
  });
});

describe('sensitivity coefficients in the units a budget is written in', () => {
  it('a difference of temperatures in mK against °C is −1, not −1000 mK/°C', () => {
    const c = sensitivityShown(-1000, 'mK', 'degC');
    expect(plain(c.figure.text)).toBe('-1');
    expect(c.unit.text).toBe('');
  });

  it('micrometres per degree Celsius instead of metres with a power of ten', () => {
    // thermal expansion of steel, 11.5·10⁻⁶ /°C × 1 m (common practice value for gauge blocks)
    const a = sensitivityShown(1.15e-5, 'm', 'degC');
    expect(a.figure.text).toBe('11.5');
    expect(a.unit.text).toBe('µm/°C');
    const b = sensitivityShown(0.0115, 'mm', 'degC');
    expect(b.figure.text).toBe('11.5');
    expect(b.unit.text).toBe('µm/°C');
  });

  it('keeps the measurand unit when no prefix is needed', () => {
    const c = sensitivityShown(2, 'degC', 'V');
    expect(c.figure.text).toBe('2');
    expect(c.unit.text).toBe('°C/V');
  });

  it('same units cancel', () => {
    const c = sensitivityShown(1, 'g', 'g');
    expect(c.figure.text).toBe('1');
    expect(c.unit.text).toBe('');
  });
});

describe('the value as stated and its divisor', () => {
  const q = (unit: string, distribution: InputQuantity['distribution']): InputQuantity => ({ symbol: 'x', unit, distribution });
  it('a certificate’s U and k', () => {
    const d = q('degC', { kind: 'normal', value: 0.004, U: 0.01, k: 2 });
    expect(statedAs(d).text).toBe('U = 0.01 °C, k = 2');
    expect(divisor(d).text).toBe('2');
  });
  it('limits ±a and their divisors (GUM 4.3.7, 4.3.9)', () => {
    expect(statedAs(q('degC', { kind: 'rectangular', value: 0, halfWidth: 0.008 })).text).toBe('± 0.008 °C');
    expect(divisor(q('degC', { kind: 'rectangular', value: 0, halfWidth: 0.008 })).text).toBe('√3');
    expect(divisor(q('m', { kind: 'triangular', value: 0, halfWidth: 1 })).text).toBe('√6');
    expect(divisor(q('m', { kind: 'arcsine', value: 0, halfWidth: 1 })).text).toBe('√2');
  });
  it('n readings and √n (GUM 4.2.3)', () => {
    const d = q('g', { kind: 'observations', values: [1, 2, 3, 4] });
    // s of 1, 2, 3, 4 is 1.291 (numpy.std(ddof=1))
    expect(statedAs(d).text).toBe('4 readings, s = 1.29 g');
    expect(divisor(d).text).toBe('√4');
  });
});

describe('figures named in a sentence', () => {
  it('a bound reads as a bound', async () => {
    const { relation } = await import('../../shared/presentation/figures');
    expect(relation('ν_eff', dof(2004)).text).toBe('ν_eff > 1000');
    expect(relation('ν_eff', dof(29)).text).toBe('ν_eff = 29');
    expect(given(0.0005).text).toBe('0.0005');
  });
});

describe('durations', () => {
  it('milliseconds, then seconds with one decimal below ten', async () => {
    const { duration } = await import('../../shared/presentation/figures');
    expect(duration(850).text).toBe('850 ms');
    expect(duration(4230).text).toBe('4.2 s');
    expect(duration(42_600).text).toBe('43 s');
  });
});

describe('intermediate quantities beside the model', () => {
  it('six significant digits without trailing zeros', async () => {
    const { intermediate } = await import('../../shared/presentation/figures');
    expect(intermediate(20.008).text).toBe('20.008');
    expect(intermediate(100.156).text).toBe('100.156');
    expect(intermediate(1.7295612e-5).text).toBe('1.729\u202f56×10⁻⁵');
  });
});

describe('symbols of quantities', () => {
  it('a subscript after the underscore, a Greek letter for its name', async () => {
    const { symbolMarkup, symbolParts } = await import('../../shared/format/symbols');
    expect(symbolParts('alpha_s')).toEqual({ base: 'α', sub: 's' });
    expect(symbolParts('T')).toEqual({ base: 'T', sub: null });
    expect(symbolMarkup('dt_ref_cal')).toBe('dt_{ref_cal}');
  });
});
