/** Payloads of the review routes (comments, replies, transitions, review state, queue). Types only. */
import type { GumResult, ReportedResult, ValidationVerdict } from '../budget/result';
import type { BudgetWarning } from '../budget/warnings';
import type { BudgetStatus } from '../policy/policy';
import type { BudgetDiff } from './diff';

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
  /** Threads resolve as a whole: every comment of a thread carries its state. */
  resolved: boolean;
  resolvedBy: number | null;
  resolvedByName: string | null;
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
export type TransitionInput =
  | { to: 'in_review' }
  /** `reason` is required when threads are open or the Monte Carlo method did not validate the result. */
  | { to: 'approved'; password: string; reason?: string }
  | { to: 'draft'; comment: string };

export interface TransitionOutput {
  status: BudgetStatus;
  version: number;
  returned: boolean;
}

/** An approval or a return of one version, as recorded with the signature. */
export interface ReviewDecision {
  id: number;
  budgetId: number;
  versionNumber: number;
  decision: 'approved' | 'returned';
  actorId: number;
  actorName: string;
  /** The return comment, or why the version was approved over open threads or an unvalidated result. */
  reason: string | null;
  openThreads: number;
  validationVerdict: ValidationVerdict | null;
  at: number;
}

/** Why signing needs a reason, in words, with a code the client may test. */
export interface SigningCaveat {
  code: 'open_threads' | 'not_validated' | 'inconclusive' | 'not_possible' | 'no_monte_carlo';
  message: string;
}

/** One piece of evidence as the approve dialog lists it. */
export interface EvidenceRef {
  id: number;
  fileName: string;
  symbol: string | null;
  sha256: string;
  versionNumber: number;
}

/** `GET /api/budgets/:id/review`: what a signature on the current version covers, and the decisions so far. */
export interface ReviewState {
  budgetId: number;
  status: BudgetStatus;
  returned: boolean;
  currentVersion: number;
  /** SHA-256 of the current version's document: what a signature covers. */
  documentSha256: string;
  /** The reviewer's decision that sent the budget back, while it is a returned draft. */
  lastReturn: ReviewDecision | null;
  /** Every approval and return, oldest first. */
  decisions: ReviewDecision[];
  /** The first comment of every unresolved thread, oldest first. */
  openThreads: Comment[];
  /** The stored result of the current version: the GUM figures and what it reports, for the statement the signature covers. */
  result: { measurand: { symbol: string; unit?: string }; gum: GumResult; reported: ReportedResult | null; statement: string };
  /** Clause 8 verdict of the stored result; null when it has no Monte Carlo run. */
  validation: { verdict: ValidationVerdict; reason: string | null } | null;
  /** The stored result's warnings, each with its code (old stored ones as `recorded`). */
  warnings: BudgetWarning[];
  evidence: EvidenceRef[];
  /**
   * What the caller compares against: the last version they commented on, returned or
   * approved (`seen`), else the last approved version (`approved`); null for neither.
   */
  baseline: { version: number; basis: 'seen' | 'approved' } | null;
  /** The changes from the baseline to the current version; null without a baseline or when it is the current one. */
  changes: BudgetDiff | null;
  /** Approving needs a reason when this is not empty. */
  caveats: SigningCaveat[];
}

/** One row of `GET /api/reviews/queue`: an in-review budget the caller may approve. */
export interface ReviewQueueItem {
  budgetId: number;
  title: string;
  ownerName: string;
  version: number;
  authorName: string;
  /** When it went into review (the budget's last change). */
  since: number;
  openThreads: number;
}
