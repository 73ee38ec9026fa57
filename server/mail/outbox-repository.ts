import { desc } from 'drizzle-orm';
import type { DbLike } from '../db/connection';
import { outbox } from '../db/schema';

export interface OutboxMessage {
  sender: string;
  recipients: string[];
  subject: string;
  text: string;
  raw?: string;
}

export function insertOutbox(db: DbLike, m: OutboxMessage): void {
  db.insert(outbox)
    .values({ at: Date.now(), sender: m.sender, recipients: m.recipients.join(', '), subject: m.subject, text: m.text, raw: m.raw ?? null })
    .run();
}

export function listOutbox(db: DbLike, limit: number) {
  return db
    .select({ id: outbox.id, at: outbox.at, sender: outbox.sender, recipients: outbox.recipients, subject: outbox.subject, text: outbox.text })
    .from(outbox)
    .orderBy(desc(outbox.id))
    .limit(limit)
    .all()
    .map((m) => ({ ...m, recipients: m.recipients.split(', ').filter(Boolean) }));
}
