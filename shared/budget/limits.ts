/** Hard limits of one budget; each is refused with a message that names it. */
export const LIMITS = {
  modelLength: 20_000,
  inputs: 500,
  trials: 50_000_000,
  observations: 100_000,
} as const;

/** Defaults of the budget file v1. */
export const DEFAULTS = {
  coverageProbability: 0.95,
  trials: 1_000_000,
  significantDigits: 2,
  seed: 'dubito',
} as const;
