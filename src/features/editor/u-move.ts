import type { BudgetResult } from '../../../shared/budget/result';

/** The expanded uncertainty of one live result, with what it is the uncertainty of. */
export interface UReading {
  U: number;
  symbol: string;
  unit: string;
}

export function uReadingOf(result: BudgetResult): UReading {
  return { U: result.gum.expandedUncertainty, symbol: result.measurand.symbol, unit: result.measurand.unit ?? '' };
}

/**
 * How the last edit moved U, compared like with like: only between results for
 * the same measurand in the same unit. A change of unit or measurand clears the
 * move (U in µm against U in mm is no change of the uncertainty); an edit that
 * leaves U as it was keeps the previous move on screen.
 */
export function nextUMove(before: UReading | null, after: UReading, shown: { from: number; to: number } | null): { from: number; to: number } | null {
  if (before === null) return shown;
  if (before.symbol !== after.symbol || before.unit !== after.unit) return null;
  if (before.U === after.U) return shown;
  return { from: before.U, to: after.U };
}
