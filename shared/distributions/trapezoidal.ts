import { z } from 'zod';
import { finite, positive, dofOptions, statedOptions } from '../budget/field-schemas';
import { halfWidthForm, type DistributionRule } from './distribution';
import { UNIFORM_SCRATCH_LENGTH, uniformScratch } from '../random/uniform-scratch';

/** The fields of the `trapezoidal` kind in the budget file, with the messages that say what to write. */
export const trapezoidalSchema = z.looseObject({
  kind: z.literal('trapezoidal'),
  value: finite(),
  halfWidth: positive(),
  beta: finite().refine((b) => b >= 0 && b <= 1, { message: 'must lie between 0 and 1' }),
  ...dofOptions,
  ...statedOptions,
});

/**
 * Symmetric trapezoidal input on [x − a, x + a] with top/base ratio β:
 * x = value, u = a·√((1 + β²)/6), ν = ∞ (JCGM 101:2008 6.4.4; GUM 4.3.9 note 2).
 * Draws ξ = a₋ + (a₊ − a₋)/2·[(1 + β)r₁ + (1 − β)r₂] (JCGM 101:2008 6.4.4),
 * here with (a₊ − a₋)/2 = a.
 * The uniforms are 32-bit, r = (w + ½)·2⁻³² ∈ (0, 1) (UniformGenerator.fill32):
 * a 2⁻³² grid lies far below the resolution of any half-width, and
 * JCGM 101:2008 C.3 asks for statistical quality, not 53-bit resolution.
 */
export const trapezoidalRule: DistributionRule<'trapezoidal'> = {
  kind: 'trapezoidal',
  label: 'Trapezoidal',
  shortLabel: 'trapezoidal',
  treat(spec) {
    const { halfWidth: a, beta } = spec;
    return { estimate: spec.value, standardUncertainty: a * Math.sqrt((1 + beta * beta) / 6), dof: Infinity };
  },
  sampler(spec) {
    const lower = spec.value - spec.halfWidth;
    const wide = spec.halfWidth * (1 + spec.beta);
    const narrow = spec.halfWidth * (1 - spec.beta);
    return {
      fill(rng, out, n) {
        rng.fill32(out, n);
        const r2 = uniformScratch();
        for (let start = 0; start < n; start += UNIFORM_SCRATCH_LENGTH) {
          const m = Math.min(UNIFORM_SCRATCH_LENGTH, n - start);
          rng.fill32(r2, m);
          for (let j = 0; j < m; j++) out[start + j] = lower + wide * out[start + j] + narrow * r2[j];
        }
      },
    };
  },
  uncertaintyFields: ['halfWidth'],
  /**
   * The sum of two rectangles of half-widths a(1+β)/2 and a(1−β)/2 (JCGM 101:2008 6.4.4):
   * fourth cumulant −(2/15)(a₁⁴ + a₂⁴) against the variance (a₁² + a₂²)/3.
   */
  kurtosis(spec) {
    const a1 = (1 + spec.beta) / 2;
    const a2 = (1 - spec.beta) / 2;
    const variance = (a1 ** 2 + a2 ** 2) / 3;
    return 3 - ((2 / 15) * (a1 ** 4 + a2 ** 4)) / variance ** 2;
  },
  /** ± a with β, divisor √(6/(1 + β²)) as a number (GUM 4.3.9 note 2). */
  statement(d, w) {
    const divisor = Math.sqrt(6 / (1 + d.beta * d.beta));
    return { text: `± ${w.uncertainty(d.halfWidth)}, β = ${w.number(d.beta)}`, amount: d.halfWidth, divisor, divisorText: w.fourDigits(divisor) };
  },
  explainU: (d, w) => ({
    formula: 'u(xᵢ) = a · √((1 + β²) / 6)',
    substituted: `u(xᵢ) = ${w.figure(d.halfWidth)} · √((1 + ${w.figure(d.beta)}²) / 6) = ${w.u}`,
    clause: 'GUM 4.3.9, JCGM 101:2008 6.4.4',
  }),
  form: halfWidthForm({ name: 'beta', label: 'β (top to base ratio, 0 to 1)', unit: 'dimensionless', required: true }),
  /** β = 0.5 and a = u·√(6/(1 + β²)) (GUM 4.3.9 note 2). */
  fromStandardUncertainty: (x, u) => ({ kind: 'trapezoidal', value: x, halfWidth: u * Math.sqrt(6 / 1.25), beta: 0.5 }),
};
