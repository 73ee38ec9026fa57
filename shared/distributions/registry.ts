import type { Distribution, DistributionKind, DistributionOf } from '../budget/schema';
import type { DistributionRule, GumTreatment, Sampler } from './distribution';
import { normalRule, normalSchema } from './normal';
import { rectangularRule, rectangularSchema } from './rectangular';
import { triangularRule, triangularSchema } from './triangular';
import { arcsineRule, arcsineSchema } from './arcsine';
import { trapezoidalRule, trapezoidalSchema } from './trapezoidal';
import { curvilinearTrapezoidalRule, curvilinearTrapezoidalSchema } from './curvilinear-trapezoidal';
import { studentTRule, studentTSchema } from './student-t';
import { observationsRule, observationsSchema } from './observations';
import { constantRule, constantSchema } from './constant';
import { shapeKurtosis } from './kurtosis';
import { inValueUnit } from './uncertainty-unit';

/**
 * The one list of distribution kinds: the fields of each in the budget file
 * (the budget schema is their union), and its rule. A kind with fields but no
 * rule, or a rule without fields, fails to compile.
 */
export const DISTRIBUTION_SCHEMAS = [
  normalSchema,
  rectangularSchema,
  triangularSchema,
  arcsineSchema,
  trapezoidalSchema,
  curvilinearTrapezoidalSchema,
  studentTSchema,
  observationsSchema,
  constantSchema,
] as const;

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

/** The rule of a kind. */
export function ruleOf<K extends DistributionKind>(kind: K): DistributionRule<K> {
  return RULES[kind];
}

/** The rule of a distribution's kind, typed to take that distribution. */
export function ruleFor<K extends DistributionKind>(spec: DistributionOf<K>): DistributionRule<K> {
  return RULES[spec.kind as K];
}

/** Every kind, in the order a kind is offered. */
export const KINDS = Object.keys(RULES) as DistributionKind[];

/**
 * Effective degrees of freedom from the relative uncertainty of u:
 * ν ≈ ½·(Δu/u)⁻² (GUM G.4.2, eq. G.3). The budget schema admits
 * 0 < Δu/u ≤ 1/√2, so that ν ≥ 1 (see `RELATIVE_UNCERTAINTY_OF_U_LIMITS`).
 */
export function dofFromRelativeUncertainty(relativeUncertaintyOfU: number): number {
  return 0.5 / (relativeUncertaintyOfU * relativeUncertaintyOfU);
}

/**
 * The GUM treatment (x, u(x), ν) of an input whose value is in `valueUnit`,
 * with the uncertainty fields first taken into that unit (`inValueUnit`) and
 * the budget file's overrides applied to ν only: `dof` replaces ν (for
 * `student-t`, `dof` is already ν), and `relativeUncertaintyOfU` gives
 * ν = ½·(Δu/u)⁻² (GUM G.4.2).
 */
export function gumTreatment(stated: Distribution, valueUnit?: string): GumTreatment {
  const spec = inValueUnit(stated, valueUnit);
  const base = ruleFor(spec).treat(spec);
  if (spec.relativeUncertaintyOfU !== undefined) {
    return { ...base, dof: dofFromRelativeUncertainty(spec.relativeUncertaintyOfU) };
  }
  if (spec.dof !== undefined) return { ...base, dof: spec.dof };
  return base;
}

/**
 * Kurtosis β₂ of the shape an input is drawn from (`shapeKurtosis`), with the
 * ν the sampler uses (the rule's own, never an override): what the
 * higher-order terms of the law of propagation need beyond (x, u).
 */
export function inputKurtosis(spec: Distribution): number {
  return shapeKurtosis(spec, ruleFor(spec).treat(spec).dof);
}

/**
 * The Monte Carlo sampler of an input (JCGM 101:2008 6.4); overrides of ν
 * never change it. It draws in the unit of the uncertainty fields, so a spec
 * with `uncertaintyUnit` is refused: take it into the value's unit first
 * (`inValueUnit`, as `computeBudget` does).
 */
export function samplerFor(spec: Distribution): Sampler {
  if (spec.uncertaintyUnit !== undefined) throw new RangeError('the uncertainty is stated in its own unit: convert it with inValueUnit before sampling');
  return ruleFor(spec).sampler(spec);
}
