import { and, asc, eq } from 'drizzle-orm';
import type { DbLike } from '../db/connection';
import { attachments } from '../db/schema';

export type AttachmentRow = typeof attachments.$inferSelect;

export function insertAttachment(db: DbLike, a: Omit<typeof attachments.$inferInsert, 'id'>): AttachmentRow {
  return db.insert(attachments).values(a).returning().get();
}

export function listAttachments(db: DbLike, budgetId: number): AttachmentRow[] {
  return db.select().from(attachments).where(eq(attachments.budgetId, budgetId)).orderBy(asc(attachments.id)).all();
}

export function getAttachment(db: DbLike, budgetId: number, id: number): AttachmentRow | undefined {
  return db.select().from(attachments).where(and(eq(attachments.budgetId, budgetId), eq(attachments.id, id))).get();
}
