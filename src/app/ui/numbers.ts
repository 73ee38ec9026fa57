import { count, estimate, significantFigure, uncertainty, unrounded } from '../../../shared/presentation/figures';

/*
 * Numbers on screen outside the result model (input fields, lists, hints):
 * the same formatters the result model uses (shared/presentation/figures),
 * written with Unicode superscripts. Results themselves are rendered from the
 * result model and never pass through here.
 */

/** A count, grouped: 200000 → "200 000". */
export const formatCount = (n: number): string => count(n).text;

/** x with `sig` significant digits, ×10ⁿ outside 10⁻³ … 10⁶. */
export const formatSignificant = (x: number, sig = 3): string => significantFigure(x, sig).text;

/** An uncertainty with two significant digits (GUM 7.2.6). */
export const formatUncertainty = (u: number): string => uncertainty(u).text;

/** A value rounded to the place of its uncertainty's last significant digit (GUM 7.2.6). */
export const formatWithUncertainty = (x: number, u: number): string => estimate(x, u).text;

/** The full-precision value for tooltips. */
export const fullPrecision = (x: number | null | undefined): string => unrounded(x);

export function formatDateTime(ms: number): string {
  return new Date(ms).toLocaleString('en-GB', { year: 'numeric', month: 'short', day: '2-digit', hour: '2-digit', minute: '2-digit' });
}
