/** `GET /api/audit`: the audit trail, newest first. Types only. */

export interface AuditEvent {
  id: number;
  /** Milliseconds since the epoch. */
  at: number;
  /** The same instant in ISO 8601 to the second, UTC: `2026-12-02T08:15:03Z`. */
  time: string;
  actorId: number | null;
  actorEmail: string | null;
  actorName: string | null;
  action: string;
  budgetId: number | null;
  /** The budget's current title. */
  budgetTitle: string | null;
  versionNumber: number | null;
  detail: Record<string, unknown>;
  /** The particulars in words, as the CSV export has them. */
  details: string;
  /** SHA-256 chaining this event to the one before it (see AuditChainReport). */
  hash: string | null;
}

/** One page of the trail, the number of events that match the filter and the head of the whole chain. */
export interface AuditPage {
  events: AuditEvent[];
  total: number;
  chainHead: AuditChainHead | null;
}

/** The newest event of the whole trail and its chain hash: keep it elsewhere to detect later removals. */
export interface AuditChainHead {
  id: number;
  hash: string;
}

/** `GET /api/audit/verify`: the hash chain of the trail recomputed from its first event. */
export interface AuditChainReport {
  intact: boolean;
  /** Events checked. */
  events: number;
  head: AuditChainHead | null;
  /** The first event whose link does not hold, and what is wrong with it, in words. */
  firstBroken: { id: number; problem: string } | null;
}
