import { z } from 'zod';
import { UnsupportedMediaTypeError, ValidationError } from '../http/errors';
import type { RouteTable } from '../http/routes';
import { parse } from '../http/validate';
import { attachmentsRoutes, requireMultipart } from './attachments-routes';
import type { AttachmentsService } from './attachments-service';
import { multipartForm } from './multipart-form';
import { parseObservations } from './observations';

const observationsForm = z.strictObject({ column: z.string().max(200).optional() });

const TEXT_TYPES = new Set(['text/csv', 'text/plain', 'application/csv', 'application/vnd.ms-excel', 'text/tab-separated-values', 'application/octet-stream']);

export function uploadsRoutes(t: RouteTable, attachments: AttachmentsService, limits: { observationsMaxBytes: number; attachmentMaxBytes: number }): void {
  const csvUpload = multipartForm(limits.observationsMaxBytes);

  t.add('post', '/api/uploads/observations', 'observations.upload', requireMultipart('file'), csvUpload, (req, res) => {
    const form = parse(observationsForm, req.body ?? {});
    if (!req.file) throw new ValidationError('send the CSV file in the "file" field', 'file');
    if (!TEXT_TYPES.has(req.file.mimetype) && !/\.(csv|txt|tsv)$/i.test(req.file.originalname)) {
      throw new UnsupportedMediaTypeError('send a CSV or plain-text file', 'file');
    }
    res.json(parseObservations(req.file.buffer.toString('utf8'), form.column));
  });

  attachmentsRoutes(t, attachments, limits);
}
