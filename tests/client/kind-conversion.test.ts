import { describe, expect, it } from 'vitest';
import { distributionSchema, type Distribution } from '../../shared/budget/schema';
import { gumTreatment } from '../../shared/distributions/registry';
import { convertKind } from '../../src/features/editor/components/kinds';

/*
 * Changing the kind of an input in the editor keeps its estimate and its
 * standard uncertainty (to 6 significant digits), through the new kind's rule.
 */

const u = (d: Distribution, unit?: string) => gumTreatment(d, unit).standardUncertainty;

describe('convertKind: the editor changes a kind through u', () => {
  it('turns u = 0.2 into a rectangular half-width a = u·√3 = 0.346410 (GUM 4.3.7)', () => {
    const next = convertKind({ kind: 'normal', value: 5, u: 0.2 }, 'rectangular');
    expect(next).toEqual({ kind: 'rectangular', value: 5, halfWidth: 0.34641 });
    expect(u(next)).toBeCloseTo(0.2, 6);
  });

  it('turns a certificate U = 0.04, k = 2 into a triangular a = 0.02·√6 = 0.0489898 (GUM 4.3.3, 4.3.9)', () => {
    const next = convertKind({ kind: 'normal', value: 1, U: 0.04, k: 2 }, 'triangular');
    expect(next).toEqual({ kind: 'triangular', value: 1, halfWidth: 0.0489898 });
  });

  it('keeps the estimate of limits, their midpoint, and u from a/√3 (GUM 4.3.7)', () => {
    const next = convertKind({ kind: 'rectangular', lower: 7000, upper: 9000 }, 'normal');
    expect(next).toEqual({ kind: 'normal', value: 8000, u: 577.35 });
  });

  it("takes an uncertainty in its own unit into the value's and drops that unit: U = 12 mK, k = 2 for a value in °C gives u = 0.006 °C", () => {
    const next = convertKind({ kind: 'normal', value: 20.3, U: 12, k: 2, uncertaintyUnit: 'mK' }, 'arcsine', 'degC');
    expect(next.uncertaintyUnit).toBeUndefined();
    expect(next).toEqual({ kind: 'arcsine', value: 20.3, halfWidth: 0.00848528 });
  });

  it('keeps where the figure comes from and ν, but forgets a resolution, which only a rectangular input has', () => {
    const fromCertificate = convertKind({ kind: 'normal', value: 0, u: 1, dof: 12, stated: { as: 'certificate', source: 'KF-0423' } }, 'rectangular');
    expect(fromCertificate).toMatchObject({ dof: 12, stated: { as: 'certificate', source: 'KF-0423' } });
    const fromResolution = convertKind({ kind: 'rectangular', value: 0, halfWidth: 0.005, stated: { as: 'resolution' } }, 'normal');
    expect(fromResolution.stated).toBeUndefined();
    expect(distributionSchema.safeParse(fromResolution).success).toBe(true);
  });

  it('gives a scaled t the old ν as its own, and no override of ν', () => {
    const next = convertKind({ kind: 'normal', value: 2, u: 0.1, dof: 8 }, 'student-t');
    expect(next).toEqual({ kind: 'student-t', value: 2, scale: 0.1, dof: 8 });
    expect(convertKind({ kind: 'normal', value: 2, u: 0.1 }, 'student-t')).toMatchObject({ dof: 10 });
  });

  it('turns a scaled t into a normal with u = s that states its ν, so it is still drawn as t_ν (JCGM 101:2008 6.4.9)', () => {
    expect(convertKind({ kind: 'student-t', value: 2, scale: 0.1, dof: 8 }, 'normal')).toEqual({ kind: 'normal', value: 2, u: 0.1, dof: 8 });
  });

  it('gives observations two readings whose mean is the value and whose s/√n is u (GUM 4.2.3)', () => {
    const next = convertKind({ kind: 'normal', value: 10.012, u: 0.0001 }, 'observations');
    expect(next).toEqual({ kind: 'observations', values: [10.0119, 10.0121] });
    expect(u(next)).toBeCloseTo(0.0001, 12);
  });

  it('turns observations into a normal with their mean and s/√n', () => {
    const next = convertKind({ kind: 'observations', values: [1, 2, 3, 4] }, 'normal');
    expect(next).toEqual({ kind: 'normal', value: 2.5, u: 0.645497 });
  });

  it('makes an exact value of the estimate alone', () => {
    expect(convertKind({ kind: 'trapezoidal', value: 3, halfWidth: 1, beta: 0.5, relativeUncertaintyOfU: 0.1 }, 'constant')).toEqual({ kind: 'constant', value: 3 });
  });

  it('keeps the value of a draft that cannot be treated yet, with u = 1', () => {
    const draft = { kind: 'normal', value: 4, u: Number.NaN } as Distribution;
    expect(convertKind(draft, 'rectangular')).toEqual({ kind: 'rectangular', value: 4, halfWidth: 1.73205 });
  });
});
