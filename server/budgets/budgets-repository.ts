import { and, asc, desc, eq, sql, type SQL } from 'drizzle-orm';
import { alias, type AnySQLiteColumn } from 'drizzle-orm/sqlite-core';
import type { BudgetListItem, BudgetSort, VersionMeta } from '../../shared/api/budgets';
import type { BudgetStatus } from '../../shared/policy/policy';
import type { DbLike } from '../db/connection';
import { prepared } from '../db/prepared';
import { budgets, budgetVersions, users } from '../db/schema';
import { containsText } from '../db/text-match';

export type BudgetRow = typeof budgets.$inferSelect;
export type VersionRow = typeof budgetVersions.$inferSelect;
export type NewVersion = Omit<typeof budgetVersions.$inferInsert, 'id' | 'approvedBy' | 'approvedAt'>;

export interface BudgetFilter {
  status?: BudgetStatus;
  ownerId?: number;
  q?: string;
  template?: 'true' | 'false' | 'any';
  /** Drafts a reviewer sent back (true) or the others (false). */
  returned?: boolean;
  /** Newest change first unless asked. */
  sort?: BudgetSort;
  order?: 'asc' | 'desc';
  limit: number;
  offset: number;
}

/** The list's sort columns; a status orders draft, returned, in review, approved. */
const BUDGET_ORDER: Record<BudgetSort, SQL | AnySQLiteColumn> = {
  title: sql`${budgets.title} COLLATE NOCASE`,
  status: sql`CASE ${budgets.status} WHEN 'draft' THEN ${budgets.returned} WHEN 'in_review' THEN 2 ELSE 3 END`,
  owner: sql`${users.name} COLLATE NOCASE`,
  version: budgets.currentVersion,
  updated: budgets.updatedAt,
};

export function getBudget(db: DbLike, id: number): BudgetRow | undefined {
  return prepared(db, 'budget.byId', () =>
    db
      .select()
      .from(budgets)
      .where(eq(budgets.id, sql.placeholder('id')))
      .prepare(),
  ).get({ id });
}

function listWhere(f: ListWhere): SQL | undefined {
  const where: SQL[] = [];
  if (f.status) where.push(eq(budgets.status, f.status));
  if (f.ownerId !== undefined) where.push(eq(budgets.ownerId, f.ownerId));
  if (f.q) where.push(containsText(budgets.title, f.q));
  if (f.template !== 'any') where.push(eq(budgets.isTemplate, f.template === 'true'));
  if (f.returned !== undefined) where.push(eq(budgets.returned, f.returned));
  return where.length ? and(...where) : undefined;
}

type ListWhere = Omit<BudgetFilter, 'limit' | 'offset' | 'sort' | 'order'>;

/** The order asked for; equal values by id in the same direction, so pages neither repeat nor skip a row. */
function listOrder(f: Pick<BudgetFilter, 'sort' | 'order'>): SQL[] {
  const dir = (f.order ?? 'desc') === 'asc' ? asc : desc;
  return [dir(BUDGET_ORDER[f.sort ?? 'updated']), dir(budgets.id)];
}

export function listBudgets(db: DbLike, f: BudgetFilter): BudgetListItem[] {
  return db
    .select({
      id: budgets.id,
      title: budgets.title,
      status: budgets.status,
      returned: budgets.returned,
      isTemplate: budgets.isTemplate,
      ownerId: budgets.ownerId,
      ownerName: users.name,
      currentVersion: budgets.currentVersion,
      approvedVersion: budgets.approvedVersion,
      createdAt: budgets.createdAt,
      updatedAt: budgets.updatedAt,
    })
    .from(budgets)
    .innerJoin(users, eq(users.id, budgets.ownerId))
    .where(listWhere(f))
    .orderBy(...listOrder(f))
    .limit(f.limit)
    .offset(f.offset)
    .all();
}

export function insertBudget(db: DbLike, b: Pick<BudgetRow, 'title' | 'ownerId' | 'isTemplate'> & Partial<Pick<BudgetRow, 'sourceBudgetId' | 'sourceVersion'>>, at: number): BudgetRow {
  return db
    .insert(budgets)
    .values({ ...b, status: 'draft', currentVersion: 0, createdAt: at, updatedAt: at })
    .returning()
    .get();
}

export function updateBudget(db: DbLike, id: number, patch: Partial<Pick<BudgetRow, 'title' | 'status' | 'returned' | 'isTemplate' | 'currentVersion' | 'approvedVersion' | 'updatedAt'>>): void {
  db.update(budgets).set(patch).where(eq(budgets.id, id)).run();
}

export function insertVersion(db: DbLike, v: NewVersion): VersionRow {
  return db.insert(budgetVersions).values(v).returning().get();
}

export function getVersion(db: DbLike, budgetId: number, number: number): VersionRow | undefined {
  return prepared(db, 'version.byNumber', () =>
    db
      .select()
      .from(budgetVersions)
      .where(and(eq(budgetVersions.budgetId, sql.placeholder('budgetId')), eq(budgetVersions.number, sql.placeholder('number'))))
      .prepare(),
  ).get({ budgetId, number });
}

const approvers = alias(users, 'approvers');
const owners = alias(users, 'owners');

export interface CurrentVersionRow {
  budget: BudgetRow;
  version: VersionRow;
  ownerName: string | null;
  authorName: string | null;
  approverName: string | null;
}

/** A budget with its current version and the names it is shown with, in one query (the hot read path). */
export function getCurrentVersion(db: DbLike, id: number): CurrentVersionRow | undefined {
  return prepared(db, 'budget.current', () =>
    db
      .select({ budget: budgets, version: budgetVersions, ownerName: owners.name, authorName: users.name, approverName: approvers.name })
      .from(budgets)
      .innerJoin(budgetVersions, and(eq(budgetVersions.budgetId, budgets.id), eq(budgetVersions.number, budgets.currentVersion)))
      .leftJoin(owners, eq(owners.id, budgets.ownerId))
      .leftJoin(users, eq(users.id, budgetVersions.authorId))
      .leftJoin(approvers, eq(approvers.id, budgetVersions.approvedBy))
      .where(eq(budgets.id, sql.placeholder('id')))
      .prepare(),
  ).get({ id });
}

/** One version with the names of its author and approver. */
export function getVersionNamed(db: DbLike, budgetId: number, number: number): { version: VersionRow; authorName: string | null; approverName: string | null } | undefined {
  return db
    .select({ version: budgetVersions, authorName: users.name, approverName: approvers.name })
    .from(budgetVersions)
    .leftJoin(users, eq(users.id, budgetVersions.authorId))
    .leftJoin(approvers, eq(approvers.id, budgetVersions.approvedBy))
    .where(and(eq(budgetVersions.budgetId, budgetId), eq(budgetVersions.number, number)))
    .get();
}

/** A budget in review with its current version's author, oldest first in the reviewers' queue. */
export interface InReviewRow {
  budgetId: number;
  title: string;
  ownerId: number;
  ownerName: string;
  isTemplate: boolean;
  version: number;
  authorId: number;
  authorName: string;
  since: number;
}

export function listInReview(db: DbLike): InReviewRow[] {
  return db
    .select({
      budgetId: budgets.id,
      title: budgets.title,
      ownerId: budgets.ownerId,
      ownerName: owners.name,
      isTemplate: budgets.isTemplate,
      version: budgets.currentVersion,
      authorId: budgetVersions.authorId,
      authorName: users.name,
      since: budgets.updatedAt,
    })
    .from(budgets)
    .innerJoin(budgetVersions, and(eq(budgetVersions.budgetId, budgets.id), eq(budgetVersions.number, budgets.currentVersion)))
    .innerJoin(owners, eq(owners.id, budgets.ownerId))
    .innerJoin(users, eq(users.id, budgetVersions.authorId))
    .where(eq(budgets.status, 'in_review'))
    .orderBy(asc(budgets.updatedAt), asc(budgets.id))
    .all();
}

/** One page of a budget's version metadata (without document and result text, with the names of author and approver), oldest first unless `order` is desc. */
export function listVersions(db: DbLike, budgetId: number, page: { limit: number; offset: number; order: 'asc' | 'desc' }): VersionMeta[] {
  return db
    .select({
      number: budgetVersions.number,
      authorId: budgetVersions.authorId,
      authorName: users.name,
      createdAt: budgetVersions.createdAt,
      note: budgetVersions.note,
      seed: budgetVersions.seed,
      engineVersion: budgetVersions.engineVersion,
      documentSha256: budgetVersions.documentSha256,
      approvedBy: budgetVersions.approvedBy,
      approverName: approvers.name,
      approvedAt: budgetVersions.approvedAt,
    })
    .from(budgetVersions)
    .innerJoin(users, eq(users.id, budgetVersions.authorId))
    .leftJoin(approvers, eq(approvers.id, budgetVersions.approvedBy))
    .where(eq(budgetVersions.budgetId, budgetId))
    .orderBy(page.order === 'desc' ? desc(budgetVersions.number) : asc(budgetVersions.number))
    .limit(page.limit)
    .offset(page.offset)
    .all();
}

export function recordApproval(db: DbLike, budgetId: number, number: number, userId: number, at: number): void {
  db.update(budgetVersions)
    .set({ approvedBy: userId, approvedAt: at })
    .where(and(eq(budgetVersions.budgetId, budgetId), eq(budgetVersions.number, number), sql`${budgetVersions.approvedAt} IS NULL`))
    .run();
}

/** How many budgets match a filter (every budget, templates included, without one). */
export function countBudgets(db: DbLike, f: ListWhere = { template: 'any' }): number {
  return (
    db
      .select({ n: sql<number>`count(*)` })
      .from(budgets)
      .where(listWhere(f))
      .get()?.n ?? 0
  );
}
