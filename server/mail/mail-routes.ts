import { z } from 'zod';
import type { RouteTable } from '../http/routes';
import { parse } from '../http/validate';
import type { MailService } from './mail-service';

const query = z.strictObject({ limit: z.coerce.number().int().min(1).max(1000).default(100) });

export function mailRoutes(t: RouteTable, mail: MailService): void {
  t.add('get', '/api/dev/mail', 'mail.read', (req, res) => {
    const q = parse(query, req.query);
    res.json(mail.outbox(q.limit));
  });
}
