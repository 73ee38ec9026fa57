/** `GET /api/audit`: the audit trail, newest first. Types only. */

export interface AuditEvent {
  id: number;
  at: number;
  actorId: number | null;
  actorEmail: string | null;
  action: string;
  budgetId: number | null;
  versionNumber: number | null;
  detail: Record<string, unknown>;
}

/** One page of the trail and the number of events that match the filter. */
export interface AuditPage {
  events: AuditEvent[];
  total: number;
}
