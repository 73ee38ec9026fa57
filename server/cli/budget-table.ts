import type { BudgetResult } from '../../shared/budget/result';
import type { BudgetDocument } from '../../shared/budget/schema';
import { formatAtExponent, roundUncertainty } from '../../shared/gum/rounding';
import { certificateStatement } from '../../shared/gum/statement';

const g = (x: number | null, digits = 4) => (x === null ? '∞' : Number.isFinite(x) ? x.toPrecision(digits) : String(x));

function table(rows: string[][]): string {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
  return rows.map((r) => r.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]) : cell.padStart(widths[c]))).join('  ')).join('\n');
}

/** A readable budget table for a terminal: one row per input, then the result and the Monte Carlo check. */
export function formatBudgetTable(doc: BudgetDocument, result: BudgetResult): string {
  const { gum, monteCarlo, validation } = result;
  const rows = [
    ['symbol', 'estimate', 'unit', 'distribution', 'u(x)', 'c', '|c|·u(x)', 'share', 'ν'],
    ...gum.contributions.map((c) => [
      c.symbol,
      g(c.estimate, 8),
      c.unit ?? '',
      c.kind,
      g(c.standardUncertainty, 3),
      g(c.sensitivity, 4),
      g(c.contribution, 3),
      `${(c.varianceShare * 100).toFixed(1)} %`,
      c.dof === null ? '∞' : g(c.dof, 3),
    ]),
  ];
  const unit = result.measurand.unit ?? '';
  const lines = [
    doc.title,
    '',
    table(rows),
    '',
    `${result.measurand.symbol} = ${g(gum.estimate, 8)} ${unit}   u_c = ${g(gum.standardUncertainty, 3)} ${unit}   ν_eff = ${g(gum.effectiveDof, 3)}   k = ${gum.coverageFactor.toFixed(3)}   U = ${g(gum.expandedUncertainty, 3)} ${unit}`,
  ];
  if (gum.standardUncertaintySecondOrder !== null) lines.push(`u_c with second-order terms = ${g(gum.standardUncertaintySecondOrder, 3)} ${unit}`);
  if (monteCarlo) {
    // intervals to one digit beyond the two significant digits of u (JCGM 101:2008 7.8 suggests reporting with n_dig digits)
    const place = roundUncertainty(monteCarlo.standardUncertainty).exponent - 1;
    const iv = ([lo, hi]: [number, number]) => `[${formatAtExponent(lo, place)}, ${formatAtExponent(hi, place)}]`;
    lines.push(
      `Monte Carlo (${monteCarlo.trials} trials, seed "${monteCarlo.seed}"): y = ${formatAtExponent(monteCarlo.estimate, place)}  u = ${g(monteCarlo.standardUncertainty, 3)}  ` +
        `interval ${iv(monteCarlo.interval)}  shortest ${iv(monteCarlo.shortestInterval)}`,
    );
  }
  if (validation) {
    lines.push(
      `GUM validated against Monte Carlo: ${validation.passed ? 'yes' : 'no'} (d_low = ${g(validation.dLow, 2)}, d_high = ${g(validation.dHigh, 2)}, δ = ${g(validation.tolerance, 2)})`,
    );
  }
  lines.push('', certificateStatement(result.measurand.symbol, unit, gum));
  for (const w of result.warnings) lines.push(`warning: ${w}`);
  return `${lines.join('\n')}\n`;
}
