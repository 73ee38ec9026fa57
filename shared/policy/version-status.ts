import type { BudgetStatus } from './policy';

/** The status one version of a budget has, as every screen and the report show it. */
export type VersionStatus = 'draft' | 'returned' | 'in_review' | 'approved' | 'superseded';

/**
 * A version approved once stays approved; the current version has the budget's
 * status (a draft sent back by the reviewer is "returned"); an older version
 * never approved is a superseded draft. Versions are immutable, so this depends
 * only on the version's approval and on whether it is still the current one.
 */
export function versionStatus(budget: { status: BudgetStatus; returned: boolean; currentVersion: number }, version: { number: number; approvedAt: number | null }): VersionStatus {
  if (version.approvedAt !== null) return 'approved';
  if (version.number !== budget.currentVersion) return 'superseded';
  if (budget.status === 'draft') return budget.returned ? 'returned' : 'draft';
  return budget.status;
}
