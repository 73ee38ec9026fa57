import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import stdlibTQuantile from '@stdlib/stats-base-dists-t-quantile';
import { BudgetError } from '../../shared/budget/budget-error';
import { computeBudget } from '../../shared/compute/compute-budget';
import { effectiveDegreesOfFreedom, welchSatterthwaite } from '../../shared/gum/welch-satterthwaite';
import { correlationGroups } from '../../shared/gum/correlation-groups';
import { centralDifference, differenceStep, modelResolutionStep, sensitivityCoefficients } from '../../shared/gum/sensitivity';
import { firstOrderRefusal } from '../../shared/gum/first-order-refusal';
import { SECOND_ORDER_MAX_INPUTS } from '../../shared/gum/propagate';
import { shapeKurtosis } from '../../shared/distributions/kurtosis';
import { compileModel } from '../../shared/model/compile-model';
import type { Distribution } from '../../shared/budget/schema';
import { budget, N, R } from '../support/budget-builder';
import { dubito, ensureBuiltCli } from '../cli/built-cli';

const gumOnly = { monteCarlo: false } as const;
const t975 = (nu: number) => stdlibTQuantile(0.975, nu);

describe('Welch–Satterthwaite with correlated inputs: each correlated group is one term (JCGM 100:2008 G.4.1, 5.2.2)', () => {
  it('groups inputs connected by r ≠ 0', () => {
    const r = [
      [1, 0, 0.5, 0],
      [0, 1, 0, 0],
      [0.5, 0, 1, -0.2],
      [0, 0, -0.2, 1],
    ];
    expect(correlationGroups(4, r)).toEqual([[0, 2, 3], [1]]);
    expect(correlationGroups(3, null)).toEqual([[0], [1], [2]]);
  });

  it.each([-0.9, 0.9])('two inputs u = 1, ν = 4, r = %s: ν_eff = 4 and k = t₉₅(4) = 2.776', (rho) => {
    const doc = budget('Y = a + b', { a: N(0, 1, { dof: 4 }), b: N(0, 1, { dof: 4 }) }, { correlations: [{ between: ['a', 'b'], r: rho }] });
    const r = computeBudget(doc, gumOnly);
    // pairwise eq. G.2b with the correlated u_c gave (2 + 2r)²/(2/4): 0.08 at r = −0.9 (k ≈ 10¹⁵) and 28.9 > Σν = 8 at r = +0.9
    expect(r.gum.effectiveDof).toBeCloseTo(4, 12);
    expect(r.gum.coverageFactor).toBeCloseTo(t975(4), 7); // 2.7764451051977934 (scipy.stats.t.ppf)
    expect(r.warnings.map((w) => w.message).join(' ')).not.toContain('only indicative');
  });

  it('coefficients of one straight-line fit give ν_eff = n − 2 (JCGM 100:2008 H.3.6, from memory: ν = n − 2 for the predicted correction)', () => {
    // Invented calibration data, n = 6, fitted by numpy.linalg.lstsq (recomputed for this test):
    // a = 0.013, b = 0.009842857 /unit, u(a) = 0.0075957381534146, u(b) = 0.00019504055046715, r(a, b) = −0.89871703427
    const ua = 0.0075957381534145964;
    const ub = 0.00019504055046715458;
    const rab = -0.8987170342729175;
    const doc = budget(
      'Y = a + b * t',
      { a: N(0.013, ua, { dof: 4 }), b: N(0.00984285714285715, ub, { dof: 4 }), t: { kind: 'constant', value: 45 } as Distribution },
      { correlations: [{ between: ['a', 'b'], r: rab }] },
    );
    const r = computeBudget(doc, gumOnly);
    // u_c of the predicted value at t = 45: √(cᵀVc) = 0.0038599636951519587 (numpy)
    expect(r.gum.standardUncertainty).toBeCloseTo(0.0038599636951519587, 14);
    // pairwise G.2b gave u_c⁴ / (u_a⁴/4 + (45 u_b)⁴/4) = 0.0959; one fit has ν = n − 2 = 4
    expect(r.gum.effectiveDof).toBeCloseTo(4, 12);
    expect(r.gum.coverageFactor).toBeCloseTo(2.7764451051977934, 7);
  });

  it('a correlated group with unequal ν takes the smallest (a documented conservative choice); other terms add by G.2b', () => {
    // group {a, b}: u_G² = 1 + 1 − 2·0.5 = 1, ν_G = min(4, 9) = 4; c uncorrelated: u² = 1, ν = 10
    // ν_eff = (1 + 1)² / (1/4 + 1/10) = 11.428571…
    const v = effectiveDegreesOfFreedom(
      [1, -1, 1],
      [1, 1, 1],
      [4, 9, 10],
      [
        [1, 0.5, 0],
        [0.5, 1, 0],
        [0, 0, 1],
      ],
    );
    expect(v).toBeCloseTo(4 / 0.35, 12);
  });

  it('ν_eff never exceeds Σν of the independent terms nor falls below the smallest ν of a term (Cauchy–Schwarz on eq. G.2b)', () => {
    let seed = 7;
    const next = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    for (let trial = 0; trial < 500; trial++) {
      const n = 2 + Math.floor(next() * 4);
      const c = Array.from({ length: n }, () => next() * 4 - 2);
      const u = Array.from({ length: n }, () => 0.1 + next());
      const dofs = Array.from({ length: n }, () => 1 + Math.floor(next() * 30));
      // one correlated pair (0, 1) with r in (−1, 1), the rest independent
      const rho = next() * 1.98 - 0.99;
      const corr = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : i + j === 1 ? rho : 0)));
      const v = effectiveDegreesOfFreedom(c, u, dofs, corr);
      const termDofs = [Math.min(dofs[0], dofs[1]), ...dofs.slice(2)];
      expect(v).toBeLessThanOrEqual(termDofs.reduce((s, d) => s + d, 0) * (1 + 1e-12));
      expect(v).toBeGreaterThanOrEqual(Math.min(...termDofs) * (1 - 1e-12));
    }
    expect(
      welchSatterthwaite([
        { variance: 1, dof: 5 },
        { variance: 0, dof: 1 },
      ]),
    ).toBeCloseTo(5, 12);
  });
});

describe('degrees of freedom from the reliability of u (JCGM 100:2008 G.4.2)', () => {
  it('ν = ½·(Δu/u)⁻²: 0.10 gives 50, and k = t₉₅(50) = 2.0086 (scipy.stats.t.ppf)', () => {
    const r = computeBudget(budget('Y = a', { a: N(1, 0.1, { relativeUncertaintyOfU: 0.1 }) }), gumOnly);
    expect(r.gum.effectiveDof).toBeCloseTo(50, 10);
    expect(r.gum.coverageFactor).toBeCloseTo(t975(50), 7);
  });
});

describe('only constants in a budget: refused, never an internal error', () => {
  it('every input constant: a BudgetError on "inputs"', () => {
    const doc = budget('Y = a + b', { a: { kind: 'constant', value: 1 } as Distribution, b: { kind: 'constant', value: 2 } as Distribution });
    for (const options of [gumOnly, { trials: 10_000 }]) {
      let caught: unknown;
      try {
        computeBudget(doc, options);
      } catch (e) {
        caught = e;
      }
      expect(caught).toBeInstanceOf(BudgetError);
      expect((caught as BudgetError).field).toBe('inputs');
      expect((caught as BudgetError).message).toContain('no input of the model has an uncertainty');
    }
  });

  it('the uncertain input is not in the model: refused as well', () => {
    expect(() => computeBudget(budget('Y = 2 * b', { a: N(1, 0.1), b: { kind: 'constant', value: 2 } as Distribution }), { trials: 10_000 })).toThrow(BudgetError);
  });

  it('u = 0 everywhere by both methods (Y = 0·a; a − b fully correlated with equal estimates): reported plainly, no internal error', () => {
    for (const doc of [budget('Y = 0 * a', { a: N(1, 0.1) }), budget('Y = a - b', { a: N(1, 0.1), b: N(1, 0.1) }, { correlations: [{ between: ['a', 'b'], r: 1 }] })]) {
      const r = computeBudget(doc, { trials: 10_000 });
      expect(r.gum.standardUncertainty).toBe(0);
      expect(r.gum.expandedUncertainty).toBe(0);
      expect(r.monteCarlo!.standardUncertainty).toBe(0);
      // no δ exists at u = 0 (JCGM 101:2008 8.2): the intervals coincide exactly
      expect(r.validation).toMatchObject({ dLow: 0, dHigh: 0, passed: true });
      expect(r.warnings).toContainEqual({ code: 'monte-carlo-constant-output', message: 'Every Monte Carlo trial gave the same value: the measurand does not vary with the inputs, u = 0.' });
    }
  });

  it('the CLI exits 2 with the message', () => {
    const dir = mkdtempSync(join(tmpdir(), 'dubito-constants-'));
    const file = join(dir, 'budget.json');
    writeFileSync(file, JSON.stringify(budget('Y = a', { a: { kind: 'constant', value: 1 } as Distribution })));
    ensureBuiltCli();
    const r = dubito('compute', file);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('inputs: no input of the model has an uncertainty');
    expect(r.stderr).not.toContain('internal error');
  });
});

describe("higher-order terms (JCGM 100:2008 5.1.2 note) with each input's kurtosis", () => {
  it('kurtosis of the shapes (handbook moments; JCGM 101:2008 6.4)', () => {
    expect(shapeKurtosis({ kind: 'rectangular', value: 0, halfWidth: 1 } as Distribution, Infinity)).toBeCloseTo(1.8, 15);
    expect(shapeKurtosis({ kind: 'triangular', value: 0, halfWidth: 1 } as Distribution, Infinity)).toBeCloseTo(2.4, 15);
    expect(shapeKurtosis({ kind: 'arcsine', value: 0, halfWidth: 1 } as Distribution, Infinity)).toBeCloseTo(1.5, 15);
    // trapezoid β = 0 is the triangle, β = 1 the rectangle
    expect(shapeKurtosis({ kind: 'trapezoidal', value: 0, halfWidth: 1, beta: 0 } as Distribution, Infinity)).toBeCloseTo(2.4, 14);
    expect(shapeKurtosis({ kind: 'trapezoidal', value: 0, halfWidth: 1, beta: 1 } as Distribution, Infinity)).toBeCloseTo(1.8, 14);
    // β = 0.5: scipy.stats.trapezoid(0.25, 0.75).stats(moments='k') + 3 = 2.016 (recomputed for this test)
    expect(shapeKurtosis({ kind: 'trapezoidal', value: 0, halfWidth: 1, beta: 0.5 } as Distribution, Infinity)).toBeCloseTo(2.016, 12);
    // curvilinear trapezoid d = 0 is the rectangle; d = a = 1: E[A²] = 4/3, E[A⁴] = 16/5, β₂ = 9·3.2/(5·16/9) = 3.24
    expect(shapeKurtosis({ kind: 'curvilinear-trapezoidal', value: 0, halfWidth: 1, halfWidthUncertainty: 0 } as Distribution, Infinity)).toBeCloseTo(1.8, 14);
    expect(shapeKurtosis({ kind: 'curvilinear-trapezoidal', value: 0, halfWidth: 1, halfWidthUncertainty: 1 } as Distribution, Infinity)).toBeCloseTo(3.24, 14);
    // d = a/2: 2.31976 (closed form); numpy, 4·10⁶ draws of A·U(−1, 1), A ~ U(0.5, 1.5): 2.3194
    expect(shapeKurtosis({ kind: 'curvilinear-trapezoidal', value: 0, halfWidth: 1, halfWidthUncertainty: 0.5 } as Distribution, Infinity)).toBeCloseTo(2.3197633136094677, 12);
    // t: 3 + 6/(ν − 4); ν = 10 → 4 (scipy.stats.t.stats(10, moments='k') = 1 excess)
    expect(shapeKurtosis({ kind: 'student-t', value: 0, scale: 1, dof: 10 } as Distribution, 10)).toBeCloseTo(4, 15);
    expect(shapeKurtosis({ kind: 'student-t', value: 0, scale: 1, dof: 4 } as Distribution, 4)).toBe(Infinity);
  });

  it('y = x², x rectangular 1 ± 1: u_c with the terms is 1.193 = √(64/45), the exact σ of X² (the Gaussian note gave 1.247)', () => {
    const r = computeBudget(budget('Y = x^2', { x: R(1, 1) }), gumOnly);
    // X ~ U(0, 2): E[X²] = 4/3, E[X⁴] = 16/5, Var = 16/5 − 16/9 = 64/45 (closed form)
    expect(r.gum.standardUncertainty).toBeCloseTo(2 / Math.sqrt(3), 12);
    expect(r.gum.standardUncertaintySecondOrder!).toBeCloseTo(Math.sqrt(64 / 45), 6);
    // and the Monte Carlo method (JCGM 101:2008, 2·10⁵ trials) agrees to within its own sampling spread (~0.3 %)
    const mc = computeBudget(budget('Y = x^2', { x: R(1, 1) }), { trials: 200_000 }).monteCarlo!;
    expect(Math.abs(mc.standardUncertainty / Math.sqrt(64 / 45) - 1)).toBeLessThan(0.01);
  });

  it("y = x², x normal: the note's own value u² = 4μ²u² + 2u⁴ (handbook: Var(X²) for X normal)", () => {
    const r = computeBudget(budget('Y = x^2', { x: N(1, 0.5) }), gumOnly);
    expect(r.gum.standardUncertaintySecondOrder!).toBeCloseTo(Math.sqrt(4 * 0.25 + 2 * 0.0625), 6);
  });

  it('a t input with ν ≤ 4 has no fourth moment: its terms are left out and named', () => {
    const r = computeBudget(budget('Y = x^2 + z^2', { x: { kind: 'student-t', value: 1, scale: 0.1, dof: 3 } as Distribution, z: N(1, 0.1) }), gumOnly);
    expect(r.gum.secondOrderOmitted).toEqual(['x']);
    expect(r.warnings.some((w) => w.code === 'second-order-omitted' && w.message.includes('leave out "x"') && w.symbols?.includes('x'))).toBe(true);
    // only z's terms: 4·0.01 + 4·0.01 + 2·10⁻⁴
    expect(r.gum.standardUncertaintySecondOrder!).toBeCloseTo(Math.sqrt(0.08 + 2e-4), 6);
  });

  it('a t input with ν ≤ 4 in which the model is straight needs no fourth moment: nothing left out', () => {
    const r = computeBudget(budget('Y = x + z^2', { x: { kind: 'student-t', value: 1, scale: 0.1, dof: 3 } as Distribution, z: N(1, 0.1) }), gumOnly);
    expect(r.gum.secondOrderOmitted).toBeUndefined();
    expect(r.gum.standardUncertaintySecondOrder!).toBeCloseTo(Math.sqrt(0.01 + 0.04 + 2e-4), 6);
  });

  it('u_c = 0 at first order but not at second (product of two zero-mean inputs): flagged unreportable, warned', () => {
    const r = computeBudget(budget('Y = a * b', { a: N(0, 0.1), b: N(0, 0.2) }), gumOnly);
    expect(r.gum.standardUncertainty).toBe(0);
    // Var(AB) = u_a²u_b² for independent zero-mean inputs (handbook identity): 0.02
    expect(r.gum.standardUncertaintySecondOrder!).toBeCloseTo(0.02, 9);
    expect(r.gum.unreportable?.reason).toBe('first-order-vanishes');
    expect(r.warnings.some((w) => w.code === 'not-reportable' && w.message.startsWith('NOT REPORTABLE'))).toBe(true);
  });

  it(`above ${SECOND_ORDER_MAX_INPUTS} uncertain inputs the terms are skipped with a note`, () => {
    const n = SECOND_ORDER_MAX_INPUTS + 1;
    const inputs = Object.fromEntries(Array.from({ length: n }, (_, i) => [`x${i}`, N(1, 0.01)]));
    const r = computeBudget(budget(`Y = ${Object.keys(inputs).join(' * ')}`, inputs), gumOnly);
    expect(r.gum.standardUncertaintySecondOrder).toBeNull();
    expect(r.warnings.some((w) => w.code === 'second-order-not-evaluated' && w.message.includes(`not evaluated above ${SECOND_ORDER_MAX_INPUTS} inputs`))).toBe(true);
  });
});

describe('numerical sensitivity coefficients at 10⁻¹² relative uncertainty (JCGM 100:2008 5.1.3)', () => {
  // y = f·(1 + δ), f = 10 MHz with u(f) = 10 µHz (10⁻¹²), δ = 0 with u(δ) = 10⁻¹²: c_f = 1, c_δ = f = 10⁷ Hz (closed form)
  const f = 1e7;
  const x = [f, 0];
  const u = [1e-5, 1e-12];
  const compile = (model: string) => compileModel({ model, measurand: { symbol: 'y' }, inputs: [{ symbol: 'f' }, { symbol: 'delta' }], constants: [] });

  it('the step: max(10⁻³u, √ε|x|, the model-resolution floor ε|y|/(10⁻⁸·slope)) (common practice of numerical differentiation)', () => {
    // f: √ε·10⁷ = 0.149 Hz; δ: the slope that matters is max(c, s/u) = max(10⁷, 2·10⁻⁵/10⁻¹²) = 2·10⁷,
    // so h = ε·10⁷/(10⁻⁸·2·10⁷) = 1.11·10⁻⁸ from the model value's resolution
    expect(differenceStep(f, 1e-5)).toBeCloseTo(Math.sqrt(Number.EPSILON) * f, 15);
    expect(modelResolutionStep(f, f, 1e-12, 2e-5)).toBeCloseTo(Number.EPSILON / 2e-8, 20);
    expect(differenceStep(0, 1e-12, modelResolutionStep(f, f, 1e-12, 2e-5))).toBeCloseTo(1.110223e-8, 13);
    // an ordinary budget keeps the local step 10⁻³·u: x = 1, u = 0.01
    expect(differenceStep(1, 0.01, modelResolutionStep(1, 1, 0.01, 0.01))).toBe(1e-5);
  });

  it('a step of 10⁻³·u alone lies below the resolution of a double and gives c wrong by percents', () => {
    const m = compile('y = f * (1 + delta)');
    const naive = [centralDifference(m.value, x, 0, 1e-3 * u[0]), centralDifference(m.value, x, 1, 1e-3 * u[1])];
    expect(Math.max(Math.abs(naive[0] - 1), Math.abs(naive[1] / f - 1))).toBeGreaterThan(0.01);
  });

  it('the chosen steps agree with the symbolic derivative to 10⁻⁷, with no false "may not be smooth"', () => {
    const m = compile('y = f * (1 + delta)');
    const s = sensitivityCoefficients(m, x, u);
    expect(s.methods).toEqual(['symbolic', 'symbolic']);
    expect(s.disagreements).toEqual([]);
    // the numerical values at the steps used, against the symbolic ones
    expect(Math.abs(centralDifference(m.value, x, 0, s.steps[0]) - 1)).toBeLessThan(1e-7);
    expect(Math.abs(centralDifference(m.value, x, 1, s.steps[1]) / f - 1)).toBeLessThan(1e-7);
    const r = computeBudget(budget('y = f * (1 + delta)', { f: N(f, 1e-5), delta: N(0, 1e-12) }), gumOnly);
    expect(r.warnings.filter((w) => w.code === 'derivatives-disagree')).toEqual([]);
    expect(r.gum.standardUncertainty).toBeCloseTo(Math.hypot(1e-5, 1e-5), 17);
  });

  it('where only a numerical derivative exists (max), it is right to 10⁻⁷', () => {
    const r = computeBudget(budget('y = max(f * (1 + delta), 0)', { f: N(f, 1e-5), delta: N(0, 1e-12) }), gumOnly);
    expect(r.gum.contributions.map((q) => q.sensitivityMethod)).toEqual(['numeric', 'numeric']);
    expect(Math.abs(r.gum.contributions[0].sensitivity - 1)).toBeLessThan(1e-7);
    expect(Math.abs(r.gum.contributions[1].sensitivity / f - 1)).toBeLessThan(1e-7);
    // the step that resolves f(x) is wider than u: said, since max() may not be smooth within it
    expect(r.warnings.some((w) => w.code === 'numerical-step-exceeds-u' && w.symbols?.[0] === 'f' && w.message.includes('numerical derivative for "f" needs a step'))).toBe(true);
  });

  it('a time-interval model at 10⁻¹²: y = N/f, u(f)/f = 10⁻¹²; c_f = −N/f² (closed form)', () => {
    const r = computeBudget(budget('T = n / f', { n: { kind: 'constant', value: 1e7 } as Distribution, f: N(9999999.999, 1e-5) }), gumOnly);
    const exact = -1e7 / 9999999.999 ** 2;
    expect(Math.abs(r.gum.contributions[1].sensitivity / exact - 1)).toBeLessThan(1e-9);
    expect(r.warnings.filter((w) => w.code === 'derivatives-disagree')).toEqual([]);
  });
});

describe('the first-order law fails against its higher-order terms (JCGM 100:2008 5.1.2 note)', () => {
  it('firstOrderRefusal: 0 against > 0, and above √2', () => {
    expect(firstOrderRefusal(0, 0.02)?.reason).toBe('first-order-vanishes');
    expect(firstOrderRefusal(1, 1.5)?.reason).toBe('higher-order-dominates');
    expect(firstOrderRefusal(1, 1.4)).toBeUndefined();
    expect(firstOrderRefusal(0, null)).toBeUndefined();
    expect(firstOrderRefusal(0, 0)).toBeUndefined();
  });

  it('terms above the first-order variance: flagged higher-order-dominates', () => {
    // y = x², x normal 0.1 ± 0.5: first order u_c = 2·0.1·0.5 = 0.1; with the terms √(0.01 + 2·0.0625) = 0.367 (handbook Var(X²))
    const r = computeBudget(budget('Y = x^2', { x: N(0.1, 0.5) }), gumOnly);
    expect(r.gum.standardUncertainty).toBeCloseTo(0.1, 12);
    expect(r.gum.standardUncertaintySecondOrder!).toBeCloseTo(Math.sqrt(0.01 + 0.125), 6);
    expect(r.gum.unreportable?.reason).toBe('higher-order-dominates');
  });

  it('terms small against the first order: nothing flagged (H.1 end gauge: 32 → 34 nm is not flagged either)', () => {
    const r = computeBudget(budget('Y = x^2', { x: N(1, 0.1) }), gumOnly);
    expect(r.gum.unreportable).toBeUndefined();
  });
});
