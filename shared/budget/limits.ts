/** Hard limits of one budget; each is refused with a message that names it. */
export const LIMITS = {
  modelLength: 20_000,
  inputs: 500,
  trials: 50_000_000,
  observations: 100_000,
  /** Parentheses and function calls nested in one model line; deeper is refused naming the line. */
  modelNesting: 64,
  /**
   * Depth of one model line's expression tree (`a + b + c` is 3 deep): every
   * stage, and the JavaScript parser of the generated code, recurse over it.
   */
  modelTreeDepth: 1_000,
} as const;

/**
 * Bounds of the symbolic sensitivity coefficients. The measurand's tree with
 * every intermediate inlined may grow exponentially with the number of lines
 * (`a2 = a1 * a1`), and a derivative is larger than its tree; beyond these
 * bounds the coefficients are central differences (JCGM 100:2008 5.1.3), never
 * a refusal. The generated code computes each line once and is not bounded
 * by them.
 */
export const SYMBOLIC_LIMITS = {
  /** Nodes of the inlined measurand tree (counted without building it). */
  symbolicModelNodes: 4_000,
  /** Used inputs × inlined nodes: the work of differentiating for every input. */
  symbolicWork: 200_000,
  /** Nodes of one derivative tree; a larger one is left to differences. */
  derivativeNodes: 40_000,
} as const;

/** Defaults of the budget file v1. */
export const DEFAULTS = {
  coverageProbability: 0.95,
  trials: 1_000_000,
  significantDigits: 2,
  seed: 'dubito',
} as const;
