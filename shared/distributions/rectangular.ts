import { z } from 'zod';
import { finite, positive, dofOptions, statedOptions } from '../budget/field-schemas';
import type { DistributionOf } from '../budget/schema';
import { KNOWN_WELL_DOF, type DistributionRule, type Draft } from './distribution';

/** The fields of the `rectangular` kind in the budget file, with the messages that say what to write. */
export const rectangularSchema = z.looseObject({
  kind: z.literal('rectangular'),
  value: finite().optional(),
  halfWidth: positive().optional(),
  lower: finite().optional(),
  upper: finite().optional(),
  ...dofOptions,
  ...statedOptions,
});

/**
 * Rectangular input on [a₋, a₊]: x = (a₋ + a₊)/2, u = a/√3 with a = (a₊ − a₋)/2,
 * ν = ∞ (GUM 4.3.7). Draws ξ = a₋ + (a₊ − a₋)·r, r ~ R(0, 1) (JCGM 101:2008 6.4.2),
 * r = (w + ½)·2⁻³² from one 32-bit word (UniformGenerator.fill32: resolution
 * 2⁻³² of the width, far finer than any limits are known; C.3 asks for
 * statistical quality, not 53 bits).
 */
export const rectangularRule: DistributionRule<'rectangular'> = {
  kind: 'rectangular',
  label: 'Rectangular (uniform)',
  shortLabel: 'rectangular',
  treat(spec) {
    const { lower, upper } = rectangularLimits(spec);
    return { estimate: (lower + upper) / 2, standardUncertainty: (upper - lower) / 2 / Math.sqrt(3), dof: Infinity };
  },
  sampler(spec) {
    const { lower, upper } = rectangularLimits(spec);
    const width = upper - lower;
    return {
      fill(rng, out, n) {
        rng.fill32(out, n, lower, width);
      },
    };
  },
  uncertaintyFields: ['halfWidth'],
  /** β₂ = 9/5 (handbook moments of the uniform distribution). */
  kurtosis: () => 9 / 5,
  check(d, fail) {
    const byBounds = d.lower !== undefined || d.upper !== undefined;
    const byWidth = d.value !== undefined || d.halfWidth !== undefined;
    if (byBounds && byWidth) fail('lower', 'give value with halfWidth, or lower with upper, not both');
    else if (byBounds) {
      if (d.lower === undefined) fail('lower', 'is required with upper');
      else if (d.upper === undefined) fail('upper', 'is required with lower');
      else if (!(d.lower < d.upper)) fail('upper', 'must be greater than lower');
    } else if (d.value === undefined) fail('value', 'a rectangular distribution needs value with halfWidth, or lower with upper');
    else if (d.halfWidth === undefined) fail('halfWidth', 'is required with value');
    if (d.uncertaintyUnit !== undefined && d.halfWidth === undefined) {
      fail('uncertaintyUnit', 'lower and upper are in the unit of the value; uncertaintyUnit applies only to halfWidth');
    }
  },
  /** Limits a₋ to a₊ or ± a, divisor √3 (GUM 4.3.7); a resolution r, a = r/2, divisor 2√3 (GUM F.2.2.1). */
  statement(d, w) {
    if (d.halfWidth === undefined) {
      return { text: `from ${w.value(d.lower as number)} to ${w.value(d.upper as number)}`, amount: null, divisor: Math.sqrt(3), divisorText: '√3' };
    }
    if (d.stated?.as === 'resolution') {
      return { text: `r = ${w.uncertainty(2 * d.halfWidth)} (a = r/2)`, amount: 2 * d.halfWidth, divisor: 2 * Math.sqrt(3), divisorText: '2√3' };
    }
    return { text: `± ${w.uncertainty(d.halfWidth)}`, amount: d.halfWidth, divisor: Math.sqrt(3), divisorText: '√3' };
  },
  explainU(d, w) {
    const a = d.halfWidth ?? ((d.upper ?? 0) - (d.lower ?? 0)) / 2;
    const how = d.halfWidth === undefined ? `a = (a₊ − a₋)/2 = ${w.figure(a)}; ` : '';
    return { formula: 'u(xᵢ) = a / √3', substituted: `${how}u(xᵢ) = ${w.figure(a)} / √3 = ${w.u}`, clause: 'GUM 4.3.7' };
  },
  form: {
    ways: [
      {
        id: 'tolerance',
        label: 'a half-width ± a around a value (specification, tolerance)',
        fields: [
          { name: 'value', label: 'Value', unit: 'value', required: true },
          { name: 'halfWidth', label: 'Half-width a', unit: 'uncertainty', required: true },
        ],
        enter: (d) => restated(d, false),
      },
      {
        id: 'limits',
        label: 'lower and upper limits',
        fields: [
          { name: 'lower', label: 'Lower limit a₋', unit: 'value', required: true },
          { name: 'upper', label: 'Upper limit a₊', unit: 'value', required: true },
        ],
        enter(d) {
          const v = d.value ?? 0;
          const a = d.halfWidth ?? 1;
          return { lower: v - a, upper: v + a, value: undefined, halfWidth: undefined, uncertaintyUnit: undefined, ...resolutionForm(d, false) };
        },
      },
      {
        id: 'resolution',
        label: 'the resolution of an indicating instrument',
        fields: [
          { name: 'value', label: 'Correction value', unit: 'value', required: true, hint: 'usually 0' },
          {
            name: 'halfWidth',
            label: 'Resolution r (digit step)',
            unit: 'uncertainty',
            required: true,
            shownTimes: 2,
            hint: (d) => (d.halfWidth ? 'a = r/2 (GUM F.2.2.1)' : 'the smallest step of the display'),
          },
        ],
        enter: (d) => restated(d, true),
        statedAs: 'resolution',
      },
    ],
    wayOf: (d) => (d.lower !== undefined ? 'limits' : d.stated?.as === 'resolution' ? 'resolution' : 'tolerance'),
    dof: KNOWN_WELL_DOF,
  },
  /** a = u·√3 around x (GUM 4.3.7). */
  fromStandardUncertainty: (x, u) => ({ kind: 'rectangular', value: x, halfWidth: u * Math.sqrt(3) }),
};

/** The limits a₋, a₊ from `lower`/`upper` or from `value` ± `halfWidth`. */
function rectangularLimits(spec: DistributionOf<'rectangular'>): { lower: number; upper: number } {
  if (spec.lower !== undefined && spec.upper !== undefined) return { lower: spec.lower, upper: spec.upper };
  if (spec.value !== undefined && spec.halfWidth !== undefined) {
    return { lower: spec.value - spec.halfWidth, upper: spec.value + spec.halfWidth };
  }
  throw new RangeError('a rectangular distribution needs value with halfWidth, or lower with upper');
}

/** A resolution is recorded as such (a = r/2, GUM F.2.2.1); leaving that way forgets the form. */
function resolutionForm(d: Draft<'rectangular'>, resolution: boolean): Record<string, unknown> {
  if (resolution) return { stated: { ...(d.stated ?? {}), as: 'resolution' } };
  return d.stated?.as === 'resolution' ? { stated: undefined } : {};
}

/** The draft as value ± a, from its limits when it had them. */
function restated(d: Draft<'rectangular'>, resolution: boolean): Record<string, unknown> {
  const form = resolutionForm(d, resolution);
  if (d.lower === undefined && d.upper === undefined) return form;
  const lo = d.lower ?? 0;
  const hi = d.upper ?? lo;
  return { value: (lo + hi) / 2, halfWidth: (hi - lo) / 2 || 1, lower: undefined, upper: undefined, ...form };
}
