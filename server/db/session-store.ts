import session from 'express-session';
import type { Db } from './connection';
import { RowCache } from './row-cache';
import { deleteSession, deleteSessionsExpiredBefore, getSession, listSessions, putSession, setSessionExpiry } from './sessions-repository';

const DAY = 24 * 60 * 60 * 1000;

interface StoredSession {
  /** The session as stored (JSON text): every read hands express-session a fresh object. */
  data: string;
  expiresAt: number;
  /** When this process last wrote the row, so a busy client does not cost a disk write per request. */
  writtenAt: number;
}

/**
 * express-session store over the `http_sessions` table. Rows are cached in
 * memory after their first read (write-through, see RowCache); expired rows are
 * swept on an unref'd timer.
 */
export class DrizzleSessionStore extends session.Store {
  private timer: NodeJS.Timeout;
  private readonly rows: RowCache<string, StoredSession>;
  private readonly touchEveryMs = 60_000;

  constructor(
    private readonly db: Db,
    dataVersion: () => number,
    sweepEveryMs = 10 * 60 * 1000,
  ) {
    super();
    this.rows = new RowCache(dataVersion);
    this.timer = setInterval(() => this.sweep(), sweepEveryMs);
    this.timer.unref();
  }

  private expiry(sess: session.SessionData): number {
    const expires = sess.cookie?.expires;
    return expires ? new Date(expires).getTime() : Date.now() + DAY;
  }

  private read(sid: string): StoredSession | undefined {
    const row = getSession(this.db, sid);
    // A row read from disk counts as freshly written: the next touch may wait a full interval.
    return row ? { data: row.data, expiresAt: row.expiresAt, writtenAt: Date.now() } : undefined;
  }

  override get(sid: string, cb: (err: unknown, session?: session.SessionData | null) => void): void {
    try {
      // Unknown ids are not cached: a stream of made-up cookies must not fill memory.
      const row = this.rows.get(sid, () => this.read(sid));
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
      putSession(this.db, sid, data, expiresAt);
      this.rows.set(sid, { data, expiresAt, writtenAt: Date.now() });
      cb?.();
    } catch (e) {
      this.rows.delete(sid);
      cb?.(e);
    }
  }

  override destroy(sid: string, cb?: (err?: unknown) => void): void {
    try {
      this.rows.delete(sid);
      deleteSession(this.db, sid);
      cb?.();
    } catch (e) {
      cb?.(e);
    }
  }

  override touch(sid: string, sess: session.SessionData, cb?: (err?: unknown) => void): void {
    try {
      const row = this.rows.get(sid, () => this.read(sid));
      const now = Date.now();
      if (!row || now - row.writtenAt >= this.touchEveryMs) {
        const expiresAt = this.expiry(sess);
        setSessionExpiry(this.db, sid, expiresAt);
        if (row) this.rows.set(sid, { ...row, expiresAt, writtenAt: now });
      }
      cb?.();
    } catch (e) {
      cb?.(e);
    }
  }

  /** Ends every session of a user (after a password change or deactivation). */
  destroyForUser(userId: number): void {
    const rows = listSessions(this.db);
    for (const row of rows) {
      try {
        const data = JSON.parse(row.data) as { passport?: { user?: number } };
        if (data.passport?.user === userId) this.destroy(row.sid);
      } catch {
        /* unreadable row: leave it to expire */
      }
    }
  }

  sweep(): void {
    const now = Date.now();
    this.rows.clear((row) => row.expiresAt <= now);
    try {
      deleteSessionsExpiredBefore(this.db, now);
    } catch {
      /* database closed */
    }
  }

  close(): void {
    clearInterval(this.timer);
  }
}
