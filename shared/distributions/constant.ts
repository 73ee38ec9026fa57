import type { DistributionRule } from './distribution';

/** Exactly known quantity: x = value, u = 0, ν = ∞; every draw is the value. */
export const constantRule: DistributionRule<'constant'> = {
  kind: 'constant',
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
};
