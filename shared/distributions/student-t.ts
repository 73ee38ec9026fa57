import { z } from 'zod';
import { finite, positive, degreesOfFreedom, relativeUncertaintyOfU, statedOptions } from '../budget/field-schemas';
import type { DistributionRule, Sampler } from './distribution';
import { fillStudentT } from '../random/student-t-draws';

/** The fields of the `student-t` kind in the budget file, with the messages that say what to write. */
export const studentTSchema = z.looseObject({
  kind: z.literal('student-t'),
  value: finite(),
  scale: positive(),
  dof: degreesOfFreedom(),
  relativeUncertaintyOfU: relativeUncertaintyOfU().optional(),
  ...statedOptions,
});

/**
 * Scaled and shifted t input: x = value, u = scale, ν = dof (the GUM
 * treatment takes the scale as the standard uncertainty, as for a Type A
 * s/√n). Draws ξ = value + scale·t_ν (JCGM 101:2008 6.4.9). Here `dof` is
 * the sampling ν itself; `relativeUncertaintyOfU` changes only the GUM ν.
 */
export const studentTRule: DistributionRule<'student-t'> = {
  kind: 'student-t',
  label: 'Student t (scaled, shifted)',
  shortLabel: 'scaled t',
  treat(spec) {
    return { estimate: spec.value, standardUncertainty: spec.scale, dof: spec.dof };
  },
  sampler: (spec) => scaledShiftedT(spec.value, spec.scale, spec.dof),
  uncertaintyFields: ['scale'],
  kurtosis: (_spec, drawnDof) => tKurtosis(drawnDof),
  ownDof: true,
  /** s with its ν, divisor 1 (JCGM 101:2008 6.4.9). */
  statement: (d, w) => ({ text: `s = ${w.uncertainty(d.scale)}, ν = ${w.number(d.dof)}`, amount: d.scale, divisor: 1, divisorText: '1', statedDof: d.dof }),
  explainU: (_d, w) => ({ formula: 'u(xᵢ) = s (scale of the t-distribution)', substituted: `u(xᵢ) = ${w.u}`, clause: 'JCGM 101:2008 6.4.9' }),
  form: {
    ways: [
      {
        id: 'scale',
        label: 'a scale s with its degrees of freedom',
        fields: [
          { name: 'value', label: 'Value', unit: 'value', required: true },
          { name: 'scale', label: 'Scale s', unit: 'uncertainty', required: true },
          { name: 'dof', label: 'Degrees of freedom ν', unit: 'dimensionless', required: true },
        ],
      },
    ],
    wayOf: () => 'scale',
  },
  /** s = u with the given ν, or ν = 10 where the old ν was infinite (JCGM 101:2008 6.4.9). */
  fromStandardUncertainty: (x, u, nu) => ({ kind: 'student-t', value: x, scale: u, dof: Number.isFinite(nu) ? nu : 10 }),
};

/**
 * Draws ξ = location + scale·t_ν, the scaled and shifted t-distribution
 * t_ν(location, scale²) (JCGM 101:2008 6.4.9): this kind, repeated
 * observations (scale s/√n) and a normal input stated with its ν (scale U/k)
 * all draw it. Its standard deviation is scale·√(ν/(ν − 2)), for ν > 2 only.
 */
export function scaledShiftedT(location: number, scale: number, dof: number): Sampler {
  return {
    tDof: dof,
    fill(rng, out, n) {
      fillStudentT(rng, out, n, dof);
      for (let i = 0; i < n; i++) out[i] = location + scale * out[i];
    },
  };
}

/** β₂ of t with ν degrees of freedom: 3 + 6/(ν − 4) for ν > 4; Infinity for ν ≤ 4, where the fourth moment does not exist. */
export function tKurtosis(dof: number): number {
  return dof > 4 ? 3 + 6 / (dof - 4) : Infinity;
}
