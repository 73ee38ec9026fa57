import { z } from 'zod';
import { LIMITS } from './limits';

/*
 * Budget file v1 (format "dubito-budget/1"). Objects are loose: fields this
 * version does not know are kept, so an export returns them unchanged.
 */

const finite = (what = 'a number') =>
  z.number({ error: `must be ${what}` }).refine(Number.isFinite, { message: `must be ${what}` });
const positive = () => finite().refine((v) => v > 0, { message: 'must be greater than 0' });
const symbolName = z
  .string({ error: 'must be a symbol name' })
  .regex(/^[A-Za-z_][A-Za-z0-9_]*$/, {
    message: 'must start with a letter or _ and contain only letters, digits and _',
  });
const unitText = z.string({ error: 'must be a unit expression such as "mg" or "kg/m^3"' }).max(100);

/**
 * Degrees of freedom ν ≥ 1. Below 1 the coverage factor t_p(ν) runs away
 * (t₀.₉₇₅(1) = 12.7 and t_p(ν) → ∞ as ν → 0) and no longer describes a
 * reliability of u that a laboratory could state (JCGM 100:2008 G.4.2, G.3).
 */
const degreesOfFreedom = () =>
  positive().refine((v) => !(v > 0) || v >= 1, {
    message: 'must be at least 1: below 1 degree of freedom the coverage factor t_p(ν) is unbounded (JCGM 100:2008 G.3, G.4.2)',
  });

/** Largest relative uncertainty of u: ½·(Δu/u)⁻² = 1 at Δu/u = 1/√2 (JCGM 100:2008 G.4.2). */
const MAX_RELATIVE_UNCERTAINTY_OF_U = Math.SQRT1_2;

/**
 * Δu/u as a fraction, 0 < Δu/u ≤ 1/√2, so that ν = ½·(Δu/u)⁻² ≥ 1 (JCGM 100:2008 G.4.2):
 * above 1 it is a percentage typed as a number; between 1/√2 and 1 it gives ν < 1.
 */
const relativeUncertaintyOfU = () =>
  positive()
    .refine((v) => !(v > 1), { message: 'is the relative uncertainty of u as a fraction, at most 1: write 0.10 for 10 %' })
    .refine((v) => !(v > MAX_RELATIVE_UNCERTAINTY_OF_U && v <= 1), {
      message: 'must be at most 0.707: ν = ½·(Δu/u)⁻² falls below 1 degree of freedom, where the coverage factor is unbounded (JCGM 100:2008 G.4.2)',
    });

/** Fields every distribution kind may carry; both act on ν only (GUM G.4.2). */
const dofOptions = {
  dof: degreesOfFreedom().optional(),
  relativeUncertaintyOfU: relativeUncertaintyOfU().optional(),
};

/**
 * How the laboratory stated an input, kept so that every screen and the report
 * show it as entered: from a calibration certificate, the resolution of an
 * indicating instrument (a = r/2, GUM F.2.2.1), a manufacturer's specification
 * or a tolerance ± a, repeated observations, or an estimate of the lab's own.
 */
const STATED_AS = ['certificate', 'resolution', 'specification', 'tolerance', 'observations', 'estimate'] as const;
export type StatedAs = (typeof STATED_AS)[number];

const statedSchema = z.looseObject({
  as: z.enum(STATED_AS, { error: `must be one of ${STATED_AS.join(', ')}` }),
  source: z.string({ error: 'must be text, e.g. the certificate number' }).max(300).optional(),
});

/**
 * Fields of every kind about how the input was stated: `stated` (the form) and
 * `uncertaintyUnit`, the unit of the uncertainty fields when it differs from
 * the value's (12 mK for a value in °C; `%`, `ppm`, `ppb` relative to |value|).
 */
const statedOptions = {
  uncertaintyUnit: unitText.optional(),
  stated: statedSchema.optional(),
};

/** A coverage probability strictly between 0 and 1. */
const probability = () => finite().refine((p) => p > 0 && p < 1, { message: 'must lie strictly between 0 and 1 (write 0.95 for 95 %)' });

const normal = z.looseObject({
  kind: z.literal('normal'),
  value: finite(),
  u: positive().optional(),
  U: positive().optional(),
  k: positive().optional(),
  /** Coverage probability of U, given instead of k: k = t_{(1+p)/2}(dof), or z_{(1+p)/2} without dof (GUM G.3, EA-4/02). */
  p: probability().optional(),
  ...dofOptions,
  ...statedOptions,
});
const rectangular = z.looseObject({
  kind: z.literal('rectangular'),
  value: finite().optional(),
  halfWidth: positive().optional(),
  lower: finite().optional(),
  upper: finite().optional(),
  ...dofOptions,
  ...statedOptions,
});
const triangular = z.looseObject({
  kind: z.literal('triangular'),
  value: finite(),
  halfWidth: positive(),
  ...dofOptions,
  ...statedOptions,
});
const arcsine = z.looseObject({
  kind: z.literal('arcsine'),
  value: finite(),
  halfWidth: positive(),
  ...dofOptions,
  ...statedOptions,
});
const trapezoidal = z.looseObject({
  kind: z.literal('trapezoidal'),
  value: finite(),
  halfWidth: positive(),
  beta: finite().refine((b) => b >= 0 && b <= 1, { message: 'must lie between 0 and 1' }),
  ...dofOptions,
  ...statedOptions,
});
const curvilinearTrapezoidal = z.looseObject({
  kind: z.literal('curvilinear-trapezoidal'),
  value: finite(),
  halfWidth: positive(),
  halfWidthUncertainty: finite().refine((d) => d >= 0, { message: 'must not be negative' }),
  ...dofOptions,
  ...statedOptions,
});
const studentT = z.looseObject({
  kind: z.literal('student-t'),
  value: finite(),
  scale: positive(),
  dof: degreesOfFreedom(),
  relativeUncertaintyOfU: relativeUncertaintyOfU().optional(),
  ...statedOptions,
});
const observations = z.looseObject({
  kind: z.literal('observations'),
  values: z
    .array(finite(), { error: 'must be a list of numbers' })
    .min(2, { message: 'needs at least 2 observations' })
    .max(LIMITS.observations, { message: `allows at most ${LIMITS.observations} observations` }),
  pooledSd: positive().optional(),
  pooledDof: degreesOfFreedom().optional(),
  ...dofOptions,
  ...statedOptions,
});
const constant = z.looseObject({
  kind: z.literal('constant'),
  value: finite(),
  ...dofOptions,
  ...statedOptions,
});

export const DISTRIBUTION_KINDS = [
  'normal',
  'rectangular',
  'triangular',
  'arcsine',
  'trapezoidal',
  'curvilinear-trapezoidal',
  'student-t',
  'observations',
  'constant',
] as const;

export const distributionSchema = z
  .discriminatedUnion(
    'kind',
    [normal, rectangular, triangular, arcsine, trapezoidal, curvilinearTrapezoidal, studentT, observations, constant],
    { error: `kind must be one of ${DISTRIBUTION_KINDS.join(', ')}` },
  )
  .superRefine((d, ctx) => {
    const fail = (path: string, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
    if (d.kind !== 'student-t' && d.dof !== undefined && d.relativeUncertaintyOfU !== undefined) {
      fail('relativeUncertaintyOfU', 'give either dof or relativeUncertaintyOfU, not both');
    }
    switch (d.kind) {
      case 'normal':
        if (d.u !== undefined && (d.U !== undefined || d.k !== undefined || d.p !== undefined)) fail('u', 'give either u, or U with k or p, not both');
        else if (d.k !== undefined && d.p !== undefined) fail('p', 'give U with its coverage factor k or with its coverage probability p, not both');
        else if (d.u === undefined && (d.U === undefined || (d.k === undefined && d.p === undefined))) {
          fail(d.U === undefined ? 'u' : 'k', 'a normal distribution needs u, or U with its coverage factor k or its coverage probability p');
        }
        break;
      case 'rectangular': {
        const byBounds = d.lower !== undefined || d.upper !== undefined;
        const byWidth = d.value !== undefined || d.halfWidth !== undefined;
        if (byBounds && byWidth) fail('lower', 'give value with halfWidth, or lower with upper, not both');
        else if (byBounds) {
          if (d.lower === undefined) fail('lower', 'is required with upper');
          else if (d.upper === undefined) fail('upper', 'is required with lower');
          else if (!(d.lower < d.upper)) fail('upper', 'must be greater than lower');
        } else if (d.value === undefined) fail('value', 'a rectangular distribution needs value with halfWidth, or lower with upper');
        else if (d.halfWidth === undefined) fail('halfWidth', 'is required with value');
        break;
      }
      case 'constant':
        if (d.uncertaintyUnit !== undefined) fail('uncertaintyUnit', 'a constant has no uncertainty to give a unit to: remove uncertaintyUnit');
        break;
      case 'curvilinear-trapezoidal':
        if (d.halfWidthUncertainty > d.halfWidth) fail('halfWidthUncertainty', 'must not exceed halfWidth');
        break;
      case 'observations':
        if ((d.pooledSd === undefined) !== (d.pooledDof === undefined)) {
          fail(d.pooledSd === undefined ? 'pooledSd' : 'pooledDof', 'pooledSd and pooledDof go together');
        } else if (d.uncertaintyUnit !== undefined && d.pooledSd === undefined) {
          fail('uncertaintyUnit', 'observations are in the unit of the value; uncertaintyUnit applies only to pooledSd');
        }
        break;
    }
    if (d.kind === 'rectangular' && d.uncertaintyUnit !== undefined && d.halfWidth === undefined) {
      fail('uncertaintyUnit', 'lower and upper are in the unit of the value; uncertaintyUnit applies only to halfWidth');
    }
    if (d.stated?.as === 'resolution' && !(d.kind === 'rectangular' && d.halfWidth !== undefined)) {
      fail('stated', 'a resolution r is a rectangular distribution with halfWidth a = r/2 (GUM F.2.2.1)');
    }
  });

export const quantitySchema = z.looseObject({
  symbol: symbolName,
  unit: unitText.optional(),
  description: z.string().max(2000).optional(),
  distribution: distributionSchema,
});

export const constantSchema = z.looseObject({
  symbol: symbolName,
  value: finite(),
  unit: unitText.optional(),
  description: z.string().max(2000).optional(),
});

export const correlationSchema = z.looseObject({
  between: z.tuple([symbolName, symbolName], { error: 'must name two input symbols' }),
  r: finite().refine((r) => r >= -1 && r <= 1, { message: 'must lie between -1 and 1' }),
});

export const monteCarloSchema = z.looseObject({
  trials: z
    .union([
      z
        .number({ error: 'must be a whole number of trials or "adaptive"' })
        .int({ message: 'must be a whole number' })
        .min(1, { message: 'must be at least 1' })
        .max(LIMITS.trials, { message: `must not exceed ${LIMITS.trials.toExponential(0)} trials` }),
      z.literal('adaptive'),
    ])
    .optional(),
  seed: z.union([z.string().max(200), z.number()]).optional(),
  significantDigits: z.number().int().min(1).max(4).optional(),
});

/**
 * How the lab reports U (EA-4/02 M:2022 5; ILAC P14): `basis` "t-effective-dof"
 * (k = t_p(ν_eff), the default) or "k-fixed" with `k` (conventionally 2);
 * `whenNotValidated` "report-gum" (the default: the GUM figures, stated as not
 * validated) or "report-monte-carlo" (the Monte Carlo interval replaces them,
 * JCGM 101:2008 8.4).
 */
const reportingSchema = z
  .looseObject({
    basis: z
      .enum(['t-effective-dof', 'k-fixed'], {
        error:
          'must be "t-effective-dof" (k = t_p(ν_eff)) or "k-fixed" (with k); to report the Monte Carlo interval when the GUM result is not validated, set whenNotValidated to "report-monte-carlo"',
      })
      .optional(),
    k: finite()
      .refine((k) => k >= 1, { message: 'must be at least 1 (conventionally 2): a smaller k gives an interval narrower than u' })
      .optional(),
    whenNotValidated: z
      .enum(['report-gum', 'report-monte-carlo'], {
        error: 'must be "report-gum" (state the GUM figures as not validated) or "report-monte-carlo" (report the Monte Carlo interval instead)',
      })
      .optional(),
  })
  .superRefine((r, ctx) => {
    if (r.basis === 'k-fixed' && r.k === undefined) {
      ctx.addIssue({ code: 'custom', path: ['k'], message: 'is required with basis "k-fixed": give the coverage factor, conventionally 2' });
    }
    if (r.basis !== 'k-fixed' && r.k !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['basis'], message: 'must be "k-fixed" when k is given; remove k to use k = t_p(ν_eff)' });
    }
  });

export const budgetDocumentSchema = z.looseObject({
  format: z.literal('dubito-budget/1', { error: 'format must be "dubito-budget/1"' }),
  title: z.string({ error: 'title must be text' }).min(1, { message: 'title must not be empty' }).max(300),
  measurand: z.looseObject({
    symbol: symbolName,
    unit: unitText.optional(),
    description: z.string().max(2000).optional(),
  }),
  model: z
    .string({ error: 'model must be text' })
    .min(1, { message: 'model must not be empty' })
    .max(LIMITS.modelLength, { message: `model must not exceed ${LIMITS.modelLength} characters` }),
  constants: z.array(constantSchema).optional(),
  inputs: z
    .array(quantitySchema, { error: 'inputs must be a list' })
    .min(1, { message: 'a budget needs at least one input quantity' })
    .max(LIMITS.inputs, { message: `a budget allows at most ${LIMITS.inputs} input quantities` }),
  correlations: z.array(correlationSchema).optional(),
  coverageProbability: finite()
    .refine((p) => p > 0 && p < 1, { message: 'must lie strictly between 0 and 1' })
    .optional(),
  monteCarlo: monteCarloSchema.optional(),
  reporting: reportingSchema.optional(),
  // the record of the measurement a report names in its title block (ISO/IEC 17025 7.8.2, 7.8.4)
  procedure: z.string({ error: 'procedure must be text' }).max(300).optional(),
  equipment: z.array(z.string().max(200), { error: 'equipment must be a list of identifiers' }).max(100).optional(),
  environment: z.string({ error: 'environment must be text' }).max(1000).optional(),
});

export type BudgetDocument = z.infer<typeof budgetDocumentSchema>;
export type InputQuantity = z.infer<typeof quantitySchema>;
export type BudgetConstant = z.infer<typeof constantSchema>;
export type Distribution = z.infer<typeof distributionSchema>;
export type DistributionKind = Distribution['kind'];
export type DistributionOf<K extends DistributionKind> = Extract<Distribution, { kind: K }>;
export type Correlation = z.infer<typeof correlationSchema>;
export type ReportingSpec = z.infer<typeof reportingSchema>;
