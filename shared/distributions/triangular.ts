import { z } from 'zod';
import { finite, positive, dofOptions, statedOptions } from '../budget/field-schemas';
import { halfWidthForm, type DistributionRule } from './distribution';
import { UNIFORM_SCRATCH_LENGTH, uniformScratch } from '../random/uniform-scratch';

/** The fields of the `triangular` kind in the budget file, with the messages that say what to write. */
export const triangularSchema = z.looseObject({
  kind: z.literal('triangular'),
  value: finite(),
  halfWidth: positive(),
  ...dofOptions,
  ...statedOptions,
});

/**
 * Symmetric triangular input on [x − a, x + a]: x = value, u = a/√6, ν = ∞
 * (GUM 4.3.9). Draws ξ = (x − a) + a·(r₁ + r₂), the sum of two uniforms
 * (JCGM 101:2008 6.4.5: ξ = a₋ + (a₊ − a₋)/2·(r₁ + r₂)).
 * The uniforms are 32-bit, r = (w + ½)·2⁻³² ∈ (0, 1) (UniformGenerator.fill32):
 * a 2⁻³² grid lies far below the resolution of any half-width, and
 * JCGM 101:2008 C.3 asks for statistical quality, not 53-bit resolution.
 */
export const triangularRule: DistributionRule<'triangular'> = {
  kind: 'triangular',
  label: 'Triangular',
  shortLabel: 'triangular',
  treat(spec) {
    return { estimate: spec.value, standardUncertainty: spec.halfWidth / Math.sqrt(6), dof: Infinity };
  },
  sampler(spec) {
    const lower = spec.value - spec.halfWidth;
    const a = spec.halfWidth;
    return {
      fill(rng, out, n) {
        rng.fill32(out, n);
        const r2 = uniformScratch();
        for (let start = 0; start < n; start += UNIFORM_SCRATCH_LENGTH) {
          const m = Math.min(UNIFORM_SCRATCH_LENGTH, n - start);
          rng.fill32(r2, m);
          for (let j = 0; j < m; j++) out[start + j] = lower + a * (out[start + j] + r2[j]);
        }
      },
    };
  },
  uncertaintyFields: ['halfWidth'],
  /** β₂ = 12/5 (handbook moments of the symmetric triangular distribution). */
  kurtosis: () => 12 / 5,
  /** ± a, divisor √6 (GUM 4.3.9). */
  statement: (d, w) => ({ text: `± ${w.uncertainty(d.halfWidth)}`, amount: d.halfWidth, divisor: Math.sqrt(6), divisorText: '√6' }),
  explainU: (d, w) => ({ formula: 'u(xᵢ) = a / √6', substituted: `u(xᵢ) = ${w.figure(d.halfWidth)} / √6 = ${w.u}`, clause: 'GUM 4.3.9' }),
  form: halfWidthForm(),
  /** a = u·√6 (GUM 4.3.9). */
  fromStandardUncertainty: (x, u) => ({ kind: 'triangular', value: x, halfWidth: u * Math.sqrt(6) }),
};
