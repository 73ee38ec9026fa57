import { unitText } from '../../../shared/presentation/units';

/** Formats a unit string for display (µm, kg/m³, °C⁻¹); "1" and "" (dimensionless) give "". */
export function formatUnit(unit: string | undefined | null): string {
  return unitText(unit).text;
}
