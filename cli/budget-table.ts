import type { BudgetResult } from '../shared/budget/result';
import type { BudgetDocument } from '../shared/budget/schema';
import { relation, type Figure } from '../shared/presentation/figures';
import { presentResult } from '../shared/presentation/result-model';
import { withUnit } from '../shared/presentation/units';

// digit groups are separated by U+202F, one column wide in a terminal like any other character
const width = (s: string) => [...s].length;

function table(rows: string[][], left: number[]): string {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => width(r[c]))));
  const pad = (s: string, w: number, atLeft: boolean) => (atLeft ? s + ' '.repeat(w - width(s)) : ' '.repeat(w - width(s)) + s);
  return rows
    .map((r) =>
      r
        .map((cell, c) => pad(cell, widths[c], left.includes(c)))
        .join('  ')
        .trimEnd(),
    )
    .join('\n');
}

const t = (f: Figure | null) => (f ? f.text : '—');

/** A readable budget for a terminal, from the shared result model: one row per input, the totals, the Monte Carlo comparison, the statement. */
export function formatBudgetTable(doc: BudgetDocument, result: BudgetResult): string {
  const m = presentResult(doc, result);
  const unit = m.measurand.unit;
  const b = m.budget;
  const rows = [
    ['symbol', 'as stated', 'divisor', 'u(x)', 'c', 'unit of c', `|c|·u(x)${unit.text ? ` / ${unit.text}` : ''}`, 'share', 'ν'],
    ...b.rows.map((r) => [
      r.symbol,
      r.stated.text,
      r.divisor.text,
      withUnit(r.standardUncertainty, r.unit).text,
      r.sensitivity.figure.text,
      r.sensitivity.unit.text,
      r.contribution.text,
      r.share.text,
      r.dof.text,
    ]),
  ];
  const rf = m.reported;
  const lines = [
    doc.title,
    '',
    table(rows, [0, 1, 5]),
    '',
    b.dominant.text,
    '',
    `${m.measurand.symbol} = ${withUnit(rf.estimate, unit).text}   u_c = ${withUnit(rf.standardUncertainty, unit).text}   ${relation('ν_eff', rf.effectiveDof).text}   ` +
      `${rf.coverageFactor ? `k = ${rf.coverageFactor.text}   ` : ''}U = ${withUnit(rf.expandedUncertainty, unit).text}   p = ${rf.coverageProbability.text}`,
    `U from ${rf.basisWords}`,
    ...rf.notes,
  ];
  for (const r of b.rows) for (const w of r.warnings) lines.push(`warning (${r.symbol}): ${w.message}`);
  if (rf.secondOrder) lines.push(`u_c with second-order terms = ${withUnit(rf.secondOrder, unit).text}`);
  if (m.monteCarlo) {
    const mc = m.monteCarlo;
    lines.push('', `Monte Carlo, ${mc.heading}, seed "${mc.seed}"${unit.text ? `; values in ${unit.text}` : ''}`);
    lines.push(table([['', 'GUM', 'Monte Carlo'], ...mc.rows.map((r) => [r.label, t(r.gum), r.monteCarlo.text])], [0]));
    if (mc.stability) lines.push(mc.stability);
  }
  if (m.validation) lines.push(`${m.validation.headline} ${m.validation.detail.text}`);
  lines.push('', m.statement.text, '', m.caution);
  for (const w of m.warnings) lines.push(`warning: ${w.message}`);
  return `${lines.join('\n')}\n`;
}
