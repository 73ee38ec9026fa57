import { groupDigits } from '../format/digit-groups';
import { MINUS } from '../format/signs';
import { atPlace, significant, writeNumeral, type Numeral } from '../format/significant-digits';
import { superscript } from '../format/superscript';
import { roundUncertainty } from '../gum/rounding';

/*
 * The formatters of the figures a reader sees: one per kind of figure. Every
 * screen, the PDF and the command line print what these return and round
 * nothing themselves, so a figure reads the same wherever it is shown.
 *
 * A figure carries two spellings of the same digits: `text` with Unicode
 * superscripts (screen, terminal) and `markup` with the `^{…}` raise of the
 * PDF text layer. They differ only where a power of ten is raised.
 */

/** A figure as shown, and the unrounded value behind it (null when infinite or not a number). */
export interface Figure {
  text: string;
  markup: string;
  value: number | null;
}

const raise = (exponent: string) => `^{${exponent}}`;

/** A figure from a numeral: both spellings. */
function fromNumeral(n: Numeral, value: number | null): Figure {
  return { text: writeNumeral(n, superscript), markup: writeNumeral(n, raise), value };
}

/** A figure whose digits need no raised power. */
export function plainFigure(text: string, value: number | null = null): Figure {
  return { text, markup: text, value };
}

const trimZeros = (s: string) => (s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s);

/**
 * A coverage probability as a percentage with up to two decimals and no trailing zeros:
 * 0.9973 → "99.73 %", 0.9545 → "95.45 %", 0.95 → "95 %" (space before % per SI Brochure 5.4.7).
 * Two decimals are what the conventional choices need (95.45 %, 99.73 % for k = 2, 3);
 * the share formatter's rounding would turn 99.73 % into "100 %".
 */
export function probability(p: number): Figure {
  return plainFigure(`${trimZeros((p * 100).toFixed(2))} %`, p);
}

/**
 * A share of the variance as a percentage: "0 %", "< 0.1 %", one decimal below 10 %,
 * whole numbers from 10 % (SI Brochure 5.4.7). Shares only rank terms, so two digits suffice.
 */
export function share(s: number): Figure {
  const pct = s * 100;
  if (pct === 0) return plainFigure('0 %', s);
  if (pct < 0.1) return plainFigure('< 0.1 %', s);
  return plainFigure(`${pct.toFixed(pct < 10 ? 1 : 0)} %`, s);
}

/** An uncertainty (u, u_c, U, a contribution) to two significant digits (JCGM 100:2008 7.2.6); "0" for none. */
export function uncertainty(u: number): Figure {
  if (u === 0) return plainFigure('0', 0);
  if (!(u > 0) || !Number.isFinite(u)) return fromNumeral(significant(u), Number.isFinite(u) ? u : null);
  return fromNumeral(atPlace(u, roundUncertainty(u).exponent), u);
}

/** The decimal place of the last digit of an uncertainty rounded to two significant digits (JCGM 100:2008 7.2.6). */
export function placeOf(u: number): number | null {
  return u > 0 && Number.isFinite(u) ? roundUncertainty(u).exponent : null;
}

/**
 * An estimate written to the place of the last digit of its uncertainty U rounded to two
 * significant digits (JCGM 100:2008 7.2.6): y = 36.24 mK with U = 19 mK → "36". With no
 * uncertainty (an exact value) six significant digits.
 */
export function estimate(y: number, U: number): Figure {
  const place = placeOf(U);
  return fromNumeral(place === null ? significant(y, 6) : atPlace(y, place), y);
}

/** A value written at a given decimal place (the figures of one comparison share one place). */
export function atDecimalPlace(x: number, place: number): Figure {
  return fromNumeral(atPlace(x, place), x);
}

/** A coverage interval: both ends at one decimal place, "[a, b]" (JCGM 101:2008 7.8). */
export function interval([lo, hi]: readonly [number, number], place: number): Figure {
  const a = atDecimalPlace(lo, place);
  const b = atDecimalPlace(hi, place);
  return { text: `[${a.text}, ${b.text}]`, markup: `[${a.markup}, ${b.markup}]`, value: null };
}

/**
 * Degrees of freedom (ν_i, ν_eff) as the coverage factor uses them: k is t_p at the real ν_eff
 * (JCGM 100:2008 G.4.1 note), so ν_eff shows with one decimal below 100 (16.7 → "16.7"), a whole
 * number from 100 and for whole ν (n − 1 = 9 → "9"), "> 1000" above 1000, where t_p and the normal
 * quantile differ by about 0.1 % (t_0.975(1000) = 1.962 against 1.960) so further digits say
 * nothing (2004.0 → "> 1000"), and "∞" when infinite.
 */
export function dof(nu: number | null | undefined): Figure {
  if (nu === null || nu === undefined || !Number.isFinite(nu)) return plainFigure('∞', null);
  if (nu > 1000) return plainFigure('> 1000', nu);
  const shown = Number.isInteger(nu) || nu >= 100 ? String(Math.round(nu)) : nu.toFixed(1);
  return plainFigure(groupDigits(shown), nu);
}

/** A coverage factor with two decimals, as tables of t_p give it: 1.9612 → "1.96", 2 → "2.00" (JCGM 100:2008 G.3.4, Table G.2). */
export function coverageFactor(k: number): Figure {
  return plainFigure(k.toFixed(2), k);
}

/**
 * A sensitivity coefficient: three significant digits with trailing zeros dropped (c_i is a
 * derivative, not a measured value, so zeros would claim nothing): −1 → "−1", 11.5 → "11.5".
 */
export function coefficient(c: number): Figure {
  const n = significant(c, 3);
  return fromNumeral({ digits: trimZeros(n.digits).replace(/[\u202f]$/, ''), power: n.power }, c);
}

/**
 * An intermediate quantity of the model at the estimates, shown beside the model to follow it:
 * six significant digits with trailing zeros dropped, as it carries no uncertainty of its own here.
 * 20.008 → "20.008", 1.7295612e-5 → "1.729 56×10⁻⁵".
 */
export function intermediate(x: number): Figure {
  const n = significant(x, 6);
  return fromNumeral({ digits: trimZeros(n.digits).replace(/[\u202f]$/, ''), power: n.power }, Number.isFinite(x) ? x : null);
}

/** A number with `sig` significant digits (tolerances, bin widths, axis values). */
export function significantFigure(x: number, sig = 2): Figure {
  return fromNumeral(significant(x, sig), Number.isFinite(x) ? x : null);
}

/** A number as it was entered in the budget file, digits grouped: 0.0005 stays "0.0005"; a power of ten where JavaScript would write one (below 10⁻⁶, from 10²¹). */
export function given(x: number): Figure {
  if (!/e/i.test(String(x))) return plainFigure(groupDigits(String(x)), x);
  return fromNumeral(significant(x, Math.min(15, x.toExponential().split('e')[0].replace(/[-.]/g, '').length)), x);
}

/** A named figure as an equation: "ν_eff = 29", but "ν_eff > 1000" where the figure is a bound. */
export function relation(name: string, f: Figure): Figure {
  const op = /^[<>≤≥]/.test(f.text) ? ' ' : ' = ';
  return { text: `${name}${op}${f.text}`, markup: `${name}${op}${f.markup}`, value: f.value };
}

/** A count, whole and grouped: 200000 → "200 000" (SI Brochure 5.4.4). */
export function count(n: number): Figure {
  return plainFigure(groupDigits(String(Math.round(n))), n);
}

/** A relative change in percent with its sign and one decimal (two below 1 %): 0.123 → "+12.3 %". */
export function relativeChange(r: number): Figure {
  const pct = r * 100;
  const digits = Math.abs(pct) < 1 ? 2 : 1;
  return plainFigure(`${pct > 0 ? '+' : pct < 0 ? MINUS : ''}${groupDigits(Math.abs(pct).toFixed(digits))} %`, r);
}

/** A change of a share, in percentage points with its sign and one decimal. */
export function pointsChange(d: number): Figure {
  return plainFigure(`${d > 0 ? '+' : d < 0 ? MINUS : ''}${groupDigits(Math.abs(d * 100).toFixed(1))} points`, d);
}

/** A duration for progress and run times: "850 ms", "4.2 s" below ten seconds, whole seconds above. */
export function duration(ms: number): Figure {
  if (ms < 1000) return plainFigure(`${Math.round(ms)} ms`, ms);
  return plainFigure(`${(ms / 1000).toFixed(ms < 10_000 ? 1 : 0)} s`, ms);
}

/** A file size in SI multiples of the byte (kB = 1000 B, SI Brochure 3): 532 → "532 B", 48_213 → "48.2 kB", 2_400_000 → "2.4 MB". */
export function fileSize(bytes: number): Figure {
  if (bytes < 1000) return plainFigure(`${bytes} B`, bytes);
  return plainFigure(bytes < 1e6 ? `${(bytes / 1e3).toFixed(1)} kB` : `${(bytes / 1e6).toFixed(1)} MB`, bytes);
}

/** The unrounded value for a tooltip, true minus sign; "∞" for none. */
export function unrounded(x: number | null | undefined): string {
  if (x === null || x === undefined) return '∞';
  if (!Number.isFinite(x)) return significant(x).digits;
  return String(x).replace('-', MINUS);
}
