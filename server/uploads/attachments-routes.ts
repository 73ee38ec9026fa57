import type { RequestHandler } from 'express';
import { z } from 'zod';
import { ValidationError } from '../http/errors';
import { userOf, type RouteTable } from '../http/routes';
import { attachmentParams, budgetParams, quantitySymbol, versionNumber } from '../http/params';
import { parse } from '../http/validate';
import type { AttachmentsService } from './attachments-service';
import { multipartForm } from './multipart-form';

const listQuery = z.strictObject({ version: versionNumber.optional() });
const attachmentForm = z.strictObject({ symbol: quantitySymbol.optional() });

/** Refuses a request that is not a multipart form, naming the field the file goes in. */
export function requireMultipart(field: string): RequestHandler {
  return (req, _res, next) => {
    if (!req.is('multipart/form-data')) return next(new ValidationError(`send a multipart form with the file in "${field}"`, field));
    next();
  };
}

/** Evidence kept with a budget version: list, add, download. */
export function attachmentsRoutes(t: RouteTable, attachments: AttachmentsService, limits: { attachmentMaxBytes: number }): void {
  const evidenceUpload = multipartForm(limits.attachmentMaxBytes);

  t.add('get', '/api/budgets/:id/attachments', 'budget.read', (req, res) => {
    const { id } = parse(budgetParams, req.params);
    res.json(attachments.list(id, parse(listQuery, req.query).version));
  });

  t.add('post', '/api/budgets/:id/attachments', 'attachment.create', requireMultipart('file'), evidenceUpload, (req, res) => {
    const { id } = parse(budgetParams, req.params);
    const form = parse(attachmentForm, req.body ?? {});
    res.status(201).json(attachments.add(userOf(req), id, req.file, form.symbol ?? null));
  });

  t.add('get', '/api/budgets/:id/attachments/:aid', 'budget.read', (req, res) => {
    const p = parse(attachmentParams, req.params);
    const { row, path } = attachments.file(p.id, p.aid);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    res.setHeader('X-Content-SHA256', row.sha256);
    res.attachment(row.fileName);
    res.type(row.mediaType);
    res.sendFile(path);
  });
}
