import { and, asc, eq, inArray, isNull, lte, max, or, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { Comment, ReviewDecision } from '../../shared/api/reviews';
import type { ValidationVerdict } from '../../shared/budget/result';
import type { DbLike } from '../db/connection';
import { comments, reviewDecisions, users } from '../db/schema';

const resolvers = alias(users, 'resolvers');

/** Comments as the API returns them: with the author's name. */
function selectComments(db: DbLike, where: SQL | undefined): Comment[] {
  return db
    .select({
      id: comments.id,
      budgetId: comments.budgetId,
      versionNumber: comments.versionNumber,
      symbol: comments.symbol,
      parentId: comments.parentId,
      authorId: comments.authorId,
      authorName: users.name,
      body: comments.body,
      resolved: comments.resolved,
      resolvedBy: comments.resolvedBy,
      resolvedByName: resolvers.name,
      resolvedAt: comments.resolvedAt,
      createdAt: comments.createdAt,
    })
    .from(comments)
    .innerJoin(users, eq(users.id, comments.authorId))
    .leftJoin(resolvers, eq(resolvers.id, comments.resolvedBy))
    .where(where)
    .orderBy(asc(comments.id))
    .all();
}

export function listComments(db: DbLike, budgetId: number, versionNumber?: number): Comment[] {
  return selectComments(db, versionNumber === undefined ? eq(comments.budgetId, budgetId) : and(eq(comments.budgetId, budgetId), eq(comments.versionNumber, versionNumber)));
}

export function getComment(db: DbLike, budgetId: number, id: number): Comment | undefined {
  return selectComments(db, and(eq(comments.id, id), eq(comments.budgetId, budgetId)))[0];
}

export function insertComment(db: DbLike, c: { budgetId: number; versionNumber: number; symbol: string | null; parentId?: number | null; authorId: number; body: string; at: number }): number {
  return db
    .insert(comments)
    .values({ budgetId: c.budgetId, versionNumber: c.versionNumber, symbol: c.symbol, parentId: c.parentId ?? null, authorId: c.authorId, body: c.body, createdAt: c.at })
    .returning({ id: comments.id })
    .get().id;
}

/** Resolves or reopens a whole thread: its first comment and every reply. */
export function setThreadResolved(db: DbLike, rootId: number, resolved: boolean, userId: number, at: number): void {
  db.update(comments)
    .set({ resolved, resolvedBy: resolved ? userId : null, resolvedAt: resolved ? at : null })
    .where(or(eq(comments.id, rootId), eq(comments.parentId, rootId)))
    .run();
}

/** First comments of the unresolved threads of a budget. */
export function openThreads(db: DbLike, budgetId: number): Comment[] {
  return selectComments(db, and(eq(comments.budgetId, budgetId), isNull(comments.parentId), eq(comments.resolved, false)));
}

/** The highest version at most `upTo` that the user commented on or decided on. */
export function lastVersionSeenBy(db: DbLike, budgetId: number, userId: number, upTo: number): number | null {
  const c = db
    .select({ n: max(comments.versionNumber) })
    .from(comments)
    .where(and(eq(comments.budgetId, budgetId), eq(comments.authorId, userId), lte(comments.versionNumber, upTo)))
    .get()?.n;
  const d = db
    .select({ n: max(reviewDecisions.versionNumber) })
    .from(reviewDecisions)
    .where(and(eq(reviewDecisions.budgetId, budgetId), eq(reviewDecisions.actorId, userId), lte(reviewDecisions.versionNumber, upTo)))
    .get()?.n;
  const seen = [c, d].filter((n): n is number => typeof n === 'number');
  return seen.length ? Math.max(...seen) : null;
}

export function insertDecision(
  db: DbLike,
  d: {
    budgetId: number;
    versionNumber: number;
    decision: 'approved' | 'returned';
    actorId: number;
    reason: string | null;
    openThreads: number;
    validationVerdict: ValidationVerdict | null;
    at: number;
  },
): void {
  db.insert(reviewDecisions).values(d).run();
}

export function listDecisions(db: DbLike, budgetId: number): ReviewDecision[] {
  return db
    .select({
      id: reviewDecisions.id,
      budgetId: reviewDecisions.budgetId,
      versionNumber: reviewDecisions.versionNumber,
      decision: reviewDecisions.decision,
      actorId: reviewDecisions.actorId,
      actorName: users.name,
      reason: reviewDecisions.reason,
      openThreads: reviewDecisions.openThreads,
      validationVerdict: sql<ValidationVerdict | null>`${reviewDecisions.validationVerdict}`,
      at: reviewDecisions.at,
    })
    .from(reviewDecisions)
    .innerJoin(users, eq(users.id, reviewDecisions.actorId))
    .where(eq(reviewDecisions.budgetId, budgetId))
    .orderBy(asc(reviewDecisions.id))
    .all();
}

/** Unresolved thread counts per budget. */
export function openThreadCounts(db: DbLike, budgetIds: number[]): Map<number, number> {
  if (!budgetIds.length) return new Map();
  const rows = db
    .select({ budgetId: comments.budgetId, n: sql<number>`count(*)` })
    .from(comments)
    .where(and(inArray(comments.budgetId, budgetIds), isNull(comments.parentId), eq(comments.resolved, false)))
    .groupBy(comments.budgetId)
    .all();
  return new Map(rows.map((r) => [r.budgetId, r.n]));
}
