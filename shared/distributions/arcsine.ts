import type { DistributionRule } from './distribution';

/**
 * Arcsine (U-shaped) input on [x − a, x + a]: x = value, u = a/√2, ν = ∞
 * (JCGM 101:2008 6.4.6). Draws ξ = x + a·sin(2πr), r ~ R(0, 1) (JCGM 101:2008 6.4.6).
 * The uniforms are 32-bit, r = (w + ½)·2⁻³² ∈ (0, 1) (UniformGenerator.fill32):
 * a 2⁻³² grid lies far below the resolution of any half-width, and
 * JCGM 101:2008 C.3 asks for statistical quality, not 53-bit resolution.
 */
export const arcsineRule: DistributionRule<'arcsine'> = {
  kind: 'arcsine',
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
};
