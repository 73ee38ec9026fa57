import { and, desc, eq, gte, lte, sql, type SQL } from 'drizzle-orm';
import type { AuditEvent } from '../../shared/api/audit';
import type { DbLike } from '../db/connection';
import { auditEvents, users } from '../db/schema';

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
  limit: number;
  offset: number;
}

/** Call inside the transaction of the change it records. */
export function recordAudit(db: DbLike, e: NewAuditEvent): void {
  db.insert(auditEvents)
    .values({
      at: e.at ?? Date.now(),
      actorId: e.actorId,
      action: e.action,
      budgetId: e.budgetId ?? null,
      versionNumber: e.versionNumber ?? null,
      detail: JSON.stringify(e.detail ?? {}),
    })
    .run();
}

export function listAudit(db: DbLike, f: AuditFilter): { rows: AuditEvent[]; total: number } {
  const where: SQL[] = [];
  if (f.budgetId !== undefined) where.push(eq(auditEvents.budgetId, f.budgetId));
  if (f.actorId !== undefined) where.push(eq(auditEvents.actorId, f.actorId));
  if (f.action !== undefined) {
    // "budget" matches every budget.* action; "budget.approved" only itself.
    where.push(f.action.includes('.') ? eq(auditEvents.action, f.action) : sql`${auditEvents.action} LIKE ${f.action + '.%'}`);
  }
  if (f.from !== undefined) where.push(gte(auditEvents.at, f.from));
  if (f.to !== undefined) where.push(lte(auditEvents.at, f.to));
  const cond = where.length ? and(...where) : undefined;
  const total = db.select({ n: sql<number>`count(*)` }).from(auditEvents).where(cond).get()?.n ?? 0;
  const rows = db
    .select({
      id: auditEvents.id,
      at: auditEvents.at,
      actorId: auditEvents.actorId,
      actorEmail: users.email,
      action: auditEvents.action,
      budgetId: auditEvents.budgetId,
      versionNumber: auditEvents.versionNumber,
      detail: auditEvents.detail,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(cond)
    // newest first; events of the same millisecond by id, the later one first
    .orderBy(desc(auditEvents.at), desc(auditEvents.id))
    .limit(f.limit)
    .offset(f.offset)
    .all();
  return { rows: rows.map((r) => ({ ...r, detail: JSON.parse(r.detail) as Record<string, unknown> })), total };
}
