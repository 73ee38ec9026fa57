import type { BudgetDocument } from '../../../shared/budget/schema';

/** Unsaved work is kept in this browser until it is saved, so nothing is lost on a bad input, a reload or a crash. */
export interface StoredDraft {
  document: BudgetDocument;
  /** The version the draft was started from (0 for a new budget). */
  baseVersion: number;
  savedAt: number;
}

const key = (budgetId: number | undefined) => `dubito.draft.${budgetId ?? 'new'}`;

export function loadDraft(budgetId: number | undefined): StoredDraft | null {
  try {
    const text = localStorage.getItem(key(budgetId));
    if (!text) return null;
    const d = JSON.parse(text) as StoredDraft;
    return d && typeof d === 'object' && d.document ? d : null;
  } catch {
    return null;
  }
}

export function storeDraft(budgetId: number | undefined, draft: StoredDraft): void {
  try {
    localStorage.setItem(key(budgetId), JSON.stringify(draft));
  } catch {
    // storage full or disabled: the editor keeps working, only the safety net is missing
  }
}

export function clearDraft(budgetId: number | undefined): void {
  try {
    localStorage.removeItem(key(budgetId));
  } catch {
    // ignore
  }
}
