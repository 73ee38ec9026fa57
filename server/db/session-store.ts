import { eq, lt, sql } from 'drizzle-orm';
import session from 'express-session';
import type { Db } from './connection';
import { prepared } from './prepared';
import { httpSessions } from './schema';

const DAY = 24 * 60 * 60 * 1000;

/** express-session store over the `http_sessions` table; expired rows are swept on an unref'd timer. */
export class DrizzleSessionStore extends session.Store {
  private timer: NodeJS.Timeout;
  /** When each session was last written, so a busy client does not cost a disk write per request. */
  private written = new Map<string, number>();
  private readonly touchEveryMs = 60_000;

  constructor(
    private readonly db: Db,
    sweepEveryMs = 10 * 60 * 1000,
  ) {
    super();
    this.timer = setInterval(() => this.sweep(), sweepEveryMs);
    this.timer.unref();
  }

  private expiry(sess: session.SessionData): number {
    const expires = sess.cookie?.expires;
    return expires ? new Date(expires).getTime() : Date.now() + DAY;
  }

  override get(sid: string, cb: (err: unknown, session?: session.SessionData | null) => void): void {
    try {
      const row = prepared(this.db, 'session.bySid', () =>
        this.db.select().from(httpSessions).where(eq(httpSessions.sid, sql.placeholder('sid'))).prepare(),
      ).get({ sid });
      if (!row || row.expiresAt <= Date.now()) return cb(null, null);
      cb(null, JSON.parse(row.data) as session.SessionData);
    } catch (e) {
      cb(e);
    }
  }

  override set(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void): void {
    try {
      const data = JSON.stringify(sess);
      const expiresAt = this.expiry(sess);
      this.db
        .insert(httpSessions)
        .values({ sid, data, expiresAt })
        .onConflictDoUpdate({ target: httpSessions.sid, set: { data, expiresAt } })
        .run();
      this.written.set(sid, Date.now());
      cb?.();
    } catch (e) {
      cb?.(e);
    }
  }

  override destroy(sid: string, cb?: (err?: unknown) => void): void {
    try {
      this.db.delete(httpSessions).where(eq(httpSessions.sid, sid)).run();
      this.written.delete(sid);
      cb?.();
    } catch (e) {
      cb?.(e);
    }
  }

  override touch(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void): void {
    try {
      const last = this.written.get(sid);
      if (last === undefined || Date.now() - last >= this.touchEveryMs) {
        this.db.update(httpSessions).set({ expiresAt: this.expiry(sess) }).where(eq(httpSessions.sid, sid)).run();
        this.written.set(sid, Date.now());
      }
      cb?.();
    } catch (e) {
      cb?.(e);
    }
  }

  /** Ends every session of a user (after a password change or deactivation). */
  destroyForUser(userId: number): void {
    const rows = this.db.select({ sid: httpSessions.sid, data: httpSessions.data }).from(httpSessions).all();
    for (const row of rows) {
      try {
        const data = JSON.parse(row.data) as { passport?: { user?: number } };
        if (data.passport?.user === userId) this.db.delete(httpSessions).where(eq(httpSessions.sid, row.sid)).run();
      } catch {
        /* unreadable row: leave it to expire */
      }
    }
  }

  sweep(): void {
    const cutoff = Date.now() - this.touchEveryMs;
    for (const [sid, at] of this.written) if (at < cutoff) this.written.delete(sid);
    try {
      this.db.delete(httpSessions).where(lt(httpSessions.expiresAt, Date.now())).run();
    } catch {
      /* database closed */
    }
  }

  close(): void {
    clearInterval(this.timer);
  }
}
