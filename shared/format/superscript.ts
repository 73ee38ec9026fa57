import { MINUS } from './signs';

/*
 * Unicode superscript characters, for text that cannot be raised (screen, plain text).
 */

const SUPERSCRIPT: Record<string, string> = {
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
  '-': '⁻',
  [MINUS]: '⁻',
  '+': '⁺',
};

/**
 * An exponent written in superscript characters: "−1" → "⁻¹", "12" → "¹²". Other characters are kept, so the
 * decimal marker of "0.5" stays a point: a raised dot would read as the multiplication dot of J·s.
 */
export function superscript(exponent: string): string {
  return [...exponent].map((c) => SUPERSCRIPT[c] ?? c).join('');
}
