import type { ReactNode } from 'react';
import type { BudgetStatus } from '../../../shared/policy/policy';

/** What the editor tells the review slots (filled by the app) about the budget on screen. */
export interface BudgetSlotProps {
  budgetId: number;
  /** The version on screen. */
  version: number;
  currentVersion: number;
  viewingOld: boolean;
  facts: { ownerId: number; status: BudgetStatus; isTemplate: boolean };
  returned: boolean;
  /** Author of the current version (who may not approve it). */
  versionAuthorId: number;
  /** Input symbols of the version on screen. */
  symbols: string[];
  dirty: boolean;
}

/** Optional slots the app fills with other features' components. */
export interface EditorSlots {
  /** Rendered in the symbol cell of each budget-table row (e.g. a comment badge). */
  renderRowAdornment?(symbol: string): ReactNode;
  /** Extra buttons in the header (e.g. submit, approve, return). */
  renderHeaderActions?(props: BudgetSlotProps): ReactNode;
  /** A panel in the side column beside the budget (e.g. review threads). */
  renderSidePanel?(props: BudgetSlotProps): ReactNode;
  /** A notice at the top of the budget (e.g. why it was returned). */
  renderTopNotice?(props: BudgetSlotProps): ReactNode;
  /** The evidence of the version on screen, below the side panel. */
  renderEvidence?(props: BudgetSlotProps): ReactNode;
}
