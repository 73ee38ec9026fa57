import { z } from 'zod';

/*
 * The zod pieces the fields of a budget file are made of, shared by the
 * document schema (`schema.ts`) and each distribution kind's own fields
 * (`shared/distributions/<kind>.ts`).
 */

/** A finite number; the message names what it must be. */
export const finite = (what = 'a number') => z.number({ error: `must be ${what}` }).refine(Number.isFinite, { message: `must be ${what}` });
export const positive = () => finite().refine((v) => v > 0, { message: 'must be greater than 0' });
export const symbolName = z.string({ error: 'must be a symbol name' }).regex(/^[A-Za-z_][A-Za-z0-9_]*$/, {
  message: 'must start with a letter or _ and contain only letters, digits and _',
});
export const unitText = z.string({ error: 'must be a unit expression such as "mg" or "kg/m^3"' }).max(100);

/**
 * Degrees of freedom ν ≥ 1. Below 1 the coverage factor t_p(ν) runs away
 * (t₀.₉₇₅(1) = 12.7 and t_p(ν) → ∞ as ν → 0) and no longer describes a
 * reliability of u that a laboratory could state (JCGM 100:2008 G.4.2, G.3).
 */
export const degreesOfFreedom = () =>
  positive().refine((v) => !(v > 0) || v >= 1, {
    message: 'must be at least 1: below 1 degree of freedom the coverage factor t_p(ν) is unbounded (JCGM 100:2008 G.3, G.4.2)',
  });

/** Largest relative uncertainty of u: ½·(Δu/u)⁻² = 1 at Δu/u = 1/√2 (JCGM 100:2008 G.4.2). */
const MAX_RELATIVE_UNCERTAINTY_OF_U = Math.SQRT1_2;

/**
 * Δu/u as a fraction, 0 < Δu/u ≤ 1/√2, so that ν = ½·(Δu/u)⁻² ≥ 1 (JCGM 100:2008 G.4.2):
 * above 1 it is a percentage typed as a number; between 1/√2 and 1 it gives ν < 1.
 */
export const relativeUncertaintyOfU = () =>
  positive()
    .refine((v) => !(v > 1), { message: 'is the relative uncertainty of u as a fraction, at most 1: write 0.10 for 10 %' })
    .refine((v) => !(v > MAX_RELATIVE_UNCERTAINTY_OF_U && v <= 1), {
      message: 'must be at most 0.707: ν = ½·(Δu/u)⁻² falls below 1 degree of freedom, where the coverage factor is unbounded (JCGM 100:2008 G.4.2)',
    });

/** Fields every distribution kind may carry; both act on ν only (GUM G.4.2). */
export const dofOptions = {
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
export const statedOptions = {
  uncertaintyUnit: unitText.optional(),
  stated: statedSchema.optional(),
};

/** A coverage probability strictly between 0 and 1. */
export const probability = () => finite().refine((p) => p > 0 && p < 1, { message: 'must lie strictly between 0 and 1 (write 0.95 for 95 %)' });
