import type { AuditChainHead, AuditChainReport, AuditEvent, AuditPage } from '../../shared/api/audit';
import { inTransaction, type Db, type DbLike } from '../db/connection';
import { auditChainHead, listAudit, recordAudit, sealAuditChain, verifyAuditChain, type AuditFilter, type NewAuditEvent } from './audit-repository';

export type { NewAuditEvent };

/** ISO 8601 to the second, UTC (`2026-12-02T08:15:03Z`): what an assessor reads and compares. */
export function isoSecond(ms: number): string {
  return new Date(ms).toISOString().replace(/\.\d{3}Z$/, 'Z');
}

function csvCell(v: unknown): string {
  const s = v === null || v === undefined ? '' : String(v);
  // Cells that a spreadsheet would run as a formula are prefixed with an apostrophe.
  const safe = /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

/** `commentId` → `comment id`. */
function words(key: string): string {
  return key
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/_/g, ' ')
    .toLowerCase();
}

function phrase(v: unknown): string {
  if (v === null || v === undefined) return 'none';
  if (typeof v === 'string') return `"${v}"`;
  if (typeof v !== 'object') return String(v);
  if (Array.isArray(v)) return v.map(phrase).join(', ');
  const o = v as Record<string, unknown>;
  if ('from' in o && 'to' in o && Object.keys(o).length === 2) return `${phrase(o.from)} → ${phrase(o.to)}`;
  return Object.entries(o)
    .map(([k, x]) => `${words(k)} ${phrase(x)}`)
    .join(', ');
}

/** The particulars of an event as one line of words (`from "draft" to "in_review"; comment "…"`), never JSON. */
export function describeDetail(detail: Record<string, unknown>): string {
  const parts: string[] = [];
  const rest = { ...detail };
  if ('from' in rest && 'to' in rest) {
    parts.push(`from ${phrase(rest.from)} to ${phrase(rest.to)}`);
    delete rest.from;
    delete rest.to;
  }
  for (const [k, v] of Object.entries(rest)) parts.push(k === 'changes' ? `changed ${phrase(v)}` : `${words(k)} ${phrase(v)}`);
  return parts.join('; ');
}

export class AuditService {
  constructor(private readonly db: Db) {
    // Events written before the trail was chained get their hashes once, in order.
    inTransaction(db, (tx) => sealAuditChain(tx));
  }

  /**
   * Writes an event chained to the last one. Every component records its changes here, passing the
   * transaction of the change, so the event and the change are committed together or not at all.
   */
  record(tx: DbLike, e: NewAuditEvent): void {
    recordAudit(tx, e);
  }

  list(filter: AuditFilter): AuditPage {
    const { rows, total } = listAudit(this.db, filter);
    return { events: rows.map((r) => ({ ...r, time: isoSecond(r.at), details: describeDetail(r.detail) })), total, chainHead: auditChainHead(this.db) };
  }

  chainHead(): AuditChainHead | null {
    return auditChainHead(this.db);
  }

  /** Recomputes the whole chain; the first broken link names the event and what is wrong. */
  verify(): AuditChainReport {
    return verifyAuditChain(this.db);
  }

  /** A UTF-8 CSV (with BOM, so spreadsheets read the accents) of flat columns, details in words. */
  toCsv(events: AuditEvent[]): string {
    const head = ['event', 'time', 'actor_id', 'actor_name', 'action', 'budget_id', 'budget_title', 'version', 'details', 'hash'];
    const lines = events.map((e) => [e.id, e.time, e.actorId, e.actorName, e.action, e.budgetId, e.budgetTitle, e.versionNumber, e.details, e.hash].map(csvCell).join(','));
    return '\uFEFF' + [head.join(','), ...lines].join('\r\n') + '\r\n';
  }
}
