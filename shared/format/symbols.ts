/*
 * Symbols of quantities as metrologists write them: x_s is x with the
 * subscript s, and a Greek letter's name is the letter (alpha_s → α with s).
 */

const GREEK: Record<string, string> = {
  alpha: 'α',
  beta: 'β',
  gamma: 'γ',
  delta: 'δ',
  Delta: 'Δ',
  theta: 'θ',
  lambda: 'λ',
  mu: 'μ',
  nu: 'ν',
  rho: 'ρ',
  sigma: 'σ',
  tau: 'τ',
  phi: 'φ',
  omega: 'ω',
  eps: 'ε',
  epsilon: 'ε',
};

/** The letter and the subscript of a symbol: "alpha_s" → { base: "α", sub: "s" }; "T" → { base: "T", sub: null }. */
export function symbolParts(symbol: string): { base: string; sub: string | null } {
  const m = /^([A-Za-z]+)_(\w+)$/.exec(symbol);
  const base = m ? m[1] : symbol;
  return { base: GREEK[base] ?? base, sub: m ? m[2] : null };
}

/** A symbol in the PDF's markup, the subscript lowered: "dt_ref_cal" → "dt_{ref_cal}", "alpha_s" → "α_{s}". */
export function symbolMarkup(symbol: string): string {
  const p = symbolParts(symbol);
  return p.sub === null ? p.base : `${p.base}_{${p.sub}}`;
}
