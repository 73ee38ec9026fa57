import { describe, expect, it } from 'vitest';
import type { Distribution } from '../../shared/budget/schema';
import { distributionSchema } from '../../shared/budget/schema';
import { gumTreatment, samplerFor, dofFromRelativeUncertainty } from '../../shared/distributions/registry';
import { arithmeticMean, experimentalStandardDeviation, standardUncertaintyOfMean } from '../../shared/distributions/type-a';
import { UniformGenerator } from '../../shared/random/uniform-generator';
import { sampleMoments } from './moments';

const N = 1_000_000;

function draw(spec: Distribution, seed = 'draws', n = N): Float64Array {
  // Every spec used here must also pass the budget file schema.
  distributionSchema.parse(spec);
  const out = new Float64Array(n);
  samplerFor(spec).fill(new UniformGenerator(seed), out, n);
  return out;
}

function expectMoments(x: Float64Array, mean: number, variance: number): void {
  const m = sampleMoments(x);
  expect(Math.abs(m.mean - mean)).toBeLessThan(5 * m.meanError);
  expect(Math.abs(m.variance - variance)).toBeLessThan(5 * m.varianceError);
}

function expectRange(x: Float64Array, lower: number, upper: number): void {
  let min = Infinity;
  let max = -Infinity;
  for (const v of x) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  expect(min).toBeGreaterThanOrEqual(lower);
  expect(max).toBeLessThanOrEqual(upper);
}

const observations = [10.012, 10.009, 10.015, 10.011, 10.008, 10.013, 10.01, 10.014, 10.012, 10.009, 10.011, 10.016];

describe('GUM treatment of each kind', () => {
  it('normal: u as given, or U/k (GUM 4.3.4); ν = ∞', () => {
    expect(gumTreatment({ kind: 'normal', value: 5, u: 0.2 })).toEqual({ estimate: 5, standardUncertainty: 0.2, dof: Infinity });
    const t = gumTreatment({ kind: 'normal', value: 5, U: 0.4, k: 2 });
    expect(t.standardUncertainty).toBeCloseTo(0.2, 15);
  });

  it('rectangular: midpoint and a/√3 (GUM 4.3.7, JCGM 101:2008 6.4.2)', () => {
    const byBounds = gumTreatment({ kind: 'rectangular', lower: 7000, upper: 9000 });
    expect(byBounds.estimate).toBe(8000);
    expect(byBounds.standardUncertainty).toBeCloseTo(1000 / Math.sqrt(3), 10);
    const byWidth = gumTreatment({ kind: 'rectangular', value: 1, halfWidth: 0.3 });
    expect(byWidth.standardUncertainty).toBeCloseTo(0.3 / Math.sqrt(3), 15);
    expect(byWidth.dof).toBe(Infinity);
  });

  it('triangular: a/√6 (GUM 4.3.9)', () => {
    expect(gumTreatment({ kind: 'triangular', value: 2, halfWidth: 0.6 }).standardUncertainty).toBeCloseTo(0.6 / Math.sqrt(6), 15);
  });

  it('arcsine: a/√2 (JCGM 101:2008 6.4.6)', () => {
    expect(gumTreatment({ kind: 'arcsine', value: 0, halfWidth: 1 }).standardUncertainty).toBeCloseTo(Math.SQRT1_2, 15);
  });

  it('trapezoidal: a·√((1 + β²)/6) (JCGM 101:2008 6.4.4), rectangular at β = 1, triangular at β = 0', () => {
    const u = (beta: number) => gumTreatment({ kind: 'trapezoidal', value: 0, halfWidth: 1, beta }).standardUncertainty;
    expect(u(0.5)).toBeCloseTo(Math.sqrt(1.25 / 6), 15);
    expect(u(1)).toBeCloseTo(1 / Math.sqrt(3), 15);
    expect(u(0)).toBeCloseTo(1 / Math.sqrt(6), 15);
  });

  it('curvilinear trapezoidal: √(a²/3 + d²/9) (JCGM 101:2008 6.4.3)', () => {
    const t = gumTreatment({ kind: 'curvilinear-trapezoidal', value: 0, halfWidth: 1, halfWidthUncertainty: 0.3 });
    expect(t.standardUncertainty).toBeCloseTo(Math.sqrt(1 / 3 + 0.09 / 9), 15);
  });

  it('student-t: value, scale, dof (JCGM 101:2008 6.4.9)', () => {
    expect(gumTreatment({ kind: 'student-t', value: 3, scale: 0.1, dof: 7 })).toEqual({ estimate: 3, standardUncertainty: 0.1, dof: 7 });
  });

  it('observations: mean, s/√n, ν = n − 1 (GUM 4.2.1–4.2.3); pooled s_p/√n with its ν (GUM 4.2.4)', () => {
    const t = gumTreatment({ kind: 'observations', values: observations });
    expect(t.estimate).toBeCloseTo(arithmeticMean(observations), 14);
    expect(t.standardUncertainty).toBeCloseTo(experimentalStandardDeviation(observations) / Math.sqrt(12), 14);
    expect(t.dof).toBe(11);
    const pooled = gumTreatment({ kind: 'observations', values: [1, 2, 3, 4], pooledSd: 0.8, pooledDof: 40 });
    expect(pooled).toEqual({ estimate: 2.5, standardUncertainty: 0.4, dof: 40 });
  });

  it('constant: u = 0, ν = ∞', () => {
    expect(gumTreatment({ kind: 'constant', value: 1.2 })).toEqual({ estimate: 1.2, standardUncertainty: 0, dof: Infinity });
  });

  it('applies dof and relativeUncertaintyOfU to ν only (GUM G.4.2)', () => {
    expect(gumTreatment({ kind: 'rectangular', lower: 0, upper: 1, dof: 12 }).dof).toBe(12);
    // GUM G.4.2 example (from memory): Δu/u = 0.25 gives ν = 8.
    expect(dofFromRelativeUncertainty(0.25)).toBeCloseTo(8, 12);
    const t = gumTreatment({ kind: 'normal', value: 1, u: 0.1, relativeUncertaintyOfU: 0.25 });
    expect(t.dof).toBeCloseTo(8, 12);
    expect(t.standardUncertainty).toBe(0.1);
    expect(gumTreatment({ kind: 'student-t', value: 0, scale: 1, dof: 5, relativeUncertaintyOfU: 0.5 }).dof).toBeCloseTo(2, 12);
    expect(gumTreatment({ kind: 'observations', values: [1, 2, 3], dof: 50 }).dof).toBe(50);
  });
});

describe('Type A helpers (GUM 4.2)', () => {
  it('mean and experimental standard deviation of a small set (hand computation)', () => {
    // 10.0, 10.2, 9.8: mean 10, squared deviations 0.04 + 0.04, s = √(0.08/2) = 0.2.
    expect(arithmeticMean([10.0, 10.2, 9.8])).toBeCloseTo(10, 14);
    expect(experimentalStandardDeviation([10.0, 10.2, 9.8])).toBeCloseTo(0.2, 13);
    expect(standardUncertaintyOfMean([10.0, 10.2, 9.8])).toBeCloseTo(0.2 / Math.sqrt(3), 13);
  });

  it('keeps the spread digits under a large offset (two-pass, GUM 4.2.2)', () => {
    const offset = 1e9;
    const s = experimentalStandardDeviation([offset + 0.1, offset + 0.3, offset + 0.2]);
    // 0.1, 0.3, 0.2 have s = 0.1; the offset values are exact to ~1.2e-7.
    expect(Math.abs(s - 0.1)).toBeLessThan(1e-6);
  });

  it('refuses too few observations', () => {
    expect(() => experimentalStandardDeviation([1])).toThrow(RangeError);
    expect(() => arithmeticMean([])).toThrow(RangeError);
  });
});

describe('samplers: mean and variance at 10⁶ draws within 5 standard errors', () => {
  it('normal: value + u·z (JCGM 101:2008 6.4.7)', () => {
    expectMoments(draw({ kind: 'normal', value: 100, U: 0.1, k: 2 }), 100, 0.05 ** 2);
  });

  it('rectangular: mean (a₋+a₊)/2, variance (a₊−a₋)²/12 (JCGM 101:2008 6.4.2)', () => {
    const x = draw({ kind: 'rectangular', lower: 7000, upper: 9000 });
    expectMoments(x, 8000, 2000 ** 2 / 12);
    expectRange(x, 7000, 9000);
  });

  it('triangular: variance a²/6 (JCGM 101:2008 6.4.5)', () => {
    const x = draw({ kind: 'triangular', value: 2, halfWidth: 0.6 });
    expectMoments(x, 2, 0.36 / 6);
    expectRange(x, 1.4, 2.6);
  });

  it('arcsine: variance a²/2 (JCGM 101:2008 6.4.6)', () => {
    const x = draw({ kind: 'arcsine', value: -1, halfWidth: 3 });
    expectMoments(x, -1, 9 / 2);
    expectRange(x, -4, 2);
  });

  it.each([0, 0.3, 0.7, 1])('trapezoidal β = %s: variance a²(1 + β²)/6 (JCGM 101:2008 6.4.4)', (beta) => {
    const x = draw({ kind: 'trapezoidal', value: 5, halfWidth: 2, beta });
    expectMoments(x, 5, (4 * (1 + beta * beta)) / 6);
    expectRange(x, 3, 7);
  });

  it('curvilinear trapezoidal: variance a²/3 + d²/9 (JCGM 101:2008 6.4.3)', () => {
    const x = draw({ kind: 'curvilinear-trapezoidal', value: 0, halfWidth: 1, halfWidthUncertainty: 0.4 });
    expectMoments(x, 0, 1 / 3 + 0.16 / 9);
    expectRange(x, -1.4, 1.4);
  });

  it('student-t: value + scale·t_ν, variance scale²·ν/(ν − 2) (JCGM 101:2008 6.4.9)', () => {
    expectMoments(draw({ kind: 'student-t', value: 3, scale: 0.1, dof: 12 }), 3, (0.01 * 12) / 10);
  });

  it('observations: q̄ + (s/√n)·t_{n−1}, variance (s²/n)·ν/(ν − 2) (JCGM 101:2008 6.4.9)', () => {
    const s = experimentalStandardDeviation(observations);
    const nu = 11;
    expectMoments(draw({ kind: 'observations', values: observations }), arithmeticMean(observations), ((s * s) / 12) * (nu / (nu - 2)));
  });

  it('observations with pooled values use s_p/√n and the pooled ν (GUM 4.2.4, JCGM 101:2008 6.4.9)', () => {
    const nu = 20;
    expectMoments(draw({ kind: 'observations', values: [1, 2, 3, 4], pooledSd: 0.8, pooledDof: nu }), 2.5, 0.16 * (nu / (nu - 2)));
  });

  it('constant: every draw is the value', () => {
    expect(draw({ kind: 'constant', value: 1.2 }, 'c', 1000).every((v) => v === 1.2)).toBe(true);
  });
});

describe('a normal input stated with U, k and ν (JCGM 101:2008 6.4.9.7, from memory)', () => {
  // 6.4.9.7 (from memory): a certificate giving x, U_p, k_p and ν_eff is assigned t_ν(x, (U_p/k_p)²), ν = ν_eff.
  // The clause's logic checks out: the GUM interval x ± t_p(ν)·U_p/k_p is exactly the 100p % interval of
  // that scaled and shifted t, so both methods state the same interval for a correct budget.
  const spec: Distribution = { kind: 'normal', value: 5, U: 0.2571, k: 2.571, dof: 5 };

  it('draws value + (U/k)·t_ν: variance (U/k)²·ν/(ν − 2) = 0.01·5/3 (JCGM 101:2008 6.4.9.2)', () => {
    expectMoments(draw(spec), 5, (0.01 * 5) / 3);
  });

  it('its 95 % quantile is value + (U/k)·t_0.975(5) = 5 + 0.1·2.5706 (GUM Table G.2, from memory; scipy.stats.t.ppf(0.975, 5) = 2.570582)', () => {
    const x = draw(spec, 'q', 400_000).sort();
    const upper = x[Math.round(0.975 * x.length) - 1];
    // binomial spread of the 97.5 % order statistic at 4·10⁵ draws: √(0.975·0.025/4e5)/g ≈ 0.0009 (g = t₅ density at 2.57 / 0.1)
    expect(Math.abs(upper - (5 + 0.1 * 2.570582))).toBeLessThan(0.004);
  });

  it('declares its ν to the driver (Sampler.tDof), as student-t and observations do', () => {
    expect(samplerFor(spec).tDof).toBe(5);
    expect(samplerFor({ kind: 'normal', value: 5, u: 0.1 }).tDof).toBeUndefined();
    expect(samplerFor({ kind: 'student-t', value: 0, scale: 1, dof: 2 }).tDof).toBe(2);
    expect(samplerFor({ kind: 'observations', values: [1, 2, 4] }).tDof).toBe(2);
    expect(samplerFor({ kind: 'observations', values: [1, 2, 4], pooledSd: 1, pooledDof: 30 }).tDof).toBe(30);
  });

  it('relativeUncertaintyOfU leaves a normal input Gaussian', () => {
    const { relativeUncertaintyOfU: _r, ...plain } = { kind: 'normal', value: 1, u: 0.1, relativeUncertaintyOfU: 0.25 } as const;
    expect(Array.from(draw({ kind: 'normal', value: 1, u: 0.1, relativeUncertaintyOfU: 0.25 }, 'same', 1000))).toEqual(Array.from(draw(plain as Distribution, 'same', 1000)));
  });
});

describe('dof changes the sampling of no kind but normal', () => {
  it.each<Distribution>([
    { kind: 'rectangular', lower: 0, upper: 1, relativeUncertaintyOfU: 0.1 },
    { kind: 'observations', values: observations, dof: 100 },
  ])('$kind', (spec) => {
    const { dof: _dof, relativeUncertaintyOfU: _r, ...plain } = spec;
    expect(Array.from(draw(spec, 'same', 1000))).toEqual(Array.from(draw(plain as Distribution, 'same', 1000)));
  });
});
