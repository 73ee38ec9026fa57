import { formatCount, groupDigits, groupNumbersIn } from '../../shared/format/digit-groups';
import { formatPercent } from '../../shared/format/percent';
import { DIGIT_GROUP_SEPARATOR } from '../../shared/format/signs';
import { atPlace, dofNumeral, significant, uncertaintyNumeral, valueNumeral, writeNumeral, type Numeral } from '../../shared/format/significant-digits';
import { superscript } from '../../shared/format/superscript';
import { ratioPieces, unitPieces, writeUnit } from '../../shared/format/unit-symbols';

/*
 * Typesetting for the printed report: the shared formatting (shared/format)
 * written in the tiny markup the PDF text layer understands, `^{…}` raises and
 * `_{…}` lowers; digit groups are separated by the narrow no-break space.
 *   units:   um → µm, m^3 → m^{3}, 1/degC → °C^{−1}
 *   numbers: 12345.678901 → 12 345.678 901, 1.2×10^{−6}
 */

export { formatCount, formatPercent, groupDigits, groupNumbersIn };
export const THIN = DIGIT_GROUP_SEPARATOR;

const raise = (exponent: string) => `^{${exponent}}`;
const write = (n: Numeral) => writeNumeral(n, raise);

/** Typesets a unit expression; "", "1" and undefined (dimensionless) give "". */
export function formatUnit(unit: string | undefined | null): string {
  return writeUnit(unitPieces(unit), raise);
}

/** The unit of a sensitivity coefficient, measurand unit per input unit: "mm/°C", "" when they cancel. */
export function ratioUnit(numerator: string | undefined, denominator: string | undefined): string {
  return writeUnit(ratioPieces(numerator, denominator), raise);
}

/** Markup to plain text with Unicode superscripts, for places that cannot raise text. */
export function plainText(markup: string): string {
  return markup
    .replace(/\^\{([^}]*)\}/g, (_m, e: string) => superscript(e))
    .replace(/_\{([^}]*)\}/g, '$1')
    .replace(new RegExp(THIN, 'g'), ' ');
}

/** x with `sig` significant digits; powers of ten outside 10⁻³ … 10⁶. */
export const formatSignificant = (x: number, sig = 3): string => write(significant(x, sig));

/** x written to the decimal place 10^exponent. */
export const formatAt = (x: number, exponent: number): string => write(atPlace(x, exponent));

/** An uncertainty to two significant digits (GUM 7.2.6). */
export const formatUncertainty = (u: number, sig = 2): string => write(uncertaintyNumeral(u, sig));

/** A value written to the place of the last significant digit of its uncertainty. */
export const formatWithUncertainty = (x: number, u: number, sig = 2): string => write(valueNumeral(x, u, sig));

/** Degrees of freedom, "∞" when infinite. */
export const formatDof = (dof: number | null | undefined): string => write(dofNumeral(dof));

/** A moment in UTC, unambiguous on paper: 2026-03-14 09:42 UTC. */
export function formatMoment(ms: number): string {
  return `${new Date(ms).toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

export function formatDate(ms: number): string {
  return new Date(ms).toISOString().slice(0, 10);
}
