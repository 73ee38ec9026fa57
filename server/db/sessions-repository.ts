import { eq, lt, sql } from 'drizzle-orm';
import type { DbLike } from './connection';
import { prepared } from './prepared';
import { httpSessions } from './schema';

export type SessionRow = typeof httpSessions.$inferSelect;

export function getSession(db: DbLike, sid: string): SessionRow | undefined {
  return prepared(db, 'session.bySid', () =>
    db
      .select()
      .from(httpSessions)
      .where(eq(httpSessions.sid, sql.placeholder('sid')))
      .prepare(),
  ).get({ sid });
}

export function putSession(db: DbLike, sid: string, data: string, expiresAt: number): void {
  db.insert(httpSessions).values({ sid, data, expiresAt }).onConflictDoUpdate({ target: httpSessions.sid, set: { data, expiresAt } }).run();
}

export function deleteSession(db: DbLike, sid: string): void {
  db.delete(httpSessions).where(eq(httpSessions.sid, sid)).run();
}

export function setSessionExpiry(db: DbLike, sid: string, expiresAt: number): void {
  db.update(httpSessions).set({ expiresAt }).where(eq(httpSessions.sid, sid)).run();
}

export function listSessions(db: DbLike): Pick<SessionRow, 'sid' | 'data'>[] {
  return db.select({ sid: httpSessions.sid, data: httpSessions.data }).from(httpSessions).all();
}

export function deleteSessionsExpiredBefore(db: DbLike, now: number): void {
  db.delete(httpSessions).where(lt(httpSessions.expiresAt, now)).run();
}
