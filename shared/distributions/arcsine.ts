import type { DistributionRule } from './distribution';

/**
 * Arcsine (U-shaped) input on [x − a, x + a]: x = value, u = a/√2, ν = ∞
 * (JCGM 101:2008 6.4.6). Draws ξ = x + a·sin(2πr), r ~ R(0, 1) (JCGM 101:2008 6.4.6).
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
        rng.fill(out, n);
        for (let i = 0; i < n; i++) out[i] = x + a * Math.sin(twoPi * out[i]);
      },
    };
  },
};
