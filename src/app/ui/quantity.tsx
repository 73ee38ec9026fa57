import { symbolParts } from '../../../shared/format/symbols';
import { formatUnit } from './units';
import { fullPrecision } from './numbers';

/** A symbol as metrologists write it: x_s → x with subscript s, in the monospace face. */
export function Sym({ s, className = '' }: { s: string; className?: string }) {
  const { base, sub } = symbolParts(s);
  return (
    <span className={`num ${className}`} title={s !== base ? s : undefined}>
      {base}
      {sub !== null ? <sub>{sub}</sub> : null}
    </span>
  );
}

/** A unit, typeset. */
export function Unit({ u, className = '' }: { u: string | undefined | null; className?: string }) {
  const t = formatUnit(u);
  if (!t) return null;
  return <span className={`whitespace-nowrap ${className}`}>{t}</span>;
}

/** A displayed number; the unrounded value is a hover or focus away. */
export function Num({ text, value, className = '', focusable }: { text: string; value?: number | null; className?: string; focusable?: boolean }) {
  const full = value === undefined ? undefined : fullPrecision(value);
  return (
    <span className={`num whitespace-nowrap ${className}`} title={full && full !== text ? `unrounded: ${full}` : undefined} tabIndex={focusable ? 0 : undefined}>
      {text}
    </span>
  );
}
