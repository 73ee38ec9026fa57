import { and, asc, eq, type SQL } from 'drizzle-orm';
import type { Comment } from '../../shared/api/reviews';
import type { DbLike } from '../db/connection';
import { comments, users } from '../db/schema';

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
      resolvedAt: comments.resolvedAt,
      createdAt: comments.createdAt,
    })
    .from(comments)
    .innerJoin(users, eq(users.id, comments.authorId))
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

export function insertComment(
  db: DbLike,
  c: { budgetId: number; versionNumber: number; symbol: string | null; parentId?: number | null; authorId: number; body: string; at: number },
): number {
  return db
    .insert(comments)
    .values({ budgetId: c.budgetId, versionNumber: c.versionNumber, symbol: c.symbol, parentId: c.parentId ?? null, authorId: c.authorId, body: c.body, createdAt: c.at })
    .returning({ id: comments.id })
    .get().id;
}

export function setResolved(db: DbLike, id: number, resolved: boolean, userId: number, at: number): void {
  db.update(comments)
    .set({ resolved, resolvedBy: resolved ? userId : null, resolvedAt: resolved ? at : null })
    .where(eq(comments.id, id))
    .run();
}
