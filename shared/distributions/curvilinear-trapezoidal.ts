import { z } from 'zod';
import { finite, positive, dofOptions, statedOptions } from '../budget/field-schemas';
import { halfWidthForm, type DistributionRule } from './distribution';
import { UNIFORM_SCRATCH_LENGTH, uniformScratch } from '../random/uniform-scratch';

/** The fields of the `curvilinear-trapezoidal` kind in the budget file, with the messages that say what to write. */
export const curvilinearTrapezoidalSchema = z.looseObject({
  kind: z.literal('curvilinear-trapezoidal'),
  value: finite(),
  halfWidth: positive(),
  halfWidthUncertainty: finite().refine((d) => d >= 0, { message: 'must not be negative' }),
  ...dofOptions,
  ...statedOptions,
});

/**
 * Rectangular input whose limits are inexactly known: nominal limits
 * a₋ = x − a, a₊ = x + a, each known only to ±d (JCGM 101:2008 6.4.3).
 * x = value, u = √(a²/3 + d²/9), ν = ∞ (JCGM 101:2008 6.4.3 with (a₊ − a₋)/2 = a).
 * Draws (JCGM 101:2008 6.4.3): a_s = (a₋ − d) + 2d·r₁, b_s = (a₋ + a₊) − a_s,
 * ξ = a_s + (b_s − a_s)·r₂.
 */
export const curvilinearTrapezoidalRule: DistributionRule<'curvilinear-trapezoidal'> = {
  kind: 'curvilinear-trapezoidal',
  label: 'Curvilinear trapezoidal',
  shortLabel: 'curv. trapezoidal',
  treat(spec) {
    const a = spec.halfWidth;
    const d = spec.halfWidthUncertainty;
    return { estimate: spec.value, standardUncertainty: Math.sqrt((a * a) / 3 + (d * d) / 9), dof: Infinity };
  },
  sampler(spec) {
    const lower = spec.value - spec.halfWidth;
    const sumOfLimits = 2 * spec.value;
    const d = spec.halfWidthUncertainty;
    return {
      fill(rng, out, n) {
        rng.fill(out, n);
        const r2 = uniformScratch();
        for (let start = 0; start < n; start += UNIFORM_SCRATCH_LENGTH) {
          const m = Math.min(UNIFORM_SCRATCH_LENGTH, n - start);
          rng.fill(r2, m);
          for (let j = 0; j < m; j++) {
            const as = lower - d + 2 * d * out[start + j];
            out[start + j] = as + (sumOfLimits - 2 * as) * r2[j];
          }
        }
      },
    };
  },
  uncertaintyFields: ['halfWidth', 'halfWidthUncertainty'],
  /**
   * A rectangle of half-width A uniform in [a − d, a + d] (JCGM 101:2008 6.4.3):
   * β₂ = 9·E[A⁴] / (5·E[A²]²) with E[A²] = a² + d²/3 and E[A⁴] = a⁴ + 2a²d² + d⁴/5.
   */
  kurtosis(spec) {
    const a = spec.halfWidth;
    const d = spec.halfWidthUncertainty;
    const a2 = a * a + (d * d) / 3;
    const a4 = a ** 4 + 2 * a * a * d * d + d ** 4 / 5;
    return (9 * a4) / (5 * a2 * a2);
  },
  check(d, fail) {
    if (d.halfWidthUncertainty > d.halfWidth) fail('halfWidthUncertainty', 'must not exceed halfWidth');
  },
  /** ± a with the limits known to ± d; u = √(a²/3 + d²/9), so the divisor of a depends on d/a and is given as a number (JCGM 101:2008 6.4.3). */
  statement(d, w) {
    const divisor = Math.sqrt(1 / (1 / 3 + (d.halfWidthUncertainty / d.halfWidth) ** 2 / 9));
    return {
      text: `± ${w.uncertainty(d.halfWidth)}, limits known to ± ${w.inUncertaintyUnit(d.halfWidthUncertainty)}`,
      amount: d.halfWidth,
      divisor,
      divisorText: w.fourDigits(divisor),
    };
  },
  explainU: (d, w) => ({
    formula: 'u(xᵢ) = √(a²/3 + d²/9)',
    substituted: `u(xᵢ) = √(${w.figure(d.halfWidth)}²/3 + ${w.figure(d.halfWidthUncertainty)}²/9) = ${w.u}`,
    clause: 'JCGM 101:2008 6.4.3',
  }),
  form: halfWidthForm({ name: 'halfWidthUncertainty', label: 'Uncertainty of the half-width d', unit: 'uncertainty', required: true }),
  /** d = 0 and a = u·√3, a rectangle with exact limits (JCGM 101:2008 6.4.3). */
  fromStandardUncertainty: (x, u) => ({ kind: 'curvilinear-trapezoidal', value: x, halfWidth: u * Math.sqrt(3), halfWidthUncertainty: 0 }),
};
