import { expect } from 'vitest';

/*
 * Sample moments for the sampler tests, with their sampling errors
 * (common practice: SE(mean) = s/√n, SE(s²) = √((m₄ − s⁴)/n)).
 */
export interface SampleMoments {
  mean: number;
  variance: number;
  /** Standard error of the mean. */
  meanError: number;
  /** Standard error of the sample variance. */
  varianceError: number;
}

export function sampleMoments(x: Float64Array): SampleMoments {
  const n = x.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += x[i];
  const mean = sum / n;
  let m2 = 0;
  let m4 = 0;
  for (let i = 0; i < n; i++) {
    const d = x[i] - mean;
    const d2 = d * d;
    m2 += d2;
    m4 += d2 * d2;
  }
  const variance = m2 / (n - 1);
  m4 /= n;
  return {
    mean,
    variance,
    meanError: Math.sqrt(variance / n),
    varianceError: Math.sqrt(Math.max(m4 - variance * variance, 0) / n),
  };
}

/** Asserts draws lie in the open interval (0, 1) with mean 1/2 and variance 1/12 within 5 standard errors (JCGM 101:2008 C.3). */
export function expectOpenUnitUniform(x: Float64Array): void {
  let min = 1;
  let max = 0;
  for (let i = 0; i < x.length; i++) {
    if (x[i] < min) min = x[i];
    if (x[i] > max) max = x[i];
  }
  expect(min).toBeGreaterThan(0);
  expect(max).toBeLessThan(1);
  const m = sampleMoments(x);
  expect(Math.abs(m.mean - 0.5)).toBeLessThan(5 * m.meanError);
  expect(Math.abs(m.variance - 1 / 12)).toBeLessThan(5 * m.varianceError);
}

/**
 * Asserts mean 0, variance 1 and fourth moment 3 within 5 standard errors
 * (normal: E z⁴ = 3 and Var z⁴ = 105 − 9 = 96, handbook moments, so SE = √(96/n)).
 */
export function expectStandardNormalMoments(z: Float64Array): void {
  const n = z.length;
  const m = sampleMoments(z);
  expect(Math.abs(m.mean)).toBeLessThan(5 * m.meanError);
  expect(Math.abs(m.variance - 1)).toBeLessThan(5 * m.varianceError);
  let m4 = 0;
  for (let i = 0; i < n; i++) m4 += z[i] ** 4;
  expect(Math.abs(m4 / n - 3)).toBeLessThan(5 * Math.sqrt(96 / n));
}

/** Pearson correlation coefficient of two columns. */
export function sampleCorrelation(x: Float64Array, y: Float64Array): number {
  const n = x.length;
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i];
    my += y[i];
  }
  mx /= n;
  my /= n;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx;
    const dy = y[i] - my;
    sxy += dx * dy;
    sxx += dx * dx;
    syy += dy * dy;
  }
  return sxy / Math.sqrt(sxx * syy);
}
