import { keepPreviousData, queryOptions } from '@tanstack/react-query';
import type { Me, MailMessage, TokenInfo, UserAccount } from '../../shared/api/accounts';
import type { UserSort } from '../../shared/api/user-admin';
import type { AuditPage } from '../../shared/api/audit';
import type { BudgetListItem, BudgetSort, BudgetView, ComputeLimits, VersionMeta, VersionView } from '../../shared/api/budgets';
import type { BudgetDiff } from '../../shared/api/diff';
import type { Comment, ReviewQueueItem, ReviewState } from '../../shared/api/reviews';
import type { Attachment } from '../../shared/api/uploads';
import { api, apiPage, ApiError } from '../app/http';
import { queryKeys, type AuditFilter, type BudgetListFilter, type PageRequest, type UserFilter } from './query-keys';

/**
 * One `queryOptions` per server resource, each under its key from `queryKeys`. Features build
 * their hooks on these, so two screens that read one resource share one cache entry and one
 * request.
 */

function pageParams(page: PageRequest, into = new URLSearchParams()): URLSearchParams {
  into.set('limit', String(page.limit));
  into.set('offset', String(page.offset));
  if (page.sort) into.set('sort', page.sort);
  if (page.order) into.set('order', page.order);
  return into;
}

// ── budgets ────────────────────────────────────────────────────────────────

export const budgetListQuery = (filter: BudgetListFilter, page: PageRequest<BudgetSort>) =>
  queryOptions({
    queryKey: queryKeys.budgets.list(filter, page),
    queryFn: () => {
      const p = new URLSearchParams();
      if (filter.status) p.set('status', filter.status);
      if (filter.returned !== undefined) p.set('returned', String(filter.returned));
      if (filter.owner) p.set('owner', String(filter.owner));
      if (filter.q) p.set('q', filter.q);
      return apiPage<BudgetListItem>(`/api/budgets?${pageParams(page, p)}`);
    },
    placeholderData: keepPreviousData,
  });

/** Every budget and template (the server's largest page), for the filters that name budgets and owners. */
export const budgetIndexQuery = () =>
  queryOptions({
    queryKey: queryKeys.budgets.index(),
    queryFn: () => api<BudgetListItem[]>('/api/budgets?template=any&limit=1000'),
    staleTime: 60_000,
  });

export const templatesQuery = () =>
  queryOptions({
    queryKey: queryKeys.budgets.templates(),
    queryFn: () => api<BudgetListItem[]>('/api/templates'),
  });

export const reviewQueueQuery = () =>
  queryOptions({
    queryKey: queryKeys.budgets.reviewQueue(),
    queryFn: () => api<ReviewQueueItem[]>('/api/reviews/queue'),
  });

/** The budget with its current version, document and result. */
export const budgetQuery = (id: number) =>
  queryOptions({
    queryKey: queryKeys.budgets.detail(id),
    queryFn: () => api<BudgetView>(`/api/budgets/${id}`),
  });

/** Every version of a budget, oldest first (the save conflict and the comparison read them all). */
export const versionListQuery = (id: number) =>
  queryOptions({
    queryKey: queryKeys.budgets.versionList(id),
    queryFn: () => api<VersionMeta[]>(`/api/budgets/${id}/versions`),
  });

/** One page of a budget's versions, in the order asked for. */
export const versionPageQuery = (id: number, page: PageRequest<'number'>) =>
  queryOptions({
    queryKey: queryKeys.budgets.versionPage(id, page),
    queryFn: () => {
      const p = new URLSearchParams({ limit: String(page.limit), offset: String(page.offset) });
      if (page.order) p.set('order', page.order);
      return apiPage<VersionMeta>(`/api/budgets/${id}/versions?${p}`);
    },
    placeholderData: keepPreviousData,
  });

/** One stored version; it never changes (its approval is refreshed through the budget's prefix). */
export const versionQuery = (id: number, n: number) =>
  queryOptions({
    queryKey: queryKeys.budgets.version(id, n),
    queryFn: () => api<VersionView>(`/api/budgets/${id}/versions/${n}`),
    staleTime: Infinity,
  });

export const diffQuery = (id: number, from: number, to: number) =>
  queryOptions({
    queryKey: queryKeys.budgets.diff(id, from, to),
    queryFn: () => api<BudgetDiff>(`/api/budgets/${id}/diff?from=${from}&to=${to}`),
    staleTime: Infinity,
  });

export const commentsQuery = (id: number) =>
  queryOptions({
    queryKey: queryKeys.budgets.comments(id),
    queryFn: () => api<Comment[]>(`/api/budgets/${id}/comments`),
  });

export const reviewStateQuery = (id: number) =>
  queryOptions({
    queryKey: queryKeys.budgets.review(id),
    queryFn: () => api<ReviewState>(`/api/budgets/${id}/review`),
  });

/** The evidence a version carries (what was added to it and to earlier versions). */
export const attachmentsQuery = (id: number, version: number) =>
  queryOptions({
    queryKey: queryKeys.budgets.attachmentsOf(id, version),
    queryFn: () => api<Attachment[]>(`/api/budgets/${id}/attachments?version=${version}`),
  });

// ── audit trail ────────────────────────────────────────────────────────────

/** The audit filter as query parameters (the page's and the CSV download's). */
export function auditParams(f: AuditFilter): URLSearchParams {
  const p = new URLSearchParams();
  if (f.budget) p.set('budget', String(f.budget));
  if (f.actor) p.set('actor', String(f.actor));
  if (f.action) p.set('action', f.action);
  if (f.from !== undefined) p.set('from', String(f.from));
  if (f.to !== undefined) p.set('to', String(f.to));
  return p;
}

export const auditPageQuery = (filter: AuditFilter, page: PageRequest) =>
  queryOptions({
    queryKey: queryKeys.audit.page(filter, page),
    queryFn: () => api<AuditPage>(`/api/audit?${pageParams(page, auditParams(filter))}`),
    placeholderData: keepPreviousData,
  });

/** People who appear in the trail, for the actor filter (the user list itself is for admins only). */
export const auditActorsQuery = () =>
  queryOptions({
    queryKey: queryKeys.audit.actors(),
    queryFn: async () => {
      const r = await api<AuditPage>('/api/audit?limit=10000');
      const m = new Map<number, string>();
      for (const e of r.events) if (e.actorId !== null) m.set(e.actorId, e.actorEmail ?? `user #${e.actorId}`);
      return [...m].sort((a, b) => a[1].localeCompare(b[1]));
    },
    staleTime: 60_000,
  });

// ── accounts ───────────────────────────────────────────────────────────────

export const usersPageQuery = (filter: UserFilter, page: PageRequest<UserSort>) =>
  queryOptions({
    queryKey: queryKeys.users.page(filter, page),
    queryFn: () => {
      const p = new URLSearchParams();
      if (filter.q) p.set('q', filter.q);
      if (filter.role) p.set('role', filter.role);
      return apiPage<UserAccount>(`/api/users?${pageParams(page, p)}`);
    },
    placeholderData: keepPreviousData,
  });

export const mailQuery = () => queryOptions({ queryKey: queryKeys.mail(), queryFn: () => api<MailMessage[]>('/api/dev/mail?limit=200'), refetchInterval: 10_000 });

/** The signed-in user, or null when signed out (401). */
export const meQuery = () =>
  queryOptions({
    queryKey: queryKeys.me(),
    queryFn: async (): Promise<Me | null> => {
      try {
        return await api<Me>('/api/me');
      } catch (e) {
        if (e instanceof ApiError && e.status === 401) return null;
        throw e;
      }
    },
    staleTime: 60_000,
    retry: false,
  });

/** What a link from an e-mail is for; 404 when it is invalid, used or expired. */
export const tokenQuery = (token: string) =>
  queryOptions({
    queryKey: queryKeys.authToken(token),
    queryFn: () => api<TokenInfo>(`/api/auth/token?token=${encodeURIComponent(token)}`),
    retry: false,
    staleTime: Infinity,
  });

/** The server's trials cap and default trials: the Monte Carlo panel never runs more than a save would store. */
export const computeLimitsQuery = () =>
  queryOptions({
    queryKey: queryKeys.computeLimits(),
    queryFn: () => api<ComputeLimits>('/api/config'),
    staleTime: Infinity,
  });
