import type { BudgetResult } from '../shared/budget/result';
import type { BudgetDocument } from '../shared/budget/schema';
import { formatAtExponent, roundUncertainty } from '../shared/gum/rounding';
import { certificateStatement } from '../shared/gum/statement';
import { reportedOf } from '../shared/compute/reported-result';

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
    // intervals to one digit beyond the two significant digits of u (JCGM 101:2008 7.8 suggests reporting with n_dig digits);
    // without a variance, to one digit beyond two of the interval's quarter-width
    const spread = monteCarlo.undefinedMoments ? (monteCarlo.interval[1] - monteCarlo.interval[0]) / 4 : monteCarlo.standardUncertainty;
    const place = roundUncertainty(spread).exponent - 1;
    const iv = ([lo, hi]: [number, number]) => `[${formatAtExponent(lo, place)}, ${formatAtExponent(hi, place)}]`;
    const moments = monteCarlo.undefinedMoments
      ? 'y and u undefined (no variance)'
      : `y = ${formatAtExponent(monteCarlo.estimate, place)}  u = ${g(monteCarlo.standardUncertainty, 3)}`;
    lines.push(
      `Monte Carlo (${monteCarlo.trials} trials, seed "${monteCarlo.seed}"): ${moments}  interval ${iv(monteCarlo.interval)}  shortest ${iv(monteCarlo.shortestInterval)}`,
    );
    const st = monteCarlo.stability;
    if (st) {
      lines.push(
        `adaptive (JCGM 101:2008 7.9): h = ${st.sequences} sequences of M = ${st.sequenceLength}; s(y) = ${g(st.spread.estimate, 2)}  s(u) = ${g(st.spread.standardUncertainty, 2)}  ` +
          `s(y_low) = ${g(st.spread.low, 2)}  s(y_high) = ${g(st.spread.high, 2)}  δ = ${g(st.tolerance, 2)}  stabilized: ${st.stabilized ? 'yes (every 2s ≤ δ)' : 'no'}`,
      );
    }
    if (monteCarlo.undefinedMoments) lines.push(`no Monte Carlo u: ${monteCarlo.undefinedMoments.reason}`);
  }
  if (validation) {
    const verdict = validation.verdict ?? (validation.passed ? 'validated' : 'not-validated');
    const word = { validated: 'yes', 'not-validated': 'no', inconclusive: 'inconclusive', 'not-possible': 'not possible' }[verdict];
    const figures =
      validation.tolerance === null
        ? ''
        : ` (d_low = ${g(validation.dLow, 2)}, d_high = ${g(validation.dHigh, 2)}, δ = ${g(validation.tolerance, 2)}` +
          (validation.endpointUncertainty ? `, u(y_low) = ${g(validation.endpointUncertainty[0], 2)}, u(y_high) = ${g(validation.endpointUncertainty[1], 2)}` : '') +
          ')';
    lines.push(`GUM validated against Monte Carlo: ${word}${figures}`);
    if (verdict !== 'validated' && validation.reason) lines.push(`  ${validation.reason}`);
  }
  const reported = reportedOf(result);
  const basis = {
    't-effective-dof': 'GUM figures, k = t_p(ν_eff)',
    'k-fixed': `GUM figures, k fixed at ${reported.coverageFactor}`,
    'monte-carlo': 'the Monte Carlo interval',
  }[reported.basis];
  const flag = reported.replacedGum ? ' (replaces the GUM result)' : reported.unvalidated ? ' (NOT validated by the Monte Carlo method)' : '';
  lines.push(`reported: ${basis}${flag}`);
  lines.push('', certificateStatement({ symbol: result.measurand.symbol, unit: unit || undefined }, reported, gum.effectiveDof));
  for (const w of result.warnings) lines.push(`warning: ${w}`);
  return `${lines.join('\n')}\n`;
}
