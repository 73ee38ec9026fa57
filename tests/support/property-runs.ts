import type { Parameters } from 'fast-check';

/**
 * Bounded, reproducible fast-check runs. The seed is fixed so CI sees the same
 * cases every time; a failure prints `seed` and `path`, and
 * `DUBITO_PROPERTY_SEED=<seed> DUBITO_PROPERTY_PATH=<path> npx vitest run <file>`
 * replays exactly the shrunk counterexample; `DUBITO_PROPERTY_RUNS=<n>` runs
 * n cases instead of the bounded default, for a longer search by hand.
 */
export function propertyRuns<T>(numRuns: number): Parameters<T> {
  numRuns = Number(process.env.DUBITO_PROPERTY_RUNS ?? numRuns);
  const seed = Number(process.env.DUBITO_PROPERTY_SEED ?? 20_261_202);
  const path = process.env.DUBITO_PROPERTY_PATH;
  return { numRuns, seed, ...(path ? { path } : {}) };
}
