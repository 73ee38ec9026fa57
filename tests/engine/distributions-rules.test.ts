import { describe, expect, it } from 'vitest';
import { distributionSchema, type Distribution, type DistributionKind, type InputQuantity } from '../../shared/budget/schema';
import { statedValueOf } from '../../shared/budget/stated-value';
import { KINDS, ruleFor, ruleOf } from '../../shared/distributions/registry';
import { KIND_LABELS, KIND_SHORT } from '../../shared/format/distribution-labels';

/*
 * What each kind's rule owns beyond its treatment and sampler: building a
 * distribution from x and u must be the inverse of the GUM treatment, and the
 * standard uncertainty it gives must agree with the clause of that kind.
 */

/** fromStandardUncertainty then treat: the same x and u, and the result is a valid budget-file distribution. */
function roundTrip<K extends DistributionKind>(kind: K, x: number, u: number, nu = Infinity) {
  const rule = ruleOf(kind);
  const built = rule.fromStandardUncertainty(x, u, nu);
  distributionSchema.parse(built);
  expect(built.kind).toBe(kind);
  const t = rule.treat(built);
  expect(t.estimate).toBeCloseTo(x, 12);
  return { built, t };
}

describe('conversion from u is the inverse of the GUM treatment, for each kind', () => {
  it('normal: u as given (GUM 4.3.1, 4.3.4)', () => {
    const { built, t } = roundTrip('normal', 20.3, 0.006);
    expect(built).toEqual({ kind: 'normal', value: 20.3, u: 0.006 });
    expect(t.standardUncertainty).toBe(0.006);
  });

  it('rectangular: a = u·√3, so u = a/√3 (GUM 4.3.7): u = 1 gives a = 1.732051', () => {
    const { built, t } = roundTrip('rectangular', 5, 1);
    expect(built.halfWidth).toBeCloseTo(1.7320508075688772, 14);
    expect(t.standardUncertainty).toBeCloseTo(1, 14);
    // GUM 4.3.7: limits ± 0.3 give u = 0.3/√3 = 0.173205
    expect(ruleOf('rectangular').treat({ kind: 'rectangular', value: 0, halfWidth: 0.3 }).standardUncertainty).toBeCloseTo(0.17320508, 8);
  });

  it('triangular: a = u·√6, so u = a/√6 (GUM 4.3.9): u = 1 gives a = 2.449490', () => {
    const { built, t } = roundTrip('triangular', -2, 1);
    expect(built.halfWidth).toBeCloseTo(2.449489742783178, 14);
    expect(t.standardUncertainty).toBeCloseTo(1, 14);
  });

  it('arcsine: a = u·√2, so u = a/√2 (JCGM 101:2008 6.4.6): u = 1 gives a = 1.414214', () => {
    const { built, t } = roundTrip('arcsine', 0, 1);
    expect(built.halfWidth).toBeCloseTo(1.4142135623730951, 14);
    expect(t.standardUncertainty).toBeCloseTo(1, 14);
  });

  it('trapezoidal: β = 0.5 and a = u·√(6/(1 + β²)) (GUM 4.3.9 note 2, JCGM 101:2008 6.4.4): u = 1 gives a = 2.190890', () => {
    const { built, t } = roundTrip('trapezoidal', 1, 1);
    expect(built.beta).toBe(0.5);
    expect(built.halfWidth).toBeCloseTo(Math.sqrt(4.8), 14);
    expect(built.halfWidth).toBeCloseTo(2.19089023, 8);
    expect(t.standardUncertainty).toBeCloseTo(1, 14);
  });

  it('curvilinear trapezoidal: exact limits d = 0 and a = u·√3, so u = √(a²/3 + d²/9) (JCGM 101:2008 6.4.3)', () => {
    const { built, t } = roundTrip('curvilinear-trapezoidal', 3, 0.5);
    expect(built.halfWidthUncertainty).toBe(0);
    expect(t.standardUncertainty).toBeCloseTo(0.5, 14);
    // JCGM 101:2008 6.4.3 with a = 1, d = 0.3: u² = 1/3 + 0.09/9 = 0.343333
    expect(ruleOf('curvilinear-trapezoidal').treat({ kind: 'curvilinear-trapezoidal', value: 0, halfWidth: 1, halfWidthUncertainty: 0.3 }).standardUncertainty).toBeCloseTo(Math.sqrt(0.3433333333), 9);
  });

  it('student-t: scale s = u with its ν, and ν = 10 where none is finite (JCGM 101:2008 6.4.9)', () => {
    const { built, t } = roundTrip('student-t', 7, 0.25, 4);
    expect(built).toEqual({ kind: 'student-t', value: 7, scale: 0.25, dof: 4 });
    expect(t).toEqual({ estimate: 7, standardUncertainty: 0.25, dof: 4 });
    expect(ruleOf('student-t').fromStandardUncertainty(7, 0.25, Infinity).dof).toBe(10);
  });

  it('observations: two readings x ∓ u have mean x and s/√n = u with ν = 1 (GUM 4.2.1, 4.2.3)', () => {
    const { built, t } = roundTrip('observations', 10.012, 0.0001);
    expect(built.values).toEqual([10.0119, 10.0121]);
    expect(t.standardUncertainty).toBeCloseTo(0.0001, 14);
    expect(t.dof).toBe(1);
  });

  it('constant: u = 0, the value alone (GUM 4.1)', () => {
    const { built, t } = roundTrip('constant', 9.80665, 0);
    expect(built).toEqual({ kind: 'constant', value: 9.80665 });
    expect(t.standardUncertainty).toBe(0);
  });

  it('holds for every kind of the registry over a range of x and u', () => {
    for (const kind of KINDS) {
      for (const [x, u] of [
        [0, 1e-6],
        [-273.15, 0.02],
        [1e5, 3],
      ] as const) {
        const { t } = roundTrip(kind, x, u, 12);
        expect(t.standardUncertainty).toBeCloseTo(kind === 'constant' ? 0 : u, 9);
      }
    }
  });
});

describe('what else each rule owns', () => {
  it('gives every kind a long and a short name, the lists the labels file derives', () => {
    expect(Object.keys(KIND_LABELS)).toEqual(KINDS);
    expect(KIND_LABELS.triangular).toBe('Triangular');
    expect(KIND_SHORT['student-t']).toBe('scaled t');
  });

  it('names only fields the budget file knows in its form and uncertainty fields, each of a valid spec built from u', () => {
    for (const kind of KINDS) {
      const rule = ruleOf(kind);
      const built = rule.fromStandardUncertainty(1, 0.1, 5) as Record<string, unknown>;
      for (const name of rule.uncertaintyFields) expect(['u', 'U', 'halfWidth', 'halfWidthUncertainty', 'scale', 'pooledSd']).toContain(name);
      const first = rule.form.ways[0];
      expect(rule.form.wayOf(built as never)).toBe(first.id);
      for (const f of first.fields) expect(built, `${kind}.${f.name}`).toHaveProperty(f.name);
    }
  });

  it('states each kind with the divisor of its clause (GUM 4.3.3, 4.3.7, 4.3.9, F.2.2.1; JCGM 101:2008 6.4.6)', () => {
    const stated = (distribution: Distribution, unit = 'mm') => statedValueOf({ symbol: 'x', unit, distribution } as InputQuantity);
    expect(stated({ kind: 'normal', value: 1, U: 0.02, k: 2 }).divisorText).toBe('2');
    expect(stated({ kind: 'rectangular', value: 0, halfWidth: 0.005, stated: { as: 'resolution' } }).text).toBe('r = 0.01 mm (a = r/2)');
    expect(stated({ kind: 'triangular', value: 0, halfWidth: 0.6 }).divisor).toBeCloseTo(Math.sqrt(6), 15);
    expect(stated({ kind: 'arcsine', value: 0, halfWidth: 0.6 }).divisorText).toBe('√2');
    // the relative unit follows the half-width, not the uncertainty of the limits
    expect(stated({ kind: 'curvilinear-trapezoidal', value: 100, halfWidth: 5, halfWidthUncertainty: 1, uncertaintyUnit: 'ppm' }, 'ohm').text).toBe('± 5 ppm of the value, limits known to ± 1 ppm');
  });

  it('explains u(xᵢ) with the clause of its kind', () => {
    const write = { figure: (x: number) => String(x), u: '0.2449 mm', standardUncertainty: 0.2449, nu: '∞' };
    const d: Distribution = { kind: 'triangular', value: 0, halfWidth: 0.6 };
    expect(ruleFor(d).explainU(d, write)).toEqual({ formula: 'u(xᵢ) = a / √6', substituted: 'u(xᵢ) = 0.6 / √6 = 0.2449 mm', clause: 'GUM 4.3.9' });
    const o: Distribution = { kind: 'observations', values: [1, 2, 3] };
    expect(ruleFor(o).explainDof?.(o, { ...write, nu: '2' })?.substituted).toBe('νᵢ = 3 − 1 = 2');
  });
});
