import type { DistributionRule } from './distribution';
import { fillStudentT } from '../random/student-t-draws';

/**
 * Scaled and shifted t input: x = value, u = scale, ν = dof (the GUM
 * treatment takes the scale as the standard uncertainty, as for a Type A
 * s/√n). Draws ξ = value + scale·t_ν (JCGM 101:2008 6.4.9). Here `dof` is
 * the sampling ν itself; `relativeUncertaintyOfU` changes only the GUM ν.
 */
export const studentTRule: DistributionRule<'student-t'> = {
  kind: 'student-t',
  treat(spec) {
    return { estimate: spec.value, standardUncertainty: spec.scale, dof: spec.dof };
  },
  sampler(spec) {
    const { value, scale, dof } = spec;
    return {
      tDof: dof,
      fill(rng, out, n) {
        fillStudentT(rng, out, n, dof);
        for (let i = 0; i < n; i++) out[i] = value + scale * out[i];
      },
    };
  },
};
