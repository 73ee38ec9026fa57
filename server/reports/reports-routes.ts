import type { Response } from 'express';
import { z } from 'zod';
import { userOf, type RouteTable } from '../http/routes';
import { parse } from '../http/validate';
import type { ReportsService } from './reports-service';

const id = z.coerce.number({ error: 'must be a budget id' }).int().positive({ message: 'must be a budget id' });
const versionNumber = z.coerce.number({ error: 'must be a version number' }).int().positive({ message: 'must be a version number' });
const idParams = z.strictObject({ id });
const versionParams = z.strictObject({ id, n: versionNumber });

/** The PDF as a download named after the title and version. */
function send(res: Response, f: { fileName: string; pdf: Buffer }): void {
  res.type('application/pdf');
  res.attachment(f.fileName);
  res.send(f.pdf);
}

export function reportsRoutes(t: RouteTable, reports: ReportsService): void {
  t.add('get', '/api/budgets/:id/report.pdf', 'budget.read', async (req, res) => {
    send(res, await reports.pdf(userOf(req), parse(idParams, req.params).id));
  });

  t.add('get', '/api/budgets/:id/versions/:n/report.pdf', 'budget.read', async (req, res) => {
    const p = parse(versionParams, req.params);
    send(res, await reports.pdf(userOf(req), p.id, p.n));
  });
}
