import type { DistributionKind, DistributionOf } from '../budget/schema';
import type { UniformGenerator } from '../random/uniform-generator';

/** The GUM treatment of an input quantity: estimate x, standard uncertainty u(x), degrees of freedom ν (Infinity for ∞). */
export interface GumTreatment {
  estimate: number;
  standardUncertainty: number;
  dof: number;
}

/** Draws from the probability distribution assigned to an input (JCGM 101:2008 6.4). */
export interface Sampler {
  /** Fills out[0..n) with n independent draws. */
  fill(rng: UniformGenerator, out: Float64Array, n: number): void;
  /**
   * ν of the scaled and shifted t-distribution drawn (JCGM 101:2008 6.4.9);
   * absent for other distributions. The draws have a variance only for ν > 2
   * and an expectation only for ν > 1.
   */
  tDof?: number;
}

/** One distribution kind of the budget file: its GUM treatment and its Monte Carlo sampler. */
export interface DistributionRule<K extends DistributionKind> {
  kind: K;
  /** x, u and ν before any `dof` / `relativeUncertaintyOfU` override. */
  treat(spec: DistributionOf<K>): GumTreatment;
  sampler(spec: DistributionOf<K>): Sampler;
}
