import type { RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { UnsupportedMediaTypeError, ValidationError } from '../http/errors';
import { userOf, type RouteTable } from '../http/routes';
import { parse } from '../http/validate';
import type { AttachmentsService } from './attachments-service';
import { parseObservations } from './observations';

const id = z.coerce.number({ error: 'must be a budget id' }).int().positive({ message: 'must be a budget id' });
const idParams = z.strictObject({ id });
const fileParams = z.strictObject({ id, aid: z.coerce.number().int().positive() });
const observationsForm = z.strictObject({ column: z.string().max(200).optional() });
const attachmentForm = z.strictObject({
  symbol: z.string().regex(/^[A-Za-z_][A-Za-z0-9_]*$/, { message: 'must be a symbol name' }).optional(),
});

const TEXT_TYPES = new Set(['text/csv', 'text/plain', 'application/csv', 'application/vnd.ms-excel', 'text/tab-separated-values', 'application/octet-stream']);

function requireMultipart(field: string): RequestHandler {
  return (req, _res, next) => {
    if (!req.is('multipart/form-data')) return next(new ValidationError(`send a multipart form with the file in "${field}"`, field));
    next();
  };
}

export function uploadsRoutes(
  t: RouteTable,
  attachments: AttachmentsService,
  limits: { observationsMaxBytes: number; attachmentMaxBytes: number },
): void {
  // Browsers send file names as UTF-8 without saying so; busboy's default (latin1) would garble "Prüfschein.pdf".
  const multipartForm = (fileSize: number) =>
    multer({ storage: multer.memoryStorage(), defParamCharset: 'utf8', limits: { fileSize, files: 1, fields: 5 } }).single('file');
  const csvUpload = multipartForm(limits.observationsMaxBytes);
  const evidenceUpload = multipartForm(limits.attachmentMaxBytes);

  t.add('post', '/api/uploads/observations', 'observations.upload', requireMultipart('file'), csvUpload, (req, res) => {
    const form = parse(observationsForm, req.body ?? {});
    if (!req.file) throw new ValidationError('send the CSV file in the "file" field', 'file');
    if (!TEXT_TYPES.has(req.file.mimetype) && !/\.(csv|txt|tsv)$/i.test(req.file.originalname)) {
      throw new UnsupportedMediaTypeError('send a CSV or plain-text file', 'file');
    }
    res.json(parseObservations(req.file.buffer.toString('utf8'), form.column));
  });

  t.add('get', '/api/budgets/:id/attachments', 'budget.read', (req, res) => {
    res.json(attachments.list(parse(idParams, req.params).id));
  });

  t.add('post', '/api/budgets/:id/attachments', 'attachment.create', requireMultipart('file'), evidenceUpload, (req, res) => {
    const { id } = parse(idParams, req.params);
    const form = parse(attachmentForm, req.body ?? {});
    res.status(201).json(attachments.add(userOf(req), id, req.file, form.symbol ?? null));
  });

  t.add('get', '/api/budgets/:id/attachments/:aid', 'budget.read', (req, res) => {
    const p = parse(fileParams, req.params);
    const { row, path } = attachments.file(p.id, p.aid);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    res.attachment(row.fileName);
    res.type(row.mediaType);
    res.sendFile(path);
  });
}
