import { describe, expect, it } from 'vitest';
import { compileModel } from '../../shared/model/compile-model';
import { secondOrderVarianceTerms } from '../../shared/gum/second-order';

function compile(model: string, symbols: string[]) {
  return compileModel({ model, measurand: { symbol: 'y' }, inputs: symbols.map((symbol) => ({ symbol })), constants: [] });
}

describe('higher-order terms of the JCGM 100:2008 5.1.2 note', () => {
  it('Y = X₁·X₂: the terms add u²(x₁)·u²(x₂), as Var(X₁X₂) = x₂²u₁² + x₁²u₂² + u₁²u₂² for independent inputs (handbook identity)', () => {
    const m = compile('y = a * b', ['a', 'b']);
    const partials = m.partials.map((p) => p!);
    const extra = secondOrderVarianceTerms(partials, m.partialReads, [2, 3], [0.1, 0.2]);
    expect(extra).toBeCloseTo(0.1 ** 2 * 0.2 ** 2, 12);
  });

  it('records which inputs each symbolic derivative reads', () => {
    const m = compile('y = a * b + c^2', ['a', 'b', 'c', 'd']);
    expect(m.partialReads).toEqual([[1], [0], [2], []]);
  });

  it('skipping derivatives that do not read x_j gives exactly the full double sum', () => {
    const symbols = Array.from({ length: 12 }, (_, i) => `x${i}`);
    const terms = Array.from({ length: 6 }, (_, k) => `x${2 * k} * exp(x${2 * k + 1}) / (1 + x${2 * k}^2)`);
    const m = compile(`y = ${terms.join(' + ')}`, symbols);
    const partials = m.partials.map((p) => p!);
    const x = symbols.map((_, i) => 0.5 + i / 7);
    const u = symbols.map((_, i) => 0.01 + i / 100);
    const dense = secondOrderVarianceTerms(
      partials,
      partials.map(() => null),
      x,
      u,
    );
    expect(secondOrderVarianceTerms(partials, m.partialReads, x, u)).toBe(dense);
    expect(dense).toBeGreaterThan(0);
  });
});
