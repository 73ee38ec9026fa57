import { z } from 'zod';
import { finite, dofOptions, statedOptions } from '../budget/field-schemas';
import type { DistributionRule } from './distribution';

/** The fields of the `constant` kind in the budget file, with the messages that say what to write. */
export const constantSchema = z.looseObject({
  kind: z.literal('constant'),
  value: finite(),
  ...dofOptions,
  ...statedOptions,
});

/** Exactly known quantity: x = value, u = 0, ν = ∞; every draw is the value. */
export const constantRule: DistributionRule<'constant'> = {
  kind: 'constant',
  label: 'Exact value (no uncertainty)',
  shortLabel: 'exact',
  treat(spec) {
    return { estimate: spec.value, standardUncertainty: 0, dof: Infinity };
  },
  sampler(spec) {
    const x = spec.value;
    return {
      fill(_rng, out, n) {
        out.fill(x, 0, n);
      },
    };
  },
  uncertaintyFields: [],
  /** u = 0, so it never enters; 3 by convention. */
  kurtosis: () => 3,
  check(d, fail) {
    if (d.uncertaintyUnit !== undefined) fail('uncertaintyUnit', 'a constant has no uncertainty to give a unit to: remove uncertaintyUnit');
  },
  statement: (d, w) => ({ text: `${w.value(d.value)}, exact`, amount: null, divisor: null, divisorText: null }),
  explainU: () => ({ formula: 'u(xᵢ) = 0', substituted: 'the value is taken as exact', clause: 'GUM 4.1' }),
  form: {
    ways: [{ id: 'value', label: 'an exact value', fields: [{ name: 'value', label: 'Value', unit: 'value', required: true }] }],
    wayOf: () => 'value',
  },
  /** The value alone; u is 0 whatever was given. */
  fromStandardUncertainty: (x) => ({ kind: 'constant', value: x }),
};
