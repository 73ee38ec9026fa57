import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../app/http';
import type { AuditPage } from '../../../../shared/api/audit';
import type { BudgetListItem } from '../../../../shared/api/budgets';

export interface AuditFilter {
  budget?: number;
  actor?: number;
  /** "budget" for every budget.* action, or one action such as "budget.approved". */
  action?: string;
  /** Milliseconds since the epoch. */
  from?: number;
  to?: number;
}

/** Every action the server records, grouped by what it concerns. */
export const AUDIT_ACTIONS: { group: string; label: string; actions: string[] }[] = [
  { group: 'budget', label: 'Budgets', actions: ['budget.created', 'budget.imported', 'budget.version_saved', 'budget.cloned', 'budget.submitted', 'budget.approved', 'budget.returned', 'budget.template_changed'] },
  { group: 'comment', label: 'Comments', actions: ['comment.created', 'comment.resolved', 'comment.reopened'] },
  { group: 'attachment', label: 'Attachments', actions: ['attachment.added'] },
  { group: 'user', label: 'Users', actions: ['user.created', 'user.invited', 'user.updated', 'user.password_reset_requested', 'user.password_set'] },
  { group: 'auth', label: 'Sign-in', actions: ['auth.signed_in', 'auth.signed_out', 'auth.sign_in_refused'] },
];

export function auditParams(f: AuditFilter): URLSearchParams {
  const p = new URLSearchParams();
  if (f.budget) p.set('budget', String(f.budget));
  if (f.actor) p.set('actor', String(f.actor));
  if (f.action) p.set('action', f.action);
  if (f.from !== undefined) p.set('from', String(f.from));
  if (f.to !== undefined) p.set('to', String(f.to));
  return p;
}

/** The download link of the filtered trail as CSV (every matching event, not only the page). */
export function auditCsvUrl(f: AuditFilter): string {
  const p = auditParams(f);
  p.set('format', 'csv');
  p.set('limit', '10000');
  return `/api/audit?${p}`;
}

export const auditQuery = (f: AuditFilter, page: { limit: number; offset: number }) =>
  queryOptions({
    queryKey: ['audit', f, page],
    queryFn: () => {
      const p = auditParams(f);
      p.set('limit', String(page.limit));
      p.set('offset', String(page.offset));
      return api<AuditPage>(`/api/audit?${p}`);
    },
    placeholderData: keepPreviousData,
  });

export function useAudit(f: AuditFilter, page: { limit: number; offset: number }) {
  return useQuery(auditQuery(f, page));
}

/** People who appear in the trail, for the actor filter (the user list itself is for admins only). */
export function useAuditActors() {
  return useQuery({
    queryKey: ['audit', 'actors'],
    queryFn: async () => {
      const r = await api<AuditPage>('/api/audit?limit=10000');
      const m = new Map<number, string>();
      for (const e of r.events) if (e.actorId !== null) m.set(e.actorId, e.actorEmail ?? `user #${e.actorId}`);
      return [...m].sort((a, b) => a[1].localeCompare(b[1]));
    },
    staleTime: 60_000,
  });
}

export function useAuditBudgets() {
  return useQuery({
    queryKey: ['audit', 'budgets'],
    queryFn: () => api<BudgetListItem[]>('/api/budgets?template=any&limit=1000'),
    staleTime: 60_000,
  });
}
