import type { BudgetResult } from '../../shared/budget/result';
import type { BudgetDocument } from '../../shared/budget/schema';

/** What the editor hands to the Monte Carlo panel; the app plugs one into the other, so the contract lives here. */
export interface MonteCarloSlotProps {
  document: BudgetDocument | null;
  measurand: { symbol: string; unit?: string };
  stored: { result: BudgetResult; label: string } | null;
  settings: BudgetDocument['monteCarlo'];
  onSettings(next: BudgetDocument['monteCarlo']): void;
  readOnly: boolean;
}
