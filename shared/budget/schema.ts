import { z } from 'zod';
import { LIMITS } from './limits';
import { DISTRIBUTION_SCHEMAS, ruleFor } from '../distributions/registry';
import { finite, symbolName, unitText } from './field-schemas';

export { type StatedAs } from './field-schemas';

/*
 * Budget file v1 (format "dubito-budget/1"). Objects are loose: fields this
 * version does not know are kept, so an export returns them unchanged.
 */

/** Every distribution kind, in the order a kind is offered (the registry's list). */
export const DISTRIBUTION_KINDS = DISTRIBUTION_SCHEMAS.map((k) => k.shape.kind.value);

export const distributionSchema = z.discriminatedUnion('kind', DISTRIBUTION_SCHEMAS, { error: `kind must be one of ${DISTRIBUTION_KINDS.join(', ')}` }).superRefine((d, ctx) => {
  const fail = (path: string, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
  const rule = ruleFor(d);
  if (!rule.ownDof && d.dof !== undefined && d.relativeUncertaintyOfU !== undefined) {
    fail('relativeUncertaintyOfU', 'give either dof or relativeUncertaintyOfU, not both');
  }
  rule.check?.(d, fail);
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
