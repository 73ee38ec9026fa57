import type { Me } from '../../../shared/api/accounts';
import type { BudgetFacts } from '../../../shared/policy/policy';

/** The signed-in user as the review components need them. */
export type Reviewer = Pick<Me, 'id' | 'role' | 'name'>;

/** What the editor tells the review components about the budget on screen. */
export interface ReviewContext {
  budgetId: number;
  version: number;
  currentVersion: number;
  viewingOld: boolean;
  facts: BudgetFacts;
  returned: boolean;
  versionAuthorId: number;
  symbols: string[];
  dirty: boolean;
}

/** A comment thread: a quantity's symbol, or GENERAL for the thread about the whole budget. */
export type ThreadKey = string;
export const GENERAL: ThreadKey = '__budget__';
