import type { BudgetDocument } from '../../../shared/budget/schema';

/** Unsaved work is kept in this browser until it is saved, so nothing is lost on a bad input, a reload or a crash. */
export interface StoredDraft {
  document: BudgetDocument;
  /** The version the draft was started from (0 for a new budget). */
  baseVersion: number;
  savedAt: number;
}

const key = (budgetId: number | undefined) => `dubito.draft.${budgetId ?? 'new'}`;

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * Whether stored text read back is a draft the editor can open: a document
 * with its list of inputs, a base version and a time. Anything else (another
 * program's value, a truncated write, an older shape) is ignored rather than
 * opened; the budget's own validation judges the document's fields.
 */
function isStoredDraft(v: unknown): v is StoredDraft {
  return (
    isRecord(v) &&
    isRecord(v.document) &&
    Array.isArray(v.document.inputs) &&
    typeof v.baseVersion === 'number' &&
    Number.isFinite(v.baseVersion) &&
    typeof v.savedAt === 'number' &&
    Number.isFinite(v.savedAt)
  );
}

/** The draft kept for a budget (`undefined`: the new budget), or null when none is kept or what is kept cannot be read. */
export function loadDraft(budgetId: number | undefined): StoredDraft | null {
  try {
    const text = localStorage.getItem(key(budgetId));
    if (!text) return null;
    const d: unknown = JSON.parse(text);
    return isStoredDraft(d) ? d : null;
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
    // storage disabled: nothing was kept
  }
}
