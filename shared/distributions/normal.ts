import type { DistributionRule } from './distribution';
import { fillNormal } from '../random/ziggurat-normal';
import { fillStudentT } from '../random/student-t-draws';
import { coverageFactorFor } from '../statistics/student-t';

/**
 * Gaussian input: x = value, u = u or U/k (GUM 4.3.4; k stated, or from the
 * coverage probability p, `normalCoverageFactor`), ν = ∞ unless `dof` is
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

type NormalStatement = { u?: number; U?: number; k?: number; p?: number; dof?: number };

/**
 * The coverage factor that divides U: the stated k, or, where U is stated with
 * its coverage probability p instead, k = t_{(1+p)/2}(ν) with the stated
 * ν = `dof` (GUM G.3.4, G.6.4; EA-4/02 M:2022 5.3 and annex E), and without
 * `dof` the normal quantile z_{(1+p)/2} (GUM G.1.3, G.6.6): p = 0.95 gives
 * 1.960, with ν = 9 gives 2.262. Holds when the certificate's U is the
 * symmetric interval of a normal or scaled t-distribution (GUM G.6.6), which a
 * certificate stating p with U and ν_eff declares. `relativeUncertaintyOfU`
 * is the lab's own doubt about u, not the certificate's ν, so it never enters k.
 * Null when u is stated directly.
 */
export function normalCoverageFactor(spec: NormalStatement): number | null {
  if (spec.u !== undefined) return null;
  if (spec.k !== undefined) return spec.k;
  if (spec.p !== undefined) return coverageFactorFor(spec.p, spec.dof ?? Infinity);
  return null;
}

/** u = u, or U/k for an expanded uncertainty with its coverage factor k, stated or from p (GUM 4.3.4). */
function normalStandardUncertainty(spec: NormalStatement): number {
  if (spec.u !== undefined) return spec.u;
  const k = normalCoverageFactor(spec);
  if (spec.U !== undefined && k !== null) return spec.U / k;
  throw new RangeError('a normal distribution needs u, or U with its coverage factor k or its coverage probability p');
}
