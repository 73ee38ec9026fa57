import type { Distribution, DistributionKind, DistributionOf } from '../budget/schema';
import type { DistributionRule, GumTreatment, Sampler } from './distribution';
import { normalRule } from './normal';
import { rectangularRule } from './rectangular';
import { triangularRule } from './triangular';
import { arcsineRule } from './arcsine';
import { trapezoidalRule } from './trapezoidal';
import { curvilinearTrapezoidalRule } from './curvilinear-trapezoidal';
import { studentTRule } from './student-t';
import { observationsRule } from './observations';
import { constantRule } from './constant';

/** Every kind of the budget file has its rule; a kind left out fails to compile. */
const RULES: { [K in DistributionKind]: DistributionRule<K> } = {
  normal: normalRule,
  rectangular: rectangularRule,
  triangular: triangularRule,
  arcsine: arcsineRule,
  trapezoidal: trapezoidalRule,
  'curvilinear-trapezoidal': curvilinearTrapezoidalRule,
  'student-t': studentTRule,
  observations: observationsRule,
  constant: constantRule,
};

function ruleFor<K extends DistributionKind>(spec: DistributionOf<K>): DistributionRule<K> {
  return RULES[spec.kind as K];
}

/**
 * Effective degrees of freedom from the relative uncertainty of u:
 * ν ≈ ½·(Δu/u)⁻² (GUM G.4.2, eq. G.3).
 */
export function dofFromRelativeUncertainty(relativeUncertaintyOfU: number): number {
  return 0.5 / (relativeUncertaintyOfU * relativeUncertaintyOfU);
}

/**
 * The GUM treatment (x, u(x), ν) of an input, with the budget file's
 * overrides applied to ν only: `dof` replaces ν (for `student-t`, `dof` is
 * already ν), and `relativeUncertaintyOfU` gives ν = ½·(Δu/u)⁻² (GUM G.4.2).
 */
export function gumTreatment(spec: Distribution): GumTreatment {
  const base = ruleFor(spec).treat(spec);
  if (spec.relativeUncertaintyOfU !== undefined) {
    return { ...base, dof: dofFromRelativeUncertainty(spec.relativeUncertaintyOfU) };
  }
  if (spec.dof !== undefined) return { ...base, dof: spec.dof };
  return base;
}

/** The Monte Carlo sampler of an input (JCGM 101:2008 6.4); overrides of ν never change it. */
export function samplerFor(spec: Distribution): Sampler {
  return ruleFor(spec).sampler(spec);
}
