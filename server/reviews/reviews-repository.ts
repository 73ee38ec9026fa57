import { and, asc, eq } from 'drizzle-orm';
import type { DbLike } from '../db/connection';
import { comments } from '../db/schema';

export type CommentRow = typeof comments.$inferSelect;

export function listComments(db: DbLike, budgetId: number, versionNumber?: number): CommentRow[] {
  return db
    .select()
    .from(comments)
    .where(versionNumber === undefined ? eq(comments.budgetId, budgetId) : and(eq(comments.budgetId, budgetId), eq(comments.versionNumber, versionNumber)))
    .orderBy(asc(comments.id))
    .all();
}

export function getComment(db: DbLike, budgetId: number, id: number): CommentRow | undefined {
  return db.select().from(comments).where(and(eq(comments.id, id), eq(comments.budgetId, budgetId))).get();
}

export function insertComment(
  db: DbLike,
  c: { budgetId: number; versionNumber: number; symbol: string | null; authorId: number; body: string; at: number },
): CommentRow {
  return db
    .insert(comments)
    .values({ budgetId: c.budgetId, versionNumber: c.versionNumber, symbol: c.symbol, authorId: c.authorId, body: c.body, createdAt: c.at })
    .returning()
    .get();
}

export function setResolved(db: DbLike, id: number, resolved: boolean, userId: number, at: number): CommentRow {
  return db
    .update(comments)
    .set({ resolved, resolvedBy: resolved ? userId : null, resolvedAt: resolved ? at : null })
    .where(eq(comments.id, id))
    .returning()
    .get();
}
