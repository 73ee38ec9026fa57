import type { AuditEvent, AuditPage } from '../../shared/api/audit';
import type { Db } from '../db/connection';
import { listAudit, type AuditFilter } from './audit-repository';

function csvCell(v: unknown): string {
  const s = v === null || v === undefined ? '' : typeof v === 'string' ? v : JSON.stringify(v);
  // Cells that a spreadsheet would run as a formula are prefixed with an apostrophe.
  const safe = /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

export class AuditService {
  constructor(private readonly db: Db) {}

  list(filter: AuditFilter): AuditPage {
    const { rows, total } = listAudit(this.db, filter);
    return { events: rows, total };
  }

  toCsv(events: AuditEvent[]): string {
    const head = ['id', 'time_utc', 'actor_id', 'actor_email', 'action', 'budget_id', 'version', 'detail'];
    const lines = events.map((e) =>
      [e.id, new Date(e.at).toISOString(), e.actorId, e.actorEmail, e.action, e.budgetId, e.versionNumber, e.detail]
        .map(csvCell)
        .join(','),
    );
    return [head.join(','), ...lines].join('\r\n') + '\r\n';
  }
}
