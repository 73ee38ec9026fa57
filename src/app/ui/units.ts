import { superscript } from '../../../shared/format/superscript';
import { ratioPieces, unitPieces, writeUnit } from '../../../shared/format/unit-symbols';

/*
 * Units on screen: the shared unit typesetting (shared/format/unit-symbols)
 * with exponents as Unicode superscripts: um → µm, kg/m^3 → kg/m³, 1/degC → °C⁻¹.
 */

/** Formats a unit string for display; "1" and "" (dimensionless) give "". */
export function formatUnit(unit: string | undefined | null): string {
  return writeUnit(unitPieces(unit), superscript);
}

/** The unit of a ratio of quantities, e.g. of a sensitivity coefficient: "mm/°C", or "" when they cancel. */
export function ratioUnit(numerator: string | undefined, denominator: string | undefined): string {
  return writeUnit(ratioPieces(numerator, denominator), superscript);
}
