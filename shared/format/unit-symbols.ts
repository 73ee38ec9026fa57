import { MINUS, withTrueMinus } from './signs';

/*
 * Unit expressions as budgets write them (mathjs syntax), cut into pieces that
 * carry their exponents, with the symbols of the SI Brochure (9th ed., 5.4.3,
 * 5.4.6): um → µm, degC → °C, ohm → Ω, m^3 → m with 3, J s → J·s,
 * 1/degC → °C with −1. Each renderer raises the exponents in its own way.
 */

/** A symbol, operator or digit of a typeset unit and, when one follows it, its exponent (true minus sign). */
export interface UnitPiece {
  text: string;
  exponent?: string;
}

/** Unit names that take the micro prefix when written with a leading "u" (or a Greek mu). */
const MICRO_BASES = new Set(['m', 'g', 's', 'V', 'A', 'L', 'l', 'W', 'mol', 'K', 'Hz', 'F', 'H', 'Pa', 'N', 'J', 'C', 'S', 'T', 'rad', 'ohm', 'bar', 'cd', 'Wb', 'sr', 'degC']);

const SYMBOLS: ReadonlyMap<string, string> = new Map([
  ['degC', '°C'],
  ['degF', '°F'],
  ['deg', '°'],
  ['ohm', 'Ω'],
  ['kohm', 'kΩ'],
  ['Mohm', 'MΩ'],
  ['mohm', 'mΩ'],
  ['percent', '%'],
  ['arcmin', '′'],
  ['arcsec', '″'],
]);

/** The printed symbol of one unit name: "um" → "µm", "degC" → "°C", "kohm" → "kΩ"; unknown names pass through (SI Brochure 5.4.3). */
export function unitSymbol(name: string): string {
  const symbol = SYMBOLS.get(name);
  if (symbol !== undefined) return symbol;
  const rest = name.slice(1);
  if (name.length > 1 && (name[0] === 'u' || name[0] === 'μ') && MICRO_BASES.has(rest)) return 'µ' + (SYMBOLS.get(rest) ?? rest);
  if (name[0] === 'μ') return 'µ' + rest;
  return name;
}

const exponentText = (e: string) => withTrueMinus(e.replace(/^\+/, ''));

/**
 * Cuts a unit expression into pieces; "", "1" and undefined (dimensionless) give none.
 * A space or "*" between factors becomes "·" (SI Brochure 5.4.6); 1/X with a simple X becomes X to the −1.
 */
export function unitPieces(unit: string | undefined | null): UnitPiece[] {
  if (!unit) return [];
  const text = unit.trim();
  if (text === '' || text === '1') return [];
  const inverse = /^1\s*\/\s*([A-Za-zµμΩ°%][A-Za-z0-9_µμ]*)$/.exec(text);
  if (inverse) return [{ text: unitSymbol(inverse[1]), exponent: `${MINUS}1` }];
  const out: UnitPiece[] = [];
  const joinable = () => {
    const last = out[out.length - 1];
    return last !== undefined && (last.exponent !== undefined || !/[(/·]$/.test(last.text));
  };
  const raise = (exponent: string) => {
    const last = out[out.length - 1];
    if (last && last.exponent === undefined) last.exponent = exponent;
    else out.push({ text: '', exponent });
  };
  let i = 0;
  let pendingSpace = false;
  while (i < text.length) {
    const c = text[i];
    if (/[A-Za-z_µμΩ°%]/.test(c)) {
      let j = i;
      while (j < text.length && /[A-Za-z0-9_µμΩ°%]/.test(text[j])) j++;
      if (pendingSpace && joinable()) out.push({ text: '·' });
      out.push({ text: unitSymbol(text.slice(i, j)) });
      i = j;
    } else if (c === '^') {
      let j = i + 1;
      if (text[j] === '(') {
        const close = text.indexOf(')', j);
        raise(exponentText(text.slice(j + 1, close < 0 ? undefined : close).replace(/\s/g, '')));
        i = close < 0 ? text.length : close + 1;
      } else {
        if (text[j] === '-' || text[j] === '+') j++;
        while (j < text.length && /[0-9.]/.test(text[j])) j++;
        raise(exponentText(text.slice(i + 1, j)));
        i = j;
      }
    } else if (c === '*') {
      out.push({ text: '·' });
      i++;
    } else if (c === ' ') {
      pendingSpace = true;
      i++;
      continue;
    } else {
      if (pendingSpace && /[0-9(]/.test(c) && joinable()) out.push({ text: '·' });
      out.push({ text: c });
      i++;
    }
    pendingSpace = false;
  }
  return out;
}

const isCompound = (pieces: UnitPiece[]) => pieces.some((p) => p.exponent === undefined && (p.text === '/' || p.text === '·'));
const wrap = (pieces: UnitPiece[]) => (isCompound(pieces) ? [{ text: '(' }, ...pieces, { text: ')' }] : pieces);
const same = (a: UnitPiece[], b: UnitPiece[]) => JSON.stringify(a) === JSON.stringify(b);

/**
 * The unit of a ratio of quantities, such as a sensitivity coefficient (measurand unit per input unit):
 * "mm" per "degC" → mm/°C, "mm" per "1/degC" → mm·°C, none when they cancel.
 */
export function ratioPieces(numerator: string | undefined, denominator: string | undefined): UnitPiece[] {
  const n = unitPieces(numerator);
  const d = unitPieces(denominator);
  if (d.length === 0) return n;
  if (same(n, d)) return [];
  const dot = n.length ? [...n, { text: '·' }] : [];
  if (d.length === 1 && d[0].exponent === `${MINUS}1`) return [...dot, { text: d[0].text }];
  if (d.length > 2 && d[0].text === '1' && d[0].exponent === undefined && d[1].text === '/') return [...dot, ...d.slice(2)];
  return [...(n.length ? wrap(n) : [{ text: '1' }]), { text: '/' }, ...wrap(d)];
}

/** Writes unit pieces as text, each exponent through `raise`: markup for print, superscripts for the screen. */
export function writeUnit(pieces: UnitPiece[], raise: (exponent: string) => string): string {
  return pieces.map((p) => (p.exponent === undefined ? p.text : p.text + raise(p.exponent))).join('');
}
