import type { DistributionOf } from '../budget/schema';
import type { DistributionRule } from './distribution';

/**
 * Rectangular input on [a₋, a₊]: x = (a₋ + a₊)/2, u = a/√3 with a = (a₊ − a₋)/2,
 * ν = ∞ (GUM 4.3.7). Draws ξ = a₋ + (a₊ − a₋)·r, r ~ R(0, 1) (JCGM 101:2008 6.4.2),
 * r = (w + ½)·2⁻³² from one 32-bit word (UniformGenerator.fill32: resolution
 * 2⁻³² of the width, far finer than any limits are known; C.3 asks for
 * statistical quality, not 53 bits).
 */
export const rectangularRule: DistributionRule<'rectangular'> = {
  kind: 'rectangular',
  treat(spec) {
    const { lower, upper } = rectangularLimits(spec);
    return { estimate: (lower + upper) / 2, standardUncertainty: (upper - lower) / 2 / Math.sqrt(3), dof: Infinity };
  },
  sampler(spec) {
    const { lower, upper } = rectangularLimits(spec);
    const width = upper - lower;
    return {
      fill(rng, out, n) {
        rng.fill32(out, n, lower, width);
      },
    };
  },
};

/** The limits a₋, a₊ from `lower`/`upper` or from `value` ± `halfWidth`. */
function rectangularLimits(spec: DistributionOf<'rectangular'>): { lower: number; upper: number } {
  if (spec.lower !== undefined && spec.upper !== undefined) return { lower: spec.lower, upper: spec.upper };
  if (spec.value !== undefined && spec.halfWidth !== undefined) {
    return { lower: spec.value - spec.halfWidth, upper: spec.value + spec.halfWidth };
  }
  throw new RangeError('a rectangular distribution needs value with halfWidth, or lower with upper');
}
