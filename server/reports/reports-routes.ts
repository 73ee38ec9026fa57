import type { Response } from 'express';
import { userOf, type RouteTable } from '../http/routes';
import { budgetParams, versionParams } from '../http/params';
import { parse } from '../http/validate';
import type { ReportsService } from './reports-service';

/** The PDF as a download named after the title and version. */
function send(res: Response, f: { fileName: string; pdf: Buffer }): void {
  res.type('application/pdf');
  res.attachment(f.fileName);
  res.send(f.pdf);
}

export function reportsRoutes(t: RouteTable, reports: ReportsService): void {
  t.add('get', '/api/budgets/:id/report.pdf', 'budget.read', async (req, res) => {
    send(res, await reports.pdf(userOf(req), parse(budgetParams, req.params).id));
  });

  t.add('get', '/api/budgets/:id/versions/:n/report.pdf', 'budget.read', async (req, res) => {
    const p = parse(versionParams, req.params);
    send(res, await reports.pdf(userOf(req), p.id, p.n));
  });
}
