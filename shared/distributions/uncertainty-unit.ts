import { BudgetError } from '../budget/budget-error';
import type { Distribution } from '../budget/schema';
// the registry calls inValueUnit and inValueUnit asks the registry for a kind's fields, both only when called
import { ruleOf } from './registry';
import { describeDimension, isDimensionless, parseUnit, sameDimension } from '../model/units';

/** How an uncertainty stated in its own unit becomes one in the value's unit. */
export interface UncertaintyScale {
  /** Multiplies the stated number: the ratio of the units' SI factors, or for a relative unit its number (5 ppm → 5×10⁻⁶). */
  factor: number;
  /** True when the stated number is relative to |value| (%, ppm, ppb, 1 for a value with a dimension). */
  relative: boolean;
}

/**
 * The scale from an uncertainty unit to the value's unit (ISO 80000-1 quantity
 * calculus: a quantity is number × unit, so n·[U] = n·(f_U/f_x)·[x]).
 * - Same dimension: an absolute amount, factor f_U/f_x (12 mK for a value in
 *   °C: 0.012; temperatures convert as differences, without offset).
 * - Dimensionless uncertainty unit (`%`, `ppm`, `ppb`, `1`) for a value with a
 *   dimension: relative to |value|, factor f_U (5 ppm of 100 Ω is 5×10⁻⁴ Ω).
 * - Both dimensionless and the value's unit written (`%`, `ppm`, `mol/mol`): an
 *   absolute amount in that ratio (2 % of a value in % is 2 %).
 * Refused, with the reason: other dimensions (kg for a value in m), and a
 * ratio unit for a value without unit, where "5 ppm" could be 5×10⁻⁶ or
 * 5×10⁻⁶·|value| and the product cannot tell which.
 * Throws an Error whose message the caller prefixes with the field.
 */
export function uncertaintyScale(uncertaintyUnit: string, valueUnit: string | undefined): UncertaintyScale {
  const su = parseUnit(uncertaintyUnit);
  const vu = parseUnit(valueUnit);
  const valueHasUnit = (valueUnit ?? '').trim() !== '' && (valueUnit ?? '').trim() !== '1';
  if (sameDimension(su.dimension, vu.dimension)) {
    if (isDimensionless(su.dimension) && !valueHasUnit && su.factor !== 1) {
      throw new Error(
        `"${uncertaintyUnit.trim()}" for a value without unit could mean an absolute amount or one relative to the value: ` + 'give the uncertainty as a plain number, or give the value its unit',
      );
    }
    return { factor: su.factor / vu.factor, relative: false };
  }
  if (isDimensionless(su.dimension)) return { factor: su.factor, relative: true };
  throw new Error(
    `"${uncertaintyUnit.trim()}" (${describeDimension(su.dimension)}) cannot state an uncertainty of a value in ` +
      `${valueHasUnit ? `"${(valueUnit ?? '').trim()}" (${describeDimension(vu.dimension)})` : 'no unit (a number)'}: ` +
      'give it in a unit of the same kind as the value, or as %, ppm or ppb of the value',
  );
}

/** The estimate a relative uncertainty refers to: the value, the midpoint of the limits, or the mean of the observations. */
function referenceValue(spec: Distribution): number {
  if (spec.kind === 'observations') return spec.values.reduce((s, v) => s + v, 0) / spec.values.length;
  if (spec.kind === 'rectangular' && spec.value === undefined) return ((spec.lower ?? 0) + (spec.upper ?? 0)) / 2;
  return (spec as { value: number }).value;
}

/**
 * The distribution with its uncertainty fields in the value's unit and no
 * `uncertaintyUnit`: each field n becomes n·factor, or n·factor·|x| when
 * relative (`uncertaintyScale`), before the GUM treatment and the sampler see
 * it. A spec without `uncertaintyUnit` is returned as it is. Refuses, naming
 * `<at>.uncertaintyUnit`, a unit that cannot be converted and a relative
 * uncertainty of a value 0 (it would be 0, and u must be > 0).
 */
export function inValueUnit(spec: Distribution, valueUnit: string | undefined, at = 'distribution'): Distribution {
  if (spec.uncertaintyUnit === undefined) return spec;
  const field = `${at}.uncertaintyUnit`;
  let scale: UncertaintyScale;
  try {
    scale = uncertaintyScale(spec.uncertaintyUnit, valueUnit);
  } catch (e) {
    throw new BudgetError('unit', `${field}: ${(e as Error).message}`, field);
  }
  let factor = scale.factor;
  if (scale.relative) {
    const x = Math.abs(referenceValue(spec));
    if (!(x > 0)) {
      throw new BudgetError('unit', `${field}: an uncertainty relative to the value is 0 for the value 0; give it in the unit of the value`, field);
    }
    factor *= x;
  }
  const out: Record<string, unknown> = { ...spec };
  delete out.uncertaintyUnit;
  for (const name of ruleOf(spec.kind).uncertaintyFields as readonly string[]) {
    const n = out[name];
    if (typeof n === 'number') out[name] = n * factor;
  }
  return out as Distribution;
}
