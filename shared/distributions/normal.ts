import { z } from 'zod';
import { finite, positive, dofOptions, statedOptions, probability } from '../budget/field-schemas';
import { KNOWN_WELL_DOF, type DistributionRule, type Draft } from './distribution';
import { roundSignificant } from '../format/significant-digits';
import { significantFigure } from '../presentation/figures';
import { fillNormal } from '../random/ziggurat-normal';
import { scaledShiftedT } from './student-t';
import { coverageFactorFor } from '../statistics/student-t';

/** The fields of the `normal` kind in the budget file, with the messages that say what to write. */
export const normalSchema = z.looseObject({
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

/**
 * Gaussian input: x = value, u = u or U/k (GUM 4.3.4; k stated, or from the
 * coverage probability p, `normalCoverageFactor`), ν = ∞ unless `dof` is
 * given (the registry applies `dof` to the GUM ν).
 * Draws (JCGM 101:2008 6.4.7): value + u·z, z ~ N(0, 1).
 * With `dof` = ν (a certificate stating U, k and ν_eff), draws the scaled and
 * shifted t-distribution value + u·t_ν with scale u = U/k (JCGM 101:2008 6.4.9.7;
 * the clause number is recalled, its logic checked: it is the distribution the
 * GUM assumes when it takes k = t_p(ν) for this input, so x ± t_p(ν)·U/k is its
 * exact 100p % interval and the two methods agree for a correct budget). Its standard deviation
 * is u·√(ν/(ν − 2)), defined for ν > 2 only. `relativeUncertaintyOfU` changes
 * only the GUM ν: it states doubt about u, not a t-distributed quantity.
 */
export const normalRule: DistributionRule<'normal'> = {
  kind: 'normal',
  label: 'Normal (Gaussian)',
  shortLabel: 'normal',
  treat(spec) {
    return { estimate: spec.value, standardUncertainty: normalStandardUncertainty(spec), dof: Infinity };
  },
  sampler(spec) {
    const mean = spec.value;
    const u = normalStandardUncertainty(spec);
    const dof = spec.dof;
    if (dof !== undefined && dof !== Infinity) return scaledShiftedT(mean, u, dof);
    return {
      fill(rng, out, n) {
        fillNormal(rng, out, n, mean, u);
      },
    };
  },
  uncertaintyFields: ['u', 'U'],
  /** β₂ = 3, the Gaussian's, as the higher-order terms take it (also with `dof`). */
  kurtosis: () => 3,
  check(d, fail) {
    if (d.u !== undefined && (d.U !== undefined || d.k !== undefined || d.p !== undefined)) fail('u', 'give either u, or U with k or p, not both');
    else if (d.k !== undefined && d.p !== undefined) fail('p', 'give U with its coverage factor k or with its coverage probability p, not both');
    else if (d.u === undefined && (d.U === undefined || (d.k === undefined && d.p === undefined))) {
      fail(d.U === undefined ? 'u' : 'k', 'a normal distribution needs u, or U with its coverage factor k or its coverage probability p');
    }
  },
  /** u as stated (divisor 1), or U with k, or U with p and ν (the divisor k from `normalCoverageFactor`) (GUM 4.3.3, G.3.4). */
  statement(d, w) {
    if (d.u !== undefined) return { text: `u = ${w.uncertainty(d.u)}`, amount: d.u, divisor: 1, divisorText: '1' };
    const k = normalCoverageFactor(d) as number;
    const U = d.U as number;
    const nu = d.dof !== undefined ? `, ν = ${w.number(d.dof)}` : '';
    if (d.p !== undefined) {
      const rule = d.dof !== undefined ? 't' : 'normal';
      return {
        text: `U = ${w.uncertainty(U)}, p = ${w.probability(d.p)}${nu} (k = ${w.fourDigits(k)}, ${rule})`,
        amount: U,
        divisor: k,
        divisorText: w.fourDigits(k),
        coverageProbability: d.p,
        statedDof: d.dof ?? null,
      };
    }
    return { text: `U = ${w.uncertainty(U)}, k = ${w.number(k)}${nu}`, amount: U, divisor: k, divisorText: w.number(k), statedDof: d.dof ?? null };
  },
  explainU(d, w) {
    return d.u !== undefined
      ? { formula: 'u(xᵢ) as stated', substituted: `u(xᵢ) = ${w.u}`, clause: 'GUM 4.3.1' }
      : { formula: 'u(xᵢ) = U / k', substituted: `u(xᵢ) = ${w.figure(d.U ?? NaN)} / ${w.figure(normalCoverageFactor(d) ?? NaN)} = ${w.u}`, clause: 'GUM 4.3.3' };
  },
  form: {
    ways: [
      {
        id: 'u',
        label: 'a standard uncertainty u',
        fields: [
          { name: 'value', label: 'Value', unit: 'value', required: true },
          { name: 'u', label: 'Standard uncertainty u', unit: 'uncertainty', required: true },
        ],
        enter(d) {
          const k = d.k ?? draftCoverageFactor(d);
          return { u: d.u ?? (d.U && k ? roundSignificant(d.U / k, 6) : undefined), U: undefined, k: undefined, p: undefined };
        },
      },
      {
        id: 'Uk',
        label: 'a certificate: expanded uncertainty U with coverage factor k',
        fields: [
          { name: 'value', label: 'Value', unit: 'value', required: true },
          { name: 'U', label: 'Expanded uncertainty U', unit: 'uncertainty', required: true },
          { name: 'k', label: 'Coverage factor k', unit: 'dimensionless', required: true },
        ],
        enter(d) {
          const k = d.k ?? draftCoverageFactor(d);
          return { U: d.U ?? (d.u ? d.u * 2 : undefined), k: k !== undefined ? roundSignificant(k, 4) : 2, p: undefined, u: undefined, ...fromCertificate(d) };
        },
      },
      {
        id: 'Up',
        label: 'a certificate: U at coverage probability p with ν degrees of freedom',
        fields: [
          { name: 'value', label: 'Value', unit: 'value', required: true },
          { name: 'U', label: 'Expanded uncertainty U', unit: 'uncertainty', required: true },
          { name: 'p', label: 'Coverage probability p', unit: 'dimensionless', required: true, hint: 'e.g. 0.95 for 95 %', hintWhileEditing: true },
          {
            name: 'dof',
            label: 'Degrees of freedom ν (as stated; empty = ∞)',
            unit: 'dimensionless',
            required: false,
            hint(d) {
              const k = draftCoverageFactor(d);
              if (k === undefined) return undefined;
              const digits = significantFigure(k, 4).text;
              return d.dof !== undefined ? `k = t_(1+p)/2(ν) = ${digits} (GUM G.3.4, EA-4/02)` : `k = z_(1+p)/2 = ${digits} (normal, GUM G.6.6)`;
            },
          },
        ],
        // ν is optional here: without it k is the normal quantile
        enter: (d) => ({ U: d.U ?? (d.u ? d.u * 2 : undefined), p: d.p ?? 0.95, k: undefined, u: undefined, relativeUncertaintyOfU: undefined, ...fromCertificate(d) }),
        givesDof: true,
      },
    ],
    wayOf: (d) => (d.u === undefined ? (d.p !== undefined ? 'Up' : 'Uk') : 'u'),
    dof: KNOWN_WELL_DOF,
  },
  /** x = value, u as given (GUM 4.3.4). */
  fromStandardUncertainty: (x, u) => ({ kind: 'normal', value: x, u }),
};

/** A certificate is the usual source of U: recorded as such unless the form was already recorded. */
function fromCertificate(d: Draft<'normal'>): Record<string, unknown> {
  return d.stated?.as === undefined ? { stated: { ...(d.stated ?? {}), as: 'certificate' } } : {};
}

/** k of a U stated with p (`normalCoverageFactor`), or undefined while p or ν is not usable in the draft. */
function draftCoverageFactor(d: Draft<'normal'>): number | undefined {
  try {
    const usable = d.p !== undefined && d.p > 0 && d.p < 1 && (d.dof === undefined || d.dof >= 1);
    return usable ? (normalCoverageFactor(d) ?? undefined) : undefined;
  } catch {
    return undefined;
  }
}

type NormalStatement = { u?: number; U?: number; k?: number; p?: number; dof?: number };

/**
 * The coverage factor that divides U: the stated k, or, where U is stated with
 * its coverage probability p instead, k = t_{(1+p)/2}(ν) with the stated
 * ν = `dof` (GUM G.3.4, G.6.4; EA-4/02 M:2022 5.3 and annex E), and without
 * `dof` the normal quantile z_{(1+p)/2} (GUM G.1.3, G.6.6): p = 0.95 gives
 * 1.960, with ν = 9 gives 2.262. Holds when the certificate's U is the
 * symmetric interval of a normal or scaled t-distribution (GUM G.6.6), which a
 * certificate stating p with U and ν_eff declares. `relativeUncertaintyOfU`
 * is the lab's own doubt about u, not the certificate's ν, so it never enters k.
 * Null when u is stated directly.
 */
export function normalCoverageFactor(spec: NormalStatement): number | null {
  if (spec.u !== undefined) return null;
  if (spec.k !== undefined) return spec.k;
  if (spec.p !== undefined) return coverageFactorFor(spec.p, spec.dof ?? Infinity);
  return null;
}

/** u = u, or U/k for an expanded uncertainty with its coverage factor k, stated or from p (GUM 4.3.4). */
function normalStandardUncertainty(spec: NormalStatement): number {
  if (spec.u !== undefined) return spec.u;
  const k = normalCoverageFactor(spec);
  if (spec.U !== undefined && k !== null) return spec.U / k;
  throw new RangeError('a normal distribution needs u, or U with its coverage factor k or its coverage probability p');
}
