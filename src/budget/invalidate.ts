import type { QueryClient } from '@tanstack/react-query';
import type { Me } from '../../shared/api/accounts';
import { queryKeys } from './query-keys';

/**
 * What a change on the server makes stale, named by what happened. Every mutation of every
 * feature refreshes the cache through one of these, so a new screen that reads a resource is
 * refreshed by the events that change it without its author finding each mutation. Every change
 * writes an audit event on the server, so each of them refreshes the audit trail.
 */

function refresh(qc: QueryClient, ...keys: (readonly unknown[])[]): Promise<void> {
  return Promise.all(keys.map((queryKey) => qc.invalidateQueries({ queryKey }))).then(() => undefined);
}

/**
 * A version was stored: a save, a creation, an import, a clone, or evidence added to an
 * approved version. The budget and everything under it (versions, review state, comments,
 * evidence), every list (the title, status and time change), the queue and the audit trail.
 */
export function afterVersionStored(qc: QueryClient, budgetId: number): Promise<void> {
  return refresh(qc, queryKeys.budgets.detail(budgetId), queryKeys.budgets.lists(), queryKeys.budgets.reviewQueue(), queryKeys.audit.all());
}

/** A file was attached; when the version it went to was approved, a new version was stored too. */
export function afterEvidenceAdded(qc: QueryClient, budgetId: number, newVersion: boolean): Promise<void> {
  if (newVersion) return afterVersionStored(qc, budgetId);
  return refresh(qc, queryKeys.budgets.attachments(budgetId), queryKeys.budgets.review(budgetId), queryKeys.audit.all());
}

/** A comment was written, resolved or reopened: the threads, the open-thread count a signature sees, the queue's count. */
export function afterCommentChanged(qc: QueryClient, budgetId: number): Promise<void> {
  return refresh(qc, queryKeys.budgets.comments(budgetId), queryKeys.budgets.review(budgetId), queryKeys.budgets.reviewQueue(), queryKeys.audit.all());
}

/**
 * A budget was submitted, approved or returned: its status, versions (approval), comments (a
 * return adds one) and review state, every list, the queue, the audit trail, and the mail sent.
 */
export function afterReviewDecision(qc: QueryClient, budgetId: number): Promise<void> {
  return refresh(qc, queryKeys.budgets.detail(budgetId), queryKeys.budgets.lists(), queryKeys.budgets.reviewQueue(), queryKeys.audit.all(), queryKeys.mail());
}

/** A budget became a template or stopped being one. */
export function afterTemplateChanged(qc: QueryClient, budgetId: number): Promise<void> {
  return refresh(qc, queryKeys.budgets.detail(budgetId), queryKeys.budgets.lists(), queryKeys.audit.all());
}

/** An account was created, invited, or changed (name, role, access): the users, the mail sent, the trail and its actors. */
export function afterAccountChange(qc: QueryClient): Promise<void> {
  return refresh(qc, queryKeys.users.all(), queryKeys.mail(), queryKeys.audit.all());
}

/** Someone signed in or out: nothing read under another identity is kept. */
export function afterIdentityChange(qc: QueryClient, me: Me | null): void {
  qc.clear();
  qc.setQueryData(queryKeys.me(), me);
}
