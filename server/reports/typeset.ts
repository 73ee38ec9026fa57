import { formatAtExponent, roundUncertainty } from '../../shared/gum/rounding';

/*
 * Typesetting for the printed report. Results are strings in a tiny markup
 * that the PDF text layer understands: `^{…}` raises, `_{…}` lowers, and the
 * narrow no-break space U+202F separates digit groups (SI Brochure 5.4.4).
 *   units:   um → µm, degC → °C, m^3 → m^{3}, kg/m^3 → kg/m^{3}, 1/degC → °C^{−1}
 *   numbers: 12345.678901 → 12 345.678 901, −, 1.2×10^{−6}
 */

export const THIN = '\u202f';
export const MINUS = '\u2212';

/** Unit names that take the micro prefix when written with a leading "u". */
const MICRO_BASES = new Set([
  'm', 'g', 's', 'V', 'A', 'L', 'l', 'W', 'mol', 'K', 'Hz', 'F', 'H', 'Pa', 'N', 'J', 'C', 'S', 'T', 'rad', 'ohm', 'bar', 'cd', 'Wb', 'sr', 'degC',
]);

const NAMES: Record<string, string> = {
  degC: '°C',
  degF: '°F',
  deg: '°',
  ohm: 'Ω',
  kohm: 'kΩ',
  Mohm: 'MΩ',
  mohm: 'mΩ',
  percent: '%',
  arcmin: '′',
  arcsec: '″',
};

function unitName(name: string): string {
  if (NAMES[name]) return NAMES[name];
  if (name.length > 1 && (name[0] === 'u' || name[0] === 'μ') && MICRO_BASES.has(name.slice(1))) return 'µ' + (NAMES[name.slice(1)] ?? name.slice(1));
  if (name[0] === 'μ') return 'µ' + name.slice(1);
  return name;
}

const exponentText = (e: string) => e.replace(/^\+/, '').replace(/-/g, MINUS);

/** Typesets a unit expression as budgets write it; "", "1" and undefined (dimensionless) give "". */
export function formatUnit(unit: string | undefined | null): string {
  if (!unit) return '';
  const text = unit.trim();
  if (text === '' || text === '1') return '';
  // 1/X with a simple X reads better as X^−1
  const inverse = /^1\s*\/\s*([A-Za-zµμΩ°%][A-Za-z0-9_µμ]*)$/.exec(text);
  if (inverse) return `${unitName(inverse[1])}^{${MINUS}1}`;
  let out = '';
  let i = 0;
  let pendingSpace = false;
  const joinable = () => out !== '' && !/[(/·]$/.test(out);
  while (i < text.length) {
    const c = text[i];
    if (/[A-Za-z_µμΩ°%]/.test(c)) {
      let j = i;
      while (j < text.length && /[A-Za-z0-9_µμΩ°%]/.test(text[j])) j++;
      if (pendingSpace && joinable()) out += '·';
      pendingSpace = false;
      out += unitName(text.slice(i, j));
      i = j;
    } else if (c === '^') {
      let j = i + 1;
      let exp: string;
      if (text[j] === '(') {
        const close = text.indexOf(')', j);
        exp = text.slice(j + 1, close < 0 ? undefined : close).replace(/\s/g, '');
        i = close < 0 ? text.length : close + 1;
      } else {
        if (text[j] === '-' || text[j] === '+') j++;
        while (j < text.length && /[0-9.]/.test(text[j])) j++;
        exp = text.slice(i + 1, j);
        i = j;
      }
      out += `^{${exponentText(exp)}}`;
      pendingSpace = false;
    } else if (c === '*') {
      out += '·';
      pendingSpace = false;
      i++;
    } else if (c === ' ') {
      pendingSpace = true;
      i++;
    } else {
      if (pendingSpace && /[0-9(]/.test(c) && joinable()) out += '·';
      pendingSpace = false;
      out += c;
      i++;
    }
  }
  return out;
}

/** The unit of a sensitivity coefficient, measurand unit per input unit: "mm/°C", "" when they cancel. */
export function ratioUnit(numerator: string | undefined, denominator: string | undefined): string {
  const n = formatUnit(numerator);
  const d = formatUnit(denominator);
  if (!d) return n;
  if (n === d) return '';
  const inv = /^(.+)\^\{−1\}$/.exec(d);
  if (inv && !/[/·]/.test(inv[1])) return n ? `${n}·${inv[1]}` : inv[1];
  const wrap = (s: string) => (/[/·]/.test(s) ? `(${s})` : s);
  return `${n ? wrap(n) : '1'}/${wrap(d)}`;
}

/** Markup to plain text with Unicode superscripts, for places that cannot raise text. */
export function plainText(markup: string): string {
  const sup: Record<string, string> = { '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', [MINUS]: '⁻', '-': '⁻' };
  return markup
    .replace(/\^\{([^}]*)\}/g, (_m, e: string) => [...e].map((c) => sup[c] ?? c).join(''))
    .replace(/_\{([^}]*)\}/g, '$1')
    .replace(new RegExp(THIN, 'g'), ' ');
}

function groupInt(s: string): string {
  return s.length <= 4 ? s : s.replace(/\B(?=(\d{3})+(?!\d))/g, THIN);
}
function groupFrac(s: string): string {
  return s.length <= 4 ? s : s.replace(/(\d{3})(?=\d)/g, `$1${THIN}`);
}

/** Groups a plain decimal string in threes on both sides of the point, with a true minus sign. */
export function groupDigits(text: string): string {
  const m = /^([+-]?)(\d*)(?:\.(\d*))?$/.exec(text);
  if (!m) return text.replace(/-/g, MINUS);
  const [, sign, int, frac] = m;
  return `${sign === '-' ? MINUS : ''}${groupInt(int)}${frac !== undefined ? '.' + groupFrac(frac) : ''}`;
}

/** Groups every decimal number inside a sentence. */
export function groupNumbersIn(text: string): string {
  return text.replace(/(?<![\w.])-?\d+(?:\.\d+)?(?![\w.])/g, (n) => groupDigits(n));
}

const power = (p: number) => `×10^{${String(p).replace('-', MINUS)}}`;

/** x with `sig` significant digits; powers of ten outside 10⁻³ … 10⁶. */
export function formatSignificant(x: number, sig = 3): string {
  if (x === 0) return '0';
  if (!Number.isFinite(x)) return Number.isNaN(x) ? '—' : x > 0 ? '∞' : `${MINUS}∞`;
  const mag = Math.floor(Math.log10(Math.abs(x)));
  if (mag < -3 || mag >= 6) {
    const [m, e] = x.toExponential(sig - 1).split('e');
    return `${groupDigits(m)}${power(Number(e))}`;
  }
  return groupDigits(x.toFixed(Math.min(Math.max(0, sig - 1 - mag), 20)));
}

/** x written to the decimal place 10^exponent; powers of ten when that place is very small or x very large. */
export function formatAt(x: number, exponent: number): string {
  if (!Number.isFinite(x)) return formatSignificant(x);
  if (x === 0) return exponent < 0 && exponent >= -6 ? (0).toFixed(-exponent) : '0';
  const mag = Math.floor(Math.log10(Math.abs(x)));
  if ((exponent < -6 && mag < -2) || mag >= 9) {
    const digits = Math.max(0, mag - exponent);
    return `${groupDigits((x / 10 ** mag).toFixed(Math.min(digits, 20)))}${power(mag)}`;
  }
  return groupDigits(formatAtExponent(x, exponent));
}

/** An uncertainty to two significant digits (GUM 7.2.6). */
export function formatUncertainty(u: number, sig = 2): string {
  if (!(u > 0) || !Number.isFinite(u)) return formatSignificant(u);
  return formatAt(u, roundUncertainty(u, sig).exponent);
}

/** A value written to the place of the last significant digit of its uncertainty. */
export function formatWithUncertainty(x: number, u: number, sig = 2): string {
  if (!(u > 0) || !Number.isFinite(u)) return formatSignificant(x, 6);
  return formatAt(x, roundUncertainty(u, sig).exponent);
}

export function formatPercent(share: number): string {
  const pct = share * 100;
  if (pct === 0) return '0 %';
  if (pct < 0.1) return '< 0.1 %';
  return `${pct.toFixed(pct < 10 ? 1 : 0)} %`;
}

export function formatDof(dof: number | null | undefined): string {
  if (dof === null || dof === undefined || !Number.isFinite(dof)) return '∞';
  if (dof >= 1e6) return formatSignificant(dof, 2);
  return groupDigits(dof % 1 === 0 ? dof.toFixed(0) : dof.toFixed(1));
}

export function formatCount(n: number): string {
  return groupDigits(String(Math.round(n)));
}

/** A moment in UTC, unambiguous on paper: 2026-03-14 09:42 UTC. */
export function formatMoment(ms: number): string {
  return `${new Date(ms).toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

export function formatDate(ms: number): string {
  return new Date(ms).toISOString().slice(0, 10);
}
