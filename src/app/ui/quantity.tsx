import { formatUnit } from './units';
import { fullPrecision } from './numbers';

/** A symbol as metrologists write it: x_s → x with subscript s, in the monospace face. */
export function Sym({ s, className = '' }: { s: string; className?: string }) {
  const m = /^([A-Za-z]+)_(\w+)$/.exec(s);
  const greek: Record<string, string> = {
    alpha: 'α', beta: 'β', gamma: 'γ', delta: 'δ', Delta: 'Δ', theta: 'θ', lambda: 'λ', mu: 'μ', nu: 'ν', rho: 'ρ', sigma: 'σ', tau: 'τ', phi: 'φ', omega: 'ω', eps: 'ε', epsilon: 'ε',
  };
  const base = m ? m[1] : s;
  const shown = greek[base] ?? base;
  return (
    <span className={`num ${className}`} title={s !== shown || m ? s : undefined}>
      {shown}
      {m ? <sub>{m[2]}</sub> : null}
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
