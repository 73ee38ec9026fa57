import type { UniformGenerator } from './uniform-generator';
import { UNIFORM_SCRATCH_LENGTH, uniformScratch } from './uniform-scratch';
import { fillStandardNormal } from './ziggurat-normal';

/**
 * Fills out[0..n) with independent draws from the standard t-distribution
 * with ν degrees of freedom, any real ν > 0 (JCGM 101:2008 6.4.9, C.6).
 *
 * Bailey's polar method (exact for real ν): v₁ = 2r₁ − 1, v₂ = 2r₂ − 1,
 * w = v₁² + v₂², accepted when 0 < w ≤ 1; then t = v₁·√(ν(w^(−2/ν) − 1)/w).
 * w^(−2/ν) − 1 is computed as expm1(−2 ln w / ν) to stay accurate at large ν;
 * ν = ∞ gives standard normal draws. Only v₁ is used: the partner value v₂·(…) is t-distributed too but not
 * independent of the first.
 */
export function fillStudentT(rng: UniformGenerator, out: Float64Array, n: number, dof: number): void {
  if (!(dof > 0)) throw new RangeError(`degrees of freedom must be greater than 0 (got ${dof})`);
  if (dof === Infinity) {
    fillStandardNormal(rng, out, n);
    return;
  }
  const u = uniformScratch();
  const exponent = -2 / dof;
  let used = UNIFORM_SCRATCH_LENGTH;
  let i = 0;
  while (i < n) {
    if (used === UNIFORM_SCRATCH_LENGTH) {
      rng.fill(u, UNIFORM_SCRATCH_LENGTH);
      used = 0;
    }
    const v1 = 2 * u[used] - 1;
    const v2 = 2 * u[used + 1] - 1;
    used += 2;
    const w = v1 * v1 + v2 * v2;
    if (w > 1 || w === 0) continue;
    out[i++] = v1 * Math.sqrt((dof * Math.expm1(exponent * Math.log(w))) / w);
  }
}
