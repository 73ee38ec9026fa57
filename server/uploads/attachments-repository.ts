import { and, asc, eq, lte, type SQL } from 'drizzle-orm';
import type { Attachment } from '../../shared/api/uploads';
import type { DbLike } from '../db/connection';
import { attachments, users } from '../db/schema';

const columns = {
  id: attachments.id,
  budgetId: attachments.budgetId,
  versionNumber: attachments.versionNumber,
  symbol: attachments.symbol,
  fileName: attachments.fileName,
  size: attachments.size,
  sha256: attachments.sha256,
  mediaType: attachments.mediaType,
  uploadedBy: attachments.uploadedBy,
  uploaderName: users.name,
  createdAt: attachments.createdAt,
};

/** Attachments as the API returns them: with the uploader's name, in the order they were added. */
function selectAttachments(db: DbLike, where: SQL | undefined): Attachment[] {
  return db.select(columns).from(attachments).innerJoin(users, eq(users.id, attachments.uploadedBy)).where(where).orderBy(asc(attachments.id)).all();
}

export function insertAttachment(db: DbLike, a: Omit<typeof attachments.$inferInsert, 'id'>): number {
  return db.insert(attachments).values(a).returning({ id: attachments.id }).get().id;
}

/** The evidence of a version: what was added to it and to every earlier version. */
export function listAttachments(db: DbLike, budgetId: number, upToVersion: number): Attachment[] {
  return selectAttachments(db, and(eq(attachments.budgetId, budgetId), lte(attachments.versionNumber, upToVersion)));
}

export function getAttachment(db: DbLike, budgetId: number, id: number): Attachment | undefined {
  return selectAttachments(db, and(eq(attachments.budgetId, budgetId), eq(attachments.id, id)))[0];
}
