import type { BudgetSort } from '../../shared/api/budgets';
import type { UserSort } from '../../shared/api/user-admin';
import type { BudgetStatus, Role } from '../../shared/policy/policy';

/**
 * The one query-key factory of the client: every server resource the client reads has its key
 * here, and nowhere else. Keys are hierarchical — a key starts with the key of what it depends
 * on — so invalidating a prefix refreshes everything below it:
 *
 *   ['budgets']                                  everything about budgets
 *   ['budgets', 'list', …]                       the list pages, the index, the templates
 *   ['budgets', 'review-queue']                  the reviewer's queue
 *   ['budgets', id]                              one budget, and below it:
 *   ['budgets', id, 'versions', …]               its versions (pages, the whole list, one version)
 *   ['budgets', id, 'diff', from, to]            a comparison
 *   ['budgets', id, 'comments' | 'review']       its review threads and what a signature covers
 *   ['budgets', id, 'attachments', n?]           its evidence
 *   ['audit', …]                                 the audit trail (pages, the actors in it)
 *   ['users', …] · ['mail'] · ['me'] · ['auth', 'token', t] · ['compute-limits']
 */

/** A page of a list the server pages and sorts (`limit`/`offset`, `sort`/`order`). */
export interface PageRequest<S extends string = string> {
  limit: number;
  offset: number;
  sort?: S;
  order?: 'asc' | 'desc';
}

/** The budget list's filters, as the server takes them. */
export interface BudgetListFilter {
  status?: BudgetStatus;
  /** Drafts sent back by a reviewer (true) or the other ones (false). */
  returned?: boolean;
  owner?: number;
  q?: string;
}

/** The audit trail's filters. */
export interface AuditFilter {
  budget?: number;
  actor?: number;
  /** "budget" for every budget.* action, or one action such as "budget.approved". */
  action?: string;
  /** Milliseconds since the epoch. */
  from?: number;
  to?: number;
}

/** The users list's filters. */
export interface UserFilter {
  /** Part of the name or the e-mail address. */
  q?: string;
  role?: Role;
}

export const queryKeys = {
  budgets: {
    all: () => ['budgets'] as const,
    /** Every list of budgets: the pages, the index and the templates. */
    lists: () => ['budgets', 'list'] as const,
    list: (filter: BudgetListFilter, page: PageRequest<BudgetSort>) => ['budgets', 'list', 'page', filter, page] as const,
    /** Every budget's id, title and owner (for the filters that name budgets and owners). */
    index: () => ['budgets', 'list', 'index'] as const,
    templates: () => ['budgets', 'list', 'templates'] as const,
    reviewQueue: () => ['budgets', 'review-queue'] as const,
    detail: (id: number) => ['budgets', id] as const,
    versions: (id: number) => ['budgets', id, 'versions'] as const,
    versionList: (id: number) => ['budgets', id, 'versions', 'all'] as const,
    versionPage: (id: number, page: PageRequest<'number'>) => ['budgets', id, 'versions', 'page', page] as const,
    version: (id: number, n: number) => ['budgets', id, 'versions', n] as const,
    diff: (id: number, from: number, to: number) => ['budgets', id, 'diff', from, to] as const,
    comments: (id: number) => ['budgets', id, 'comments'] as const,
    review: (id: number) => ['budgets', id, 'review'] as const,
    attachments: (id: number) => ['budgets', id, 'attachments'] as const,
    attachmentsOf: (id: number, version: number) => ['budgets', id, 'attachments', version] as const,
  },
  audit: {
    all: () => ['audit'] as const,
    page: (filter: AuditFilter, page: PageRequest) => ['audit', 'page', filter, page] as const,
    actors: () => ['audit', 'actors'] as const,
  },
  users: {
    all: () => ['users'] as const,
    page: (filter: UserFilter, page: PageRequest<UserSort>) => ['users', 'page', filter, page] as const,
  },
  mail: () => ['mail'] as const,
  me: () => ['me'] as const,
  authToken: (token: string) => ['auth', 'token', token] as const,
  computeLimits: () => ['compute-limits'] as const,
};
