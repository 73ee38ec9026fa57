import { z } from 'zod';
import { finite, positive, degreesOfFreedom, dofOptions, statedOptions } from '../budget/field-schemas';
import { LIMITS } from '../budget/limits';
import type { DistributionOf } from '../budget/schema';
import type { DistributionRule } from './distribution';
import { scaledShiftedT, tKurtosis } from './student-t';
import { arithmeticMean, experimentalStandardDeviation } from './type-a';
import { roundSignificant } from '../format/significant-digits';

/** The fields of the `observations` kind in the budget file, with the messages that say what to write. */
export const observationsSchema = z.looseObject({
  kind: z.literal('observations'),
  values: z
    .array(finite(), { error: 'must be a list of numbers' })
    .min(2, { message: 'needs at least 2 observations' })
    .max(LIMITS.observations, { message: `allows at most ${LIMITS.observations} observations` }),
  pooledSd: positive().optional(),
  pooledDof: degreesOfFreedom().optional(),
  ...dofOptions,
  ...statedOptions,
});

/**
 * Input evaluated from n repeated observations (Type A, GUM 4.2):
 * x = q̄ (4.2.1), u = s(q_k)/√n with ν = n − 1 (4.2.3, G.3.3), or with a pooled
 * estimate u = s_p/√n and ν = pooledDof (4.2.4). Draws the scaled and shifted
 * t-distribution ξ = q̄ + (s/√n)·t_ν (JCGM 101:2008 6.4.9), same scale and ν.
 * An override `dof` changes only the GUM ν, never these draws.
 */
export const observationsRule: DistributionRule<'observations'> = {
  kind: 'observations',
  label: 'Repeated observations (Type A)',
  shortLabel: 'Type A, n obs.',
  treat(spec) {
    const { mean, scale, dof } = observationStatistics(spec);
    return { estimate: mean, standardUncertainty: scale, dof };
  },
  sampler(spec) {
    const { mean, scale, dof } = observationStatistics(spec);
    return scaledShiftedT(mean, scale, dof);
  },
  uncertaintyFields: ['pooledSd'],
  kurtosis: (_spec, drawnDof) => tKurtosis(drawnDof),
  check(d, fail) {
    if ((d.pooledSd === undefined) !== (d.pooledDof === undefined)) {
      fail(d.pooledSd === undefined ? 'pooledSd' : 'pooledDof', 'pooledSd and pooledDof go together');
    } else if (d.uncertaintyUnit !== undefined && d.pooledSd === undefined) {
      fail('uncertaintyUnit', 'observations are in the unit of the value; uncertaintyUnit applies only to pooledSd');
    }
  },
  /** n readings with s, or a pooled s_p with its ν; divisor √n (GUM 4.2.3, 4.2.4). */
  statement(d, w) {
    const n = d.values.length;
    if (d.pooledSd !== undefined) {
      return { text: `${n} readings, pooled s = ${w.uncertainty(d.pooledSd)} (ν = ${w.number(d.pooledDof as number)})`, amount: d.pooledSd, divisor: Math.sqrt(n), divisorText: `√${n}` };
    }
    const s = experimentalStandardDeviation(d.values);
    return { text: `${n} readings, s = ${w.computed(s)}`, amount: s, divisor: Math.sqrt(n), divisorText: `√${n}` };
  },
  explainU(d, w) {
    const n = d.values.length;
    if (d.pooledSd !== undefined) {
      return { formula: 'u(xᵢ) = s_p / √n', substituted: `u(xᵢ) = ${w.figure(d.pooledSd)} / √${n} = ${w.u}`, clause: 'GUM 4.2.4' };
    }
    return { formula: 'u(xᵢ) = s(q) / √n', substituted: `u(xᵢ) = ${w.figure(w.standardUncertainty * Math.sqrt(n))} / √${n} = ${w.u}`, clause: 'GUM 4.2.2, 4.2.3' };
  },
  explainDof(d, w) {
    return d.pooledDof !== undefined
      ? { formula: 'νᵢ = ν of the pooled estimate', substituted: `νᵢ = ${w.nu}`, clause: 'GUM 4.2.4' }
      : { formula: 'νᵢ = n − 1', substituted: `νᵢ = ${d.values.length} − 1 = ${w.nu}`, clause: 'GUM G.3.3' };
  },
  form: {
    ways: [{ id: 'values', label: 'repeated observations', fields: [{ name: 'values', label: 'Observations', unit: 'value', required: true, list: true }] }],
    wayOf: () => 'values',
    dof: { option: 'n − 1 (default)', text: 'n − 1' },
  },
  /**
   * Two readings x − u and x + u: their mean is x and s/√n = (u·√2)/√2 = u
   * with ν = 1 (GUM 4.2.3), the fewest readings that give u.
   */
  fromStandardUncertainty: (x, u) => ({ kind: 'observations', values: [x - u, x + u].map((v) => roundSignificant(v, 15)) }),
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
