import type { DistributionRule } from './distribution';
import { fillNormal } from '../random/ziggurat-normal';

/**
 * Gaussian input: x = value, u = u or U/k (GUM 4.3.4), ν = ∞ unless `dof` is
 * given (the registry applies `dof`). Draws value + u·z, z ~ N(0, 1)
 * (JCGM 101:2008 6.4.7). `dof` never changes the sampling: a normal stays Gaussian.
 */
export const normalRule: DistributionRule<'normal'> = {
  kind: 'normal',
  treat(spec) {
    return { estimate: spec.value, standardUncertainty: normalStandardUncertainty(spec), dof: Infinity };
  },
  sampler(spec) {
    const mean = spec.value;
    const u = normalStandardUncertainty(spec);
    return {
      fill(rng, out, n) {
        fillNormal(rng, out, n, mean, u);
      },
    };
  },
};

/** u = u, or U/k for an expanded uncertainty with its coverage factor (GUM 4.3.4). */
function normalStandardUncertainty(spec: { u?: number; U?: number; k?: number }): number {
  if (spec.u !== undefined) return spec.u;
  if (spec.U !== undefined && spec.k !== undefined) return spec.U / spec.k;
  throw new RangeError('a normal distribution needs u, or U with its coverage factor k');
}
