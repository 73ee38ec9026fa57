import type { BudgetDiff, Delta } from '../api/diff';
import { MINUS } from '../format/signs';
import { atDecimalPlace, coverageFactor, dof, estimate, placeOf, pointsChange, relativeChange, share, significantFigure, uncertainty, type Figure } from './figures';

/*
 * The result figures of two versions side by side, written by the same
 * formatters as each version's own result, and the change between them.
 */

/** A figure of both versions and the change between them. */
export interface ComparedFigure {
  label: string;
  /** The figure's symbol, as a budget writes one (u_c, nu_eff), shown after the label. */
  symbol?: string;
  /** Whether the figure carries the measurand's unit. */
  inUnit: boolean;
  delta: Delta;
  from: Figure | null;
  to: Figure | null;
  /** The change, signed, to two significant digits (percentage points for shares). */
  change: Figure | null;
  /** The change relative to the older value, signed percent. */
  relative: Figure | null;
}

function change(d: Delta, points = false): Pick<ComparedFigure, 'change' | 'relative'> {
  if (d.delta === null || d.delta === 0) return { change: null, relative: null };
  if (points) return { change: pointsChange(d.delta), relative: null };
  const magnitude = significantFigure(Math.abs(d.delta), 2);
  const c = { text: `${d.delta > 0 ? '+' : MINUS}${magnitude.text}`, markup: `${d.delta > 0 ? '+' : MINUS}${magnitude.markup}`, value: d.delta };
  const rel = d.from ? d.delta / Math.abs(d.from) : null;
  return { change: c, relative: rel !== null && Number.isFinite(rel) ? relativeChange(rel) : null };
}

const both = (d: Delta, write: (x: number, side: 'from' | 'to') => Figure) => ({
  from: d.from === null ? null : write(d.from, 'from'),
  to: d.to === null ? null : write(d.to, 'to'),
});

/** The result rows of a version comparison: each version's figure as its own result shows it (GUM 7.2.6), and the change. */
export function compareResults(r: BudgetDiff['result']): ComparedFigure[] {
  const U = r.expandedUncertainty;
  const rows: ComparedFigure[] = [
    { label: 'Estimate', symbol: 'y', inUnit: true, delta: r.estimate, ...both(r.estimate, (x, s) => estimate(x, U[s] ?? 0)), ...change(r.estimate) },
    { label: 'Standard uncertainty', symbol: 'u_c', inUnit: true, delta: r.standardUncertainty, ...both(r.standardUncertainty, uncertainty), ...change(r.standardUncertainty) },
    { label: 'Expanded uncertainty', symbol: 'U', inUnit: true, delta: U, ...both(U, uncertainty), ...change(U) },
    { label: 'Coverage factor', symbol: 'k', inUnit: false, delta: r.coverageFactor, ...both(r.coverageFactor, coverageFactor), ...change(r.coverageFactor) },
    { label: 'Effective degrees of freedom', symbol: 'nu_eff', inUnit: false, delta: r.effectiveDof, ...both(r.effectiveDof, dof), ...change(r.effectiveDof) },
  ];
  const mc = r.monteCarlo;
  if (mc) {
    // the Monte Carlo figures of each version at the place of its own u (JCGM 101:2008 7.8)
    const at = (x: number, s: 'from' | 'to') => atDecimalPlace(x, placeOf(mc.standardUncertainty[s] ?? 0) ?? 0);
    rows.push(
      { label: 'Monte Carlo estimate', inUnit: true, delta: mc.estimate, ...both(mc.estimate, at), ...change(mc.estimate) },
      { label: 'Monte Carlo u', inUnit: true, delta: mc.standardUncertainty, ...both(mc.standardUncertainty, uncertainty), ...change(mc.standardUncertainty) },
      { label: 'Monte Carlo interval, low end', inUnit: true, delta: mc.intervalLow, ...both(mc.intervalLow, at), ...change(mc.intervalLow) },
      { label: 'Monte Carlo interval, high end', inUnit: true, delta: mc.intervalHigh, ...both(mc.intervalHigh, at), ...change(mc.intervalHigh) },
    );
  }
  return rows;
}

/** The contributions of two versions: u(x_i) and |c_i|·u(x_i) to two significant digits, shares, and the change of the contribution. */
export function compareContributions(r: BudgetDiff['result']): {
  symbol: string;
  standardUncertainty: ComparedFigure;
  contribution: ComparedFigure;
  share: ComparedFigure;
}[] {
  return r.contributions.map((c) => ({
    symbol: c.symbol,
    standardUncertainty: { label: 'u(xᵢ)', inUnit: false, delta: c.standardUncertainty, ...both(c.standardUncertainty, uncertainty), ...change(c.standardUncertainty) },
    contribution: { label: '|cᵢ|·u(xᵢ)', inUnit: true, delta: c.contribution, ...both(c.contribution, uncertainty), ...change(c.contribution) },
    share: { label: 'share', inUnit: false, delta: c.varianceShare, ...both(c.varianceShare, share), ...change(c.varianceShare, true) },
  }));
}
