/*
 * Type A evaluation from repeated observations (GUM 4.2).
 */

/** Arithmetic mean q̄ = (1/n)·Σ q_k (GUM 4.2.1, eq. 3), with one correction pass for rounding. */
export function arithmeticMean(values: ArrayLike<number>): number {
  const n = values.length;
  if (n === 0) throw new RangeError('the mean needs at least one observation');
  let sum = 0;
  for (let k = 0; k < n; k++) sum += values[k];
  const first = sum / n;
  // Second pass: the mean residual corrects the rounding of the first sum.
  let residual = 0;
  for (let k = 0; k < n; k++) residual += values[k] - first;
  return first + residual / n;
}

/**
 * Experimental standard deviation s(q_k) = √( Σ (q_k − q̄)² / (n − 1) ) (GUM 4.2.2, eq. 4).
 * Two passes (mean first, then squared deviations) so that a large common
 * offset of the observations does not cancel the digits of the spread.
 */
export function experimentalStandardDeviation(values: ArrayLike<number>): number {
  const n = values.length;
  if (n < 2) throw new RangeError('the experimental standard deviation needs at least two observations');
  const mean = arithmeticMean(values);
  let sumOfSquares = 0;
  let sumOfDeviations = 0;
  for (let k = 0; k < n; k++) {
    const d = values[k] - mean;
    sumOfSquares += d * d;
    sumOfDeviations += d;
  }
  // Corrected two-pass form: subtracting (Σd)²/n removes the error left in the mean.
  const variance = (sumOfSquares - (sumOfDeviations * sumOfDeviations) / n) / (n - 1);
  return Math.sqrt(Math.max(variance, 0));
}

/** Experimental standard deviation of the mean s(q̄) = s(q_k)/√n (GUM 4.2.3, eq. 5). */
export function standardUncertaintyOfMean(values: ArrayLike<number>): number {
  return experimentalStandardDeviation(values) / Math.sqrt(values.length);
}
