import type { TemperatureUnitScale } from './units';

/**
 * The temperature rule. The engine reads °C and °F values with the size of
 * the kelvin (of 5/9 K) and never adds an offset, so a value in °C and one in
 * K cannot be told apart as temperatures (which differ by 273.15 K) or as
 * differences (which do not). Temperatures on different scales therefore
 * never meet in a sum, a difference, min or max: that is refused, and the
 * user gives both in one unit. The difference of two values on one scale is
 * a temperature difference, the same in °C and in K, and may meet any scale.
 *
 * A value's scale: `celsius`, `fahrenheit` or `kelvin` for a temperature
 * read on that scale, `difference` for a difference of two of them, and
 * undefined for a quantity that is not a temperature.
 */
export type TemperatureScale = TemperatureUnitScale | 'difference';

const POINT_SCALES: ReadonlySet<TemperatureScale> = new Set(['celsius', 'fahrenheit', 'kelvin']);

/** Whether a value is a temperature read on a scale (not a difference, not another quantity). */
export function isScalePoint(s: TemperatureScale | undefined): s is TemperatureUnitScale {
  return s !== undefined && POINT_SCALES.has(s);
}

/** The unit names users write for each scale, for messages. */
export const SCALE_UNIT: Readonly<Record<TemperatureUnitScale, string>> = Object.freeze(
  Object.assign(Object.create(null) as Record<TemperatureUnitScale, string>, { celsius: '°C', fahrenheit: '°F', kelvin: 'K' }),
);

/**
 * The scale of a ± b (or of min/max of a and b, `subtract` false), both of
 * temperature dimension; null when the two are temperatures on different
 * scales, which the temperature rule refuses.
 */
export function combineScales(a: TemperatureScale | undefined, b: TemperatureScale | undefined, subtract: boolean): TemperatureScale | undefined | null {
  if (a === undefined || a === 'difference') return b;
  if (b === undefined || b === 'difference') return a;
  if (a !== b) return null;
  return subtract ? 'difference' : a;
}

/** Whether a value on scale `value` may be stated in a unit read on scale `unit` (a difference fits every unit). */
export function fitsScale(value: TemperatureScale | undefined, unit: TemperatureUnitScale | undefined): boolean {
  return !isScalePoint(value) || !isScalePoint(unit) || value === unit;
}
