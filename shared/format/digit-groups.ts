import { DIGIT_GROUP_SEPARATOR, MINUS, withTrueMinus } from './signs';

/*
 * Digits in groups of three on both sides of the decimal marker, separated by a
 * narrow no-break space; four-digit runs stay whole (SI Brochure, 9th ed., 5.4.4).
 */

function groupInteger(s: string): string {
  return s.length <= 4 ? s : s.replace(/\B(?=(\d{3})+(?!\d))/g, DIGIT_GROUP_SEPARATOR);
}

function groupFraction(s: string): string {
  return s.length <= 4 ? s : s.replace(/(\d{3})(?=\d)/g, `$1${DIGIT_GROUP_SEPARATOR}`);
}

/** Groups a plain decimal string with a true minus sign: "-12345.6789" → "−12 345.678 9" (SI Brochure 5.4.4). */
export function groupDigits(text: string): string {
  const m = /^([+-]?)(\d*)(?:\.(\d*))?$/.exec(text);
  if (!m) return withTrueMinus(text);
  const [, sign, int, frac] = m;
  return `${sign === '-' ? MINUS : ''}${groupInteger(int)}${frac !== undefined ? '.' + groupFraction(frac) : ''}`;
}

/** Groups every decimal number that stands alone inside a sentence (SI Brochure 5.4.4). */
export function groupNumbersIn(text: string): string {
  return text.replace(/(?<![\w.])-?\d+(?:\.\d+)?(?![\w.])/g, (n) => groupDigits(n));
}
