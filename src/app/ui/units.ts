/*
 * Typesetting of unit expressions as budgets write them (mathjs syntax):
 * um → µm, degC → °C, m^3 → m³, kg/m^3 → kg/m³, J s → J·s, ohm → Ω.
 */

const SUPERSCRIPT: Record<string, string> = {
  '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻', '.': '·', '+': '',
};

/** Unit names that take the micro prefix when written with a leading "u". */
const MICRO_BASES = new Set([
  'm', 'g', 's', 'V', 'A', 'L', 'l', 'W', 'mol', 'K', 'Hz', 'F', 'H', 'Pa', 'N', 'J', 'C', 'S', 'T', 'rad', 'ohm', 'bar', 'cd', 'Wb', 'sr',
]);

const WHOLE: Record<string, string> = {
  degC: '°C',
  degF: '°F',
  deg: '°',
  ohm: 'Ω',
  kohm: 'kΩ',
  Mohm: 'MΩ',
  mohm: 'mΩ',
  uohm: 'µΩ',
  percent: '%',
  arcmin: '′',
  arcsec: '″',
};

function symbolFor(name: string): string {
  if (WHOLE[name]) return WHOLE[name];
  if (name.length > 1 && name.startsWith('u') && MICRO_BASES.has(name.slice(1))) {
    const rest = name.slice(1);
    return 'µ' + (WHOLE[rest] ?? rest);
  }
  return name;
}

function superscript(exp: string): string {
  return [...exp].map((c) => SUPERSCRIPT[c] ?? c).join('');
}

/**
 * Formats a unit string for display. "1" and "" (dimensionless) give "".
 * Unknown names pass through unchanged.
 */
export function formatUnit(unit: string | undefined | null): string {
  if (!unit) return '';
  const text = unit.trim();
  if (text === '1' || text === '') return '';
  let out = '';
  let i = 0;
  let pendingSpace = false;
  while (i < text.length) {
    const c = text[i];
    if (/[A-Za-z_µμΩ°%]/.test(c)) {
      let j = i;
      while (j < text.length && /[A-Za-z0-9_µμΩ°%]/.test(text[j])) j++;
      const name = text.slice(i, j);
      if (pendingSpace && out && !/[(/·]$/.test(out)) out += '·';
      pendingSpace = false;
      out += symbolFor(name);
      i = j;
    } else if (c === '^') {
      let j = i + 1;
      if (text[j] === '(') {
        const close = text.indexOf(')', j);
        const inner = text.slice(j + 1, close < 0 ? undefined : close);
        out += superscript(inner.replace(/\s/g, ''));
        i = close < 0 ? text.length : close + 1;
      } else {
        if (text[j] === '-' || text[j] === '+') j++;
        while (j < text.length && /[0-9.]/.test(text[j])) j++;
        out += superscript(text.slice(i + 1, j));
        i = j;
      }
      pendingSpace = false;
    } else if (c === '*') {
      out += '·';
      pendingSpace = false;
      i++;
    } else if (c === ' ') {
      pendingSpace = true;
      i++;
    } else if (c === '/') {
      out += '/';
      pendingSpace = false;
      i++;
    } else {
      if (pendingSpace && /[0-9(]/.test(c) && out && !/[(/·]$/.test(out)) out += '·';
      pendingSpace = false;
      out += c;
      i++;
    }
  }
  return out;
}

/** The unit of a ratio of quantities, e.g. the unit of a sensitivity coefficient: "mm/°C", or "" for 1/1. */
export function ratioUnit(numerator: string | undefined, denominator: string | undefined): string {
  const n = formatUnit(numerator);
  const d = formatUnit(denominator);
  if (!d) return n;
  if (n === d) return '';
  const inverse = /^1\/(.+)$/.exec(d);
  if (inverse) return n ? `${n}·${inverse[1]}` : inverse[1];
  const wrap = (s: string) => (/[/·]/.test(s) ? `(${s})` : s);
  return `${n ? wrap(n) : '1'}/${wrap(d)}`;
}
