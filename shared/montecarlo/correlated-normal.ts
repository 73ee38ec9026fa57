import type { UniformGenerator } from '../random/uniform-generator';
import { fillStandardNormal } from '../random/ziggurat-normal';
import { choleskyFactor } from '../statistics/cholesky';

/** A group of inputs drawn jointly from a multivariate Gaussian. */
export interface CorrelatedNormalGroup {
  means: number[];
  standardUncertainties: number[];
  /** Correlation coefficients r(x_i, x_j); symmetric, unit diagonal, positive semi-definite. */
  correlation: number[][];
}

/** The correlation matrix is not positive semi-definite; `index` is the 0-based input where that shows. */
export class NotPositiveSemiDefinite extends Error {
  constructor(readonly index: number) {
    super(`the correlation matrix is not positive semi-definite (shown at input ${index + 1} of the group)`);
    this.name = 'NotPositiveSemiDefinite';
  }
}

/** Fills one column per input of the group with joint draws. */
export interface CorrelatedSampler {
  fill(rng: UniformGenerator, columns: Float64Array[], n: number): void;
}

/**
 * Sampler for jointly Gaussian inputs N(μ, V) with V = diag(u)·R·diag(u):
 * X = μ + diag(u)·L·z with R = L·Lᵀ and z of independent N(0, 1)
 * (JCGM 101:2008 6.4.8.1). Throws NotPositiveSemiDefinite for an invalid R.
 */
export function correlatedNormalSampler(group: CorrelatedNormalGroup): CorrelatedSampler {
  const m = group.means.length;
  if (group.standardUncertainties.length !== m || group.correlation.length !== m) {
    throw new RangeError('means, standard uncertainties and the correlation matrix must have the same size');
  }
  const result = choleskyFactor(group.correlation);
  if ('failedAt' in result) throw new NotPositiveSemiDefinite(result.failedAt);
  const L = result.factor;
  const means = group.means.slice();
  const u = group.standardUncertainties.slice();
  return {
    fill(rng, columns, n) {
      if (columns.length !== m) throw new RangeError(`expected ${m} columns, got ${columns.length}`);
      for (let i = 0; i < m; i++) fillStandardNormal(rng, columns[i], n);
      // Row i of L·z needs z_0..z_i only, so overwriting from the last row down keeps them intact.
      for (let i = m - 1; i >= 0; i--) {
        const row = L[i];
        const target = columns[i];
        const mu = means[i];
        const ui = u[i];
        for (let t = 0; t < n; t++) {
          let s = 0;
          for (let k = 0; k <= i; k++) s += row[k] * columns[k][t];
          target[t] = mu + ui * s;
        }
      }
    },
  };
}
