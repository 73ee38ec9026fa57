import { describe, expect, it } from 'vitest';
import { centralDifference, differenceStep } from '../../shared/gum/sensitivity';
import { compileModel } from '../../shared/model/compile-model';
import { computeBudget } from '../../shared/compute/compute-budget';
import { budget, N } from '../support/budget-builder';

// JCGM 100:2008 5.1.3: c_i = ∂f/∂x_i at the estimates; checked against central differences (common practice).
describe('sensitivity coefficients', () => {
  const models: [string, string[], number[]][] = [
    ['Y = a * sin(b)^2 + c / d', ['a', 'b', 'c', 'd'], [1.3, 0.7, 2.2, 4.1]],
    ['Y = exp(a) * log(b) - sqrt(c) * log10(d)', ['a', 'b', 'c', 'd'], [0.3, 2.7, 5.5, 40]],
    ['Y = tan(a) + asin(b) + acos(b) * atan(c) + abs(d) ^ 1.5', ['a', 'b', 'c', 'd'], [0.4, 0.2, 1.7, -2.5]],
    ['m1 = a * b\nm2 = m1 ^ 2 / c\nY = m2 - m1 + d', ['a', 'b', 'c', 'd'], [1.1, 2.3, 0.9, 7]],
    ['Y = a ^ b + c * d', ['a', 'b', 'c', 'd'], [2.5, 1.7, 3, 4]],
  ];
  it.each(models)('symbolic derivatives agree with central differences: %s', (model, symbols, x) => {
    const compiled = compileModel({ model, measurand: { symbol: 'Y' }, inputs: symbols.map((symbol) => ({ symbol })), constants: [] });
    symbols.forEach((_, i) => {
      const symbolic = compiled.partials[i]!(x);
      const numeric = centralDifference(compiled.value, x, i, differenceStep(x[i], 1e-3));
      expect(Number.isFinite(symbolic)).toBe(true);
      expect(Math.abs(symbolic - numeric)).toBeLessThan(1e-6 * Math.max(1, Math.abs(symbolic)));
    });
  });

  it('falls back to central differences where mathjs cannot differentiate (atan2, min, max)', () => {
    const r = computeBudget(budget('Y = atan2(a, b) + max(a, 2*b)', { a: N(1, 0.01), b: N(0.4, 0.01) }), { monteCarlo: false });
    // ∂/∂a atan2(a,b) = b/(a²+b²); max(a, 2b) = a there, so +1; ∂/∂b = −a/(a²+b²)
    expect(r.gum.contributions[0].sensitivityMethod).toBe('numeric');
    expect(r.gum.contributions[0].sensitivity).toBeCloseTo(0.4 / 1.16 + 1, 6);
    expect(r.gum.contributions[1].sensitivity).toBeCloseTo(-1 / 1.16, 6);
  });

  it('gives a zero coefficient for an input the model does not use, with a warning', () => {
    const r = computeBudget(budget('Y = 2 * a', { a: N(1, 0.1), spare: N(3, 0.1) }), { monteCarlo: false });
    expect(r.gum.contributions[1].sensitivity).toBe(0);
    expect(r.warnings).toContainEqual({ code: 'input-not-in-model', message: 'The input "spare" does not appear in the model.', symbols: ['spare'], field: 'inputs[1]' });
  });
});
