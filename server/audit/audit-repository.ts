import { and, asc, desc, eq, gt, gte, isNull, lte, sql, type SQL } from 'drizzle-orm';
import type { AuditChainHead, AuditChainReport, AuditEvent } from '../../shared/api/audit';
import type { DbLike } from '../db/connection';
import { auditEvents, budgets, users } from '../db/schema';
import { startsWithText } from '../db/text-match';
import { chainHash, GENESIS_HASH, type ChainedFields } from './audit-chain';

export interface NewAuditEvent {
  actorId: number | null;
  action: string;
  budgetId?: number | null;
  versionNumber?: number | null;
  detail?: Record<string, unknown>;
  at?: number;
}

export interface AuditFilter {
  budgetId?: number;
  actorId?: number;
  action?: string;
  from?: number;
  to?: number;
  /** Newest first unless asc. */
  order?: 'asc' | 'desc';
  limit: number;
  offset: number;
}

/** The audit event as listed, before the service adds its readable time and details. */
export type AuditRow = Omit<AuditEvent, 'time' | 'details'>;

function lastEvent(db: DbLike): { id: number; hash: string | null } | undefined {
  return db.select({ id: auditEvents.id, hash: auditEvents.hash }).from(auditEvents).orderBy(desc(auditEvents.id)).limit(1).get();
}

/** The highest id SQLite ever gave an event (AUTOINCREMENT keeps it even when the last rows are removed). */
function lastIssuedId(db: DbLike): number {
  return db.get<{ seq: number } | undefined>(sql`SELECT seq FROM sqlite_sequence WHERE name = 'audit_events'`)?.seq ?? 0;
}

/**
 * Gives the events written before the chain existed their hashes, in id order (the trigger lets
 * a missing hash be set once). Call inside a transaction.
 */
export function sealAuditChain(db: DbLike): number {
  const unsealed = db.select({ id: auditEvents.id }).from(auditEvents).where(isNull(auditEvents.hash)).limit(1).get();
  if (!unsealed) return 0;
  let previous = GENESIS_HASH;
  let sealed = 0;
  for (const e of eventsInOrder(db)) {
    if (e.hash === null) {
      const hash = chainHash(previous, e);
      db.update(auditEvents).set({ hash }).where(eq(auditEvents.id, e.id)).run();
      previous = hash;
      sealed++;
    } else {
      previous = e.hash;
    }
  }
  return sealed;
}

/** Call inside the transaction of the change it records; the event is chained to the last one. */
export function recordAudit(db: DbLike, e: NewAuditEvent): void {
  let last = lastEvent(db);
  if (last && last.hash === null) {
    sealAuditChain(db);
    last = lastEvent(db);
  }
  const fields: ChainedFields = {
    // One past every id ever given, so a removed last event leaves a visible gap.
    id: Math.max(lastIssuedId(db), last?.id ?? 0) + 1,
    at: e.at ?? Date.now(),
    actorId: e.actorId,
    action: e.action,
    budgetId: e.budgetId ?? null,
    versionNumber: e.versionNumber ?? null,
    detail: JSON.stringify(e.detail ?? {}),
  };
  db.insert(auditEvents)
    .values({ ...fields, hash: chainHash(last?.hash ?? GENESIS_HASH, fields) })
    .run();
}

export function auditChainHead(db: DbLike): AuditChainHead | null {
  const last = lastEvent(db);
  return last?.hash ? { id: last.id, hash: last.hash } : null;
}

/** Every event by id, read a block at a time so a long trail is never held whole. */
function* eventsInOrder(db: DbLike) {
  let after = 0;
  for (;;) {
    const block = db.select().from(auditEvents).where(gt(auditEvents.id, after)).orderBy(asc(auditEvents.id)).limit(2000).all();
    yield* block;
    if (block.length < 2000) return;
    after = block[block.length - 1].id;
  }
}

/**
 * Recomputes the chain from the first event and reports the first link that does not hold:
 * a missing hash, a gap in the ids (events removed), an event that does not match its hash
 * (altered, or one before it removed or inserted), or events removed after the last one.
 */
export function verifyAuditChain(db: DbLike): AuditChainReport {
  let previous = GENESIS_HASH;
  let expectedId = 1;
  let events = 0;
  let head: AuditChainHead | null = null;
  const broken = (id: number, problem: string): AuditChainReport => ({ intact: false, events, head, firstBroken: { id, problem } });
  for (const e of eventsInOrder(db)) {
    events++;
    if (e.id !== expectedId) {
      return broken(
        e.id,
        expectedId === e.id - 1 ? `event ${expectedId} is missing before event ${e.id}: it was removed` : `events ${expectedId} to ${e.id - 1} are missing before event ${e.id}: they were removed`,
      );
    }
    if (e.hash === null) return broken(e.id, `event ${e.id} has no chain hash: it was written outside the application`);
    if (chainHash(previous, e) !== e.hash) {
      return broken(e.id, `event ${e.id} does not match its hash: it, or the event before it, was altered outside the application`);
    }
    previous = e.hash;
    head = { id: e.id, hash: e.hash };
    expectedId = e.id + 1;
  }
  const issued = lastIssuedId(db);
  if (issued >= expectedId) {
    return broken(expectedId, `events ${expectedId} to ${issued} were given out but are gone: the newest events were removed`);
  }
  return { intact: true, events, head, firstBroken: null };
}

export function listAudit(db: DbLike, f: AuditFilter): { rows: AuditRow[]; total: number } {
  const where: SQL[] = [];
  if (f.budgetId !== undefined) where.push(eq(auditEvents.budgetId, f.budgetId));
  if (f.actorId !== undefined) where.push(eq(auditEvents.actorId, f.actorId));
  if (f.action !== undefined) {
    // "budget" matches every budget.* action; "budget.approved" only itself.
    where.push(f.action.includes('.') ? eq(auditEvents.action, f.action) : startsWithText(auditEvents.action, `${f.action}.`));
  }
  if (f.from !== undefined) where.push(gte(auditEvents.at, f.from));
  if (f.to !== undefined) where.push(lte(auditEvents.at, f.to));
  const cond = where.length ? and(...where) : undefined;
  const total =
    db
      .select({ n: sql<number>`count(*)` })
      .from(auditEvents)
      .where(cond)
      .get()?.n ?? 0;
  const rows = db
    .select({
      id: auditEvents.id,
      at: auditEvents.at,
      actorId: auditEvents.actorId,
      actorEmail: users.email,
      actorName: users.name,
      action: auditEvents.action,
      budgetId: auditEvents.budgetId,
      budgetTitle: budgets.title,
      versionNumber: auditEvents.versionNumber,
      detail: auditEvents.detail,
      hash: auditEvents.hash,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .leftJoin(budgets, eq(budgets.id, auditEvents.budgetId))
    .where(cond)
    // newest first unless asked; events of the same millisecond by id, in the same direction
    .orderBy(...(f.order === 'asc' ? [asc(auditEvents.at), asc(auditEvents.id)] : [desc(auditEvents.at), desc(auditEvents.id)]))
    .limit(f.limit)
    .offset(f.offset)
    .all();
  return { rows: rows.map((r) => ({ ...r, detail: JSON.parse(r.detail) as Record<string, unknown> })), total };
}
