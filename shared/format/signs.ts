/*
 * The two characters that make printed numbers unambiguous: the true minus sign
 * and the narrow no-break space that separates digit groups (SI Brochure, 9th ed., 5.4.4).
 */

/** U+2212 MINUS SIGN, used in place of the hyphen for negative numbers and exponents. */
export const MINUS = '\u2212';

/** U+202F NARROW NO-BREAK SPACE, the separator of groups of three digits (SI Brochure 5.4.4). */
export const DIGIT_GROUP_SEPARATOR = '\u202f';

/** Replaces every hyphen-minus in `text` by the true minus sign. */
export function withTrueMinus(text: string): string {
  return text.replace(/-/g, MINUS);
}
