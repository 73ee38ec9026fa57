import type { Distribution } from '../budget/schema';
// the registry asks for the kurtosis and this asks the registry for the kind's rule, both only when called
import { ruleFor } from './registry';

/**
 * Kurtosis β₂ = μ₄/σ⁴ of the shape an input is drawn from (JCGM 101:2008 6.4),
 * which the higher-order terms of the law of propagation need for an input that
 * is not Gaussian: each kind's rule gives its closed form (`kurtosis`), with
 * `drawnDof` the ν the sampler draws with, never an override. Every shape is
 * symmetric, so the third moment is 0.
 */
export function shapeKurtosis(spec: Distribution, drawnDof: number): number {
  return ruleFor(spec).kurtosis(spec, drawnDof);
}
