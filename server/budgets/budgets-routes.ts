import type { RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { BUDGET_SORTS, type ComputeLimits } from '../../shared/api/budgets';
import { versionNoteField } from '../../shared/api/version-note';
import { parseBudgetFile, serializeBudget } from '../../shared/budget/budget-file';
import { BUDGET_STATUSES } from '../../shared/policy/policy';
import { ValidationError } from '../http/errors';
import { userOf, type RouteTable } from '../http/routes';
import { budgetParams, pageQuery, sortOrder, sortQuery, userId, versionNumber, versionParams } from '../http/params';
import { parse } from '../http/validate';
import type { BudgetsService } from './budgets-service';

const documentField = z.custom<unknown>((v) => typeof v === 'object' && v !== null && !Array.isArray(v), {
  message: 'must be a budget file object',
});

const listQuery = z.strictObject({
  status: z.enum(BUDGET_STATUSES, { error: `must be one of ${BUDGET_STATUSES.join(', ')}` }).optional(),
  owner: userId.optional(),
  q: z.string().max(200).optional(),
  template: z.enum(['true', 'false', 'any']).default('false'),
  returned: z.enum(['true', 'false'], { error: 'must be true or false' }).optional(),
  ...sortQuery(BUDGET_SORTS, 'updated', 'desc'),
  ...pageQuery(1000, 200),
});
const versionsQuery = z.strictObject({ order: sortOrder('asc'), ...pageQuery(1000, 1000) });
const createBody = z.strictObject({ document: documentField, note: versionNoteField.default(''), template: z.boolean().optional() });
const saveBody = z.strictObject({ baseVersion: versionNumber, document: documentField, note: versionNoteField.default('') });
const patchBody = z.strictObject({ isTemplate: z.boolean({ error: 'must be true or false' }) });
const diffQuery = z.strictObject({ from: versionNumber, to: versionNumber });
const cloneBody = z.strictObject({ version: versionNumber.optional(), title: z.string().trim().min(1).max(300).optional() });
const exportQuery = z.strictObject({ version: versionNumber.optional() });
const importJson = z.strictObject({ document: documentField, note: versionNoteField.optional(), template: z.boolean().optional() });
const importForm = z.strictObject({ note: versionNoteField.optional(), template: z.enum(['true', 'false']).optional() });

export function budgetsRoutes(t: RouteTable, budgets: BudgetsService, opts: { importMaxBytes: number; limits: ComputeLimits }): void {
  const importUpload: RequestHandler = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: opts.importMaxBytes, files: 1, fields: 10 },
  }).single('file');

  t.add('get', '/api/config', 'signed-in', (_req, res) => {
    res.json(opts.limits);
  });

  t.add('get', '/api/budgets', 'budget.read', (req, res) => {
    const q = parse(listQuery, req.query);
    const { rows, total } = budgets.page({
      status: q.status,
      ownerId: q.owner,
      q: q.q,
      template: q.template,
      returned: q.returned === undefined ? undefined : q.returned === 'true',
      sort: q.sort,
      order: q.order,
      limit: q.limit,
      offset: q.offset,
    });
    res.set('X-Total-Count', String(total)).json(rows);
  });

  t.add('get', '/api/templates', 'budget.read', (_req, res) => {
    res.json(budgets.list({ template: 'true', limit: 1000, offset: 0 }));
  });

  t.add('post', '/api/budgets', 'budget.create', async (req, res) => {
    const b = parse(createBody, req.body);
    res.status(201).json(await budgets.create(userOf(req), { document: b.document, note: b.note, template: b.template }));
  });

  t.add('post', '/api/budgets/import', 'budget.create', importUpload, async (req, res) => {
    let document: unknown;
    let note: string | undefined;
    let template: boolean | undefined;
    if (req.file) {
      const f = parse(importForm, req.body ?? {});
      document = parseBudgetFile(req.file.buffer.toString('utf8'));
      note = f.note;
      template = f.template === 'true';
    } else if (req.is('multipart/form-data')) {
      throw new ValidationError('send the budget file in the "file" field', 'file');
    } else {
      const body = req.body as Record<string, unknown> | undefined;
      if (body && typeof body === 'object' && 'format' in body) document = body;
      else {
        const b = parse(importJson, body);
        document = b.document;
        note = b.note;
        template = b.template;
      }
    }
    const r = await budgets.create(userOf(req), { document, note: note ?? 'imported', template }, 'budget.imported');
    res.status(201).json(r);
  });

  t.add('get', '/api/budgets/:id', 'budget.read', (req, res) => {
    res.type('application/json').send(budgets.getJson(parse(budgetParams, req.params).id));
  });

  t.add('put', '/api/budgets/:id', 'budget.edit', async (req, res) => {
    const { id } = parse(budgetParams, req.params);
    const b = parse(saveBody, req.body);
    res.json(await budgets.save(userOf(req), id, b));
  });

  t.add('patch', '/api/budgets/:id', 'template.manage', (req, res) => {
    const { id } = parse(budgetParams, req.params);
    const b = parse(patchBody, req.body);
    res.json(budgets.setTemplate(userOf(req), id, b.isTemplate));
  });

  t.add('get', '/api/budgets/:id/versions', 'budget.read', (req, res) => {
    const { id } = parse(budgetParams, req.params);
    const q = parse(versionsQuery, req.query);
    const { rows, total } = budgets.versionsPage(id, q);
    res.set('X-Total-Count', String(total)).json(rows);
  });

  t.add('get', '/api/budgets/:id/versions/:n', 'budget.read', (req, res) => {
    const p = parse(versionParams, req.params);
    res.json(budgets.version(p.id, p.n));
  });

  t.add('get', '/api/budgets/:id/diff', 'budget.read', async (req, res) => {
    const { id } = parse(budgetParams, req.params);
    const q = parse(diffQuery, req.query);
    res.json(await budgets.diff(userOf(req), id, q.from, q.to));
  });

  t.add('post', '/api/budgets/:id/clone', 'budget.clone', async (req, res) => {
    const { id } = parse(budgetParams, req.params);
    const b = parse(cloneBody, req.body ?? {});
    res.status(201).json(await budgets.clone(userOf(req), id, b));
  });

  t.add('get', '/api/budgets/:id/export', 'budget.read', (req, res) => {
    const { id } = parse(budgetParams, req.params);
    const q = parse(exportQuery, req.query);
    const f = budgets.exportFile(id, q.version);
    res.type('application/json; charset=utf-8');
    res.attachment(f.fileName);
    res.send(serializeBudget(f.document));
  });
}
