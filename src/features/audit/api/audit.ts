import { useQuery } from '@tanstack/react-query';
import { auditActorsQuery, auditPageQuery, auditParams, budgetIndexQuery } from '../../../budget/queries';
import type { AuditFilter, PageRequest } from '../../../budget/query-keys';

/** Every action the server records, grouped by what it concerns. */
export const AUDIT_ACTIONS: { group: string; label: string; actions: string[] }[] = [
  {
    group: 'budget',
    label: 'Budgets',
    actions: ['budget.created', 'budget.imported', 'budget.version_saved', 'budget.cloned', 'budget.submitted', 'budget.approved', 'budget.returned', 'budget.template_changed'],
  },
  { group: 'comment', label: 'Comments', actions: ['comment.created', 'comment.resolved', 'comment.reopened'] },
  { group: 'attachment', label: 'Attachments', actions: ['attachment.added'] },
  { group: 'user', label: 'Users', actions: ['user.created', 'user.invited', 'user.updated', 'user.password_reset_requested', 'user.password_set'] },
  { group: 'auth', label: 'Sign-in', actions: ['auth.signed_in', 'auth.signed_out', 'auth.sign_in_refused'] },
];

/** The download link of the filtered trail as CSV (every matching event, not only the page). */
export function auditCsvUrl(f: AuditFilter): string {
  const p = auditParams(f);
  p.set('format', 'csv');
  p.set('limit', '10000');
  return `/api/audit?${p}`;
}

export function useAudit(f: AuditFilter, page: PageRequest) {
  return useQuery(auditPageQuery(f, page));
}

export function useAuditActors() {
  return useQuery(auditActorsQuery());
}

/** The budgets the trail may be filtered by (the same index the budget list's owner filter reads). */
export function useAuditBudgets() {
  return useQuery(budgetIndexQuery());
}
