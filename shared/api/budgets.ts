/** Payloads of the budget routes (list, one budget, versions, saves, clones), and the columns the lists sort by. */
import type { BudgetResult } from '../budget/result';
import type { BudgetDocument } from '../budget/schema';
import type { BudgetStatus } from '../policy/policy';

/** A stored version without its document and result: `GET /api/budgets/:id/versions` (oldest first). */
export interface VersionMeta {
  number: number;
  authorId: number;
  authorName: string;
  createdAt: number;
  note: string;
  seed: string;
  engineVersion: string;
  documentSha256: string;
  approvedBy: number | null;
  approverName: string | null;
  approvedAt: number | null;
}

/** One version with its document and result: `GET /api/budgets/:id/versions/:n`. */
export interface VersionView extends VersionMeta {
  budgetId: number;
  document: BudgetDocument;
  result: BudgetResult;
}

/** The budget record itself (`PATCH /api/budgets/:id` answers with it). */
export interface BudgetSummary {
  id: number;
  title: string;
  status: BudgetStatus;
  returned: boolean;
  isTemplate: boolean;
  ownerId: number;
  currentVersion: number;
  approvedVersion: number | null;
  source: { budgetId: number; version: number | null } | null;
  createdAt: number;
  updatedAt: number;
}

/** `GET /api/budgets/:id`: the budget with its current version. */
export interface BudgetView extends BudgetSummary {
  ownerName: string;
  version: VersionMeta;
  document: BudgetDocument;
  result: BudgetResult;
}

/**
 * Columns `GET /api/budgets` sorts by (`sort`, with `order` asc or desc); `status` orders
 * draft, returned, in review, approved.
 */
export const BUDGET_SORTS = ['title', 'status', 'owner', 'version', 'updated'] as const;
export type BudgetSort = (typeof BUDGET_SORTS)[number];

/** One row of `GET /api/budgets` and `GET /api/templates`. */
export interface BudgetListItem extends Omit<BudgetSummary, 'source'> {
  ownerName: string;
}

/** `POST /api/budgets` and `POST /api/budgets/import` (201). */
export interface CreatedBudget {
  id: number;
  version: 1;
  result: BudgetResult;
}

/** `PUT /api/budgets/:id`. */
export interface SavedVersion {
  version: number;
  result: BudgetResult;
}

/** `POST /api/budgets/:id/clone` (201). */
export interface ClonedBudget {
  id: number;
  version: 1;
}

/** `GET /api/config`: what the server computes for a save, so the client can say so before a run. */
export interface ComputeLimits {
  /** Monte Carlo trials stored with a version at most; a browser run above it would not be the stored run. */
  trialsCap: number;
  /** Trials of a budget that names none. */
  defaultTrials: number;
  /** Deadline of one save in seconds, queue time included. */
  timeoutSeconds: number;
}
