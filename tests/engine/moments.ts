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
