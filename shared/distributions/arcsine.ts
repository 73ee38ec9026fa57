import { z } from 'zod';
import { finite, positive, dofOptions, statedOptions } from '../budget/field-schemas';
import { halfWidthForm, type DistributionRule } from './distribution';

/** The fields of the `arcsine` kind in the budget file, with the messages that say what to write. */
export const arcsineSchema = z.looseObject({
  kind: z.literal('arcsine'),
  value: finite(),
  halfWidth: positive(),
  ...dofOptions,
  ...statedOptions,
});

/**
 * Arcsine (U-shaped) input on [x − a, x + a]: x = value, u = a/√2, ν = ∞
 * (JCGM 101:2008 6.4.6). Draws ξ = x + a·sin(2πr), r ~ R(0, 1) (JCGM 101:2008 6.4.6).
 * The uniforms are 32-bit, r = (w + ½)·2⁻³² ∈ (0, 1) (UniformGenerator.fill32):
 * a 2⁻³² grid lies far below the resolution of any half-width, and
 * JCGM 101:2008 C.3 asks for statistical quality, not 53-bit resolution.
 */
export const arcsineRule: DistributionRule<'arcsine'> = {
  kind: 'arcsine',
  label: 'Arcsine (U-shaped)',
  shortLabel: 'arcsine',
  treat(spec) {
    return { estimate: spec.value, standardUncertainty: spec.halfWidth / Math.SQRT2, dof: Infinity };
  },
  sampler(spec) {
    const x = spec.value;
    const a = spec.halfWidth;
    const twoPi = 2 * Math.PI;
    return {
      fill(rng, out, n) {
        rng.fill32(out, n);
        for (let i = 0; i < n; i++) out[i] = x + a * Math.sin(twoPi * out[i]);
      },
    };
  },
  uncertaintyFields: ['halfWidth'],
  /** β₂ = 3/2 (handbook moments of the arcsine distribution). */
  kurtosis: () => 3 / 2,
  /** ± a, divisor √2 (JCGM 101:2008 6.4.6). */
  statement: (d, w) => ({ text: `± ${w.uncertainty(d.halfWidth)}`, amount: d.halfWidth, divisor: Math.SQRT2, divisorText: '√2' }),
  explainU: (d, w) => ({ formula: 'u(xᵢ) = a / √2', substituted: `u(xᵢ) = ${w.figure(d.halfWidth)} / √2 = ${w.u}`, clause: 'JCGM 101:2008 6.4.6' }),
  form: halfWidthForm(),
  /** a = u·√2 (JCGM 101:2008 6.4.6). */
  fromStandardUncertainty: (x, u) => ({ kind: 'arcsine', value: x, halfWidth: u * Math.SQRT2 }),
};
