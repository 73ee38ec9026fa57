import { z } from 'zod';
import type { RouteTable } from '../http/routes';
import { budgetId, pageQuery, sortOrder, userId } from '../http/params';
import { parse } from '../http/validate';
import type { AuditService } from './audit-service';

const time = z.union([z.coerce.number().int().nonnegative(), z.iso.datetime({ offset: true }).transform((s) => Date.parse(s))]);

const query = z.strictObject({
  budget: budgetId.optional(),
  actor: userId.optional(),
  action: z
    .string()
    .regex(/^[a-z_]+(\.[a-z_]+)?$/, { message: 'must look like "budget" or "budget.approved"' })
    .optional(),
  from: time.optional(),
  to: time.optional(),
  format: z.enum(['json', 'csv']).default('json'),
  order: sortOrder('desc'),
  ...pageQuery(10_000, 500),
});

export function auditRoutes(t: RouteTable, audit: AuditService): void {
  t.add('get', '/api/audit', 'audit.read', (req, res) => {
    const q = parse(query, req.query);
    const page = audit.list({
      budgetId: q.budget,
      actorId: q.actor,
      action: q.action,
      from: q.from,
      to: q.to,
      order: q.order,
      limit: q.limit,
      offset: q.offset,
    });
    // The newest event of the whole trail: a copy kept elsewhere reveals a later removal.
    if (page.chainHead) res.setHeader('X-Audit-Chain-Head', `${page.chainHead.id}:${page.chainHead.hash}`);
    if (q.format === 'csv') {
      res.type('text/csv; charset=utf-8');
      res.attachment('dubito-audit.csv');
      res.send(audit.toCsv(page.events));
      return;
    }
    res.set('X-Total-Count', String(page.total)).json(page);
  });

  t.add('get', '/api/audit/verify', 'audit.read', (_req, res) => {
    res.json(audit.verify());
  });
}
