import type { DistributionRule } from './distribution';
import { fillNormal } from '../random/ziggurat-normal';
import { fillStudentT } from '../random/student-t-draws';

/**
 * Gaussian input: x = value, u = u or U/k (GUM 4.3.4), ν = ∞ unless `dof` is
 * given (the registry applies `dof` to the GUM ν).
 * Draws (JCGM 101:2008 6.4.7): value + u·z, z ~ N(0, 1).
 * With `dof` = ν (a certificate stating U, k and ν_eff), draws the scaled and
 * shifted t-distribution value + u·t_ν with scale u = U/k (JCGM 101:2008 6.4.9.7;
 * the clause number is recalled, its logic checked: it is the distribution the
 * GUM assumes when it takes k = t_p(ν) for this input, so x ± t_p(ν)·U/k is its
 * exact 100p % interval and the two methods agree for a correct budget). Its standard deviation
 * is u·√(ν/(ν − 2)), defined for ν > 2 only. `relativeUncertaintyOfU` changes
 * only the GUM ν: it states doubt about u, not a t-distributed quantity.
 */
export const normalRule: DistributionRule<'normal'> = {
  kind: 'normal',
  treat(spec) {
    return { estimate: spec.value, standardUncertainty: normalStandardUncertainty(spec), dof: Infinity };
  },
  sampler(spec) {
    const mean = spec.value;
    const u = normalStandardUncertainty(spec);
    const dof = spec.dof;
    if (dof !== undefined && dof !== Infinity) {
      return {
        tDof: dof,
        fill(rng, out, n) {
          fillStudentT(rng, out, n, dof);
          for (let i = 0; i < n; i++) out[i] = mean + u * out[i];
        },
      };
    }
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
