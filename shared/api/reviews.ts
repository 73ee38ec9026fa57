/** Payloads of the review routes (comments, replies, transitions). Types only. */
import type { BudgetStatus } from '../policy/policy';

/** A review comment: `GET|POST /api/budgets/:id/comments`, `PATCH …/comments/:cid`. */
export interface Comment {
  id: number;
  budgetId: number;
  versionNumber: number;
  /** The quantity the comment is pinned to, or null for the whole budget. */
  symbol: string | null;
  /** The root comment of the thread this one replies to, or null for a new thread. */
  parentId: number | null;
  authorId: number;
  authorName: string;
  body: string;
  resolved: boolean;
  resolvedBy: number | null;
  resolvedAt: number | null;
  createdAt: number;
}

/** `POST /api/budgets/:id/comments`. */
export interface NewComment {
  version: number;
  /** Omitted on a reply: the reply belongs to its parent's thread. */
  symbol?: string | null;
  parentId?: number | null;
  body: string;
}

export type TransitionTarget = 'in_review' | 'approved' | 'draft';

/** `POST /api/budgets/:id/transitions`. */
export type TransitionInput = { to: 'in_review' } | { to: 'approved'; password: string } | { to: 'draft'; comment: string };

export interface TransitionOutput {
  status: BudgetStatus;
  version: number;
  returned: boolean;
}
