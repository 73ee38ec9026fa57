import { describe, expect, it } from 'vitest';
import type { Distribution } from '../../shared/budget/schema';
import { WARNING_CODES } from '../../shared/budget/warnings';
import { computeBudget } from '../../shared/compute/compute-budget';
import { budget, N } from '../support/budget-builder';

/* Every warning carries a code from the closed list; screens and the report decide by it, never by the words. */
const codes = (r: { warnings: { code: string }[] }) => r.warnings.map((w) => w.code);

describe('warnings carry their code', () => {
  it('second-order terms above 5 %: y = x², x ~ N(1, 0.5): u_c = 1 at first order, √(1 + 2·0.5⁴) = 1.06 with them (JCGM 100:2008 5.1.2 note)', () => {
    const r = computeBudget(budget('Y = x^2', { x: N(1, 0.5) }), { monteCarlo: false });
    const w = r.warnings.find((x) => x.code === 'second-order-significant');
    expect(w?.message).toMatch(/raise the combined standard uncertainty by 6 %/);
    expect(w?.symbols).toBeUndefined();
  });

  it('a t input with ν = 3 has no fourth moment: second-order-omitted names it (JCGM 100:2008 5.1.2 note assumes E[e⁴] exists)', () => {
    const r = computeBudget(budget('Y = x^2 + z^2', { x: { kind: 'student-t', value: 1, scale: 0.1, dof: 3 } as Distribution, z: N(1, 0.1) }), { monteCarlo: false });
    expect(r.warnings.filter((w) => w.code === 'second-order-omitted')).toEqual([
      { code: 'second-order-omitted', message: 'The higher-order terms leave out "x": a t-distribution with ν ≤ 4 has no fourth moment.', symbols: ['x'] },
    ]);
  });

  it('n = 3 observations give t with ν = 2, which has no variance: dof-undefined-variance on that input (JCGM 101:2008 6.4.9)', () => {
    const r = computeBudget(budget('Y = a + b', { a: { kind: 'observations', values: [10, 10.1, 10.05] } as Distribution, b: N(0, 0.01) }), { trials: 10_000 });
    const w = r.warnings.filter((x) => x.code === 'dof-undefined-variance');
    expect(w).toHaveLength(1);
    expect(w[0]).toMatchObject({ symbols: ['a'], field: 'inputs[0]' });
    expect(w[0].message).toMatch(/only 3 observations \(ν = 2\)/);
    // n = 4 gives ν = 3: a variance exists (JCGM 101:2008 6.4.9), no such warning
    const four = computeBudget(budget('Y = a + b', { a: { kind: 'observations', values: [10, 10.1, 10.05, 10.02] } as Distribution, b: N(0, 0.01) }), { trials: 10_000 });
    expect(codes(four)).not.toContain('dof-undefined-variance');
  });

  it('an adaptive run stopped by the cap before 2s ≤ δ: monte-carlo-not-stable (JCGM 101:2008 7.9.4)', () => {
    // n_dig = 4 asks δ at the fourth digit of u; two sequences of 10⁴ cannot hold the averages that close
    const doc = budget('Y = X1 * X2', { X1: N(1, 0.3), X2: N(2, 0.5) }, { monteCarlo: { trials: 'adaptive', seed: 'cap', significantDigits: 4 } });
    const r = computeBudget(doc, { trialsCap: 20_000 });
    expect(r.monteCarlo!.stability!.stabilized).toBe(false);
    expect(r.warnings.find((w) => w.code === 'monte-carlo-not-stable')?.message).toMatch(/did not stabilise within 20000 trials/);
  });

  it('trials above the cap: monte-carlo-trials-capped', () => {
    const r = computeBudget(budget('Y = a', { a: N(1, 0.1) }), { trials: 100_000, trialsCap: 50_000 });
    expect(r.monteCarlo!.trials).toBe(50_000);
    expect(r.warnings).toContainEqual({ code: 'monte-carlo-trials-capped', message: 'Monte Carlo trials capped at 50000 (requested 100000).' });
  });

  it('every code a result carries is one of the closed list', () => {
    const r = computeBudget(budget('Y = x^2 + 0 * s', { x: N(1, 0.5), s: N(0, 1), spare: N(1, 1) }), { trials: 10_000 });
    expect(r.warnings.length).toBeGreaterThan(0);
    for (const c of codes(r)) expect(WARNING_CODES).toContain(c);
  });
});
