import type { DistributionOf } from '../budget/schema';
import type { DistributionRule } from './distribution';
import { fillStudentT } from '../random/student-t-draws';
import { arithmeticMean, experimentalStandardDeviation } from './type-a';

/**
 * Input evaluated from n repeated observations (Type A, GUM 4.2):
 * x = q̄ (4.2.1), u = s(q_k)/√n with ν = n − 1 (4.2.3, G.3.3), or with a pooled
 * estimate u = s_p/√n and ν = pooledDof (4.2.4). Draws the scaled and shifted
 * t-distribution ξ = q̄ + (s/√n)·t_ν (JCGM 101:2008 6.4.9), same scale and ν.
 * An override `dof` changes only the GUM ν, never these draws.
 */
export const observationsRule: DistributionRule<'observations'> = {
  kind: 'observations',
  treat(spec) {
    const { mean, scale, dof } = observationStatistics(spec);
    return { estimate: mean, standardUncertainty: scale, dof };
  },
  sampler(spec) {
    const { mean, scale, dof } = observationStatistics(spec);
    return {
      tDof: dof,
      fill(rng, out, n) {
        fillStudentT(rng, out, n, dof);
        for (let i = 0; i < n; i++) out[i] = mean + scale * out[i];
      },
    };
  },
};

/** q̄, the t scale s/√n (or s_p/√n) and ν = n − 1 (or the pooled ν). */
function observationStatistics(spec: DistributionOf<'observations'>): { mean: number; scale: number; dof: number } {
  const n = spec.values.length;
  const mean = arithmeticMean(spec.values);
  if (spec.pooledSd !== undefined && spec.pooledDof !== undefined) {
    return { mean, scale: spec.pooledSd / Math.sqrt(n), dof: spec.pooledDof };
  }
  return { mean, scale: experimentalStandardDeviation(spec.values) / Math.sqrt(n), dof: n - 1 };
}
