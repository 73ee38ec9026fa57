/**
 * A reusable block of uniforms for samplers that use a varying number of
 * uniforms per draw (rejection methods) or several per draw. One block is
 * shared by all samplers: JavaScript runs one sampler at a time per thread,
 * and a sampler must not call another sampler while it holds the block.
 */
export const UNIFORM_SCRATCH_LENGTH = 4096;

let scratch: Float64Array | null = null;

/** The shared block of UNIFORM_SCRATCH_LENGTH numbers (allocated once). */
export function uniformScratch(): Float64Array {
  if (scratch === null) scratch = new Float64Array(UNIFORM_SCRATCH_LENGTH);
  return scratch;
}
