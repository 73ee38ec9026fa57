import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PNG } from './fixtures';
import { PASSWORD, sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;

beforeAll(async () => {
  s = await startTestServer();
});
afterAll(async () => {
  await s?.stop();
});

type Agent = Awaited<ReturnType<TestServer['as']>>;

/** The audit event that stored version `n` of a budget, and the version as the API lists it. */
async function stored(auditor: Agent, reader: Agent, id: number, n: number) {
  const events = (await auditor.get(`/api/audit?budget=${id}`).expect(200)).body.events as { action: string; versionNumber: number; detail: Record<string, unknown> }[];
  const event = events.find((e) => e.versionNumber === n && e.action.startsWith('budget.'));
  const version = (await reader.get(`/api/budgets/${id}/versions/${n}`).expect(200)).body;
  const budget = (await reader.get(`/api/budgets/${id}`).expect(200)).body;
  return { event, version, budget };
}

describe('every way of writing a version stores it the same way', () => {
  it('create, import, save, clone and evidence on an approved version: the budget points at the new draft and the audit event carries its SHA-256 and note', async () => {
    const m = await s.as('metrologist');
    const auditor = await s.as('auditor');

    const created = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Stored'), note: 'first' })
        .expect(201)
    ).body.id;
    await m
      .put(`/api/budgets/${created}`)
      .send({ baseVersion: 1, document: sampleDocument('Stored again'), note: 'second' })
      .expect(200);
    const imported = (
      await m
        .post('/api/budgets/import')
        .send({ document: sampleDocument('Imported'), note: 'from a file' })
        .expect(201)
    ).body.id;
    const cloned = (await m.post(`/api/budgets/${created}/clone`).send({ version: 1 }).expect(201)).body.id;

    // evidence on an approved version starts a new draft version that copies the approved one
    const evidenced = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Evidenced'), note: 'v1' })
        .expect(201)
    ).body.id;
    await m.post(`/api/budgets/${evidenced}/transitions`).send({ to: 'in_review' }).expect(200);
    await (await s.as('reviewer')).post(`/api/budgets/${evidenced}/transitions`).send({ to: 'approved', password: PASSWORD, reason: 'checked by hand' }).expect(200);
    await m.post(`/api/budgets/${evidenced}/attachments`).attach('file', PNG, { filename: 'bath.png', contentType: 'image/png' }).expect(201);

    const cases: [number, number, string, string][] = [
      [created, 1, 'budget.created', 'first'],
      [created, 2, 'budget.version_saved', 'second'],
      [imported, 1, 'budget.imported', 'from a file'],
      [cloned, 1, 'budget.cloned', `cloned from budget ${created}, version 1`],
      [evidenced, 2, 'budget.version_saved', 'evidence added: bath.png'],
    ];
    for (const [id, n, action, note] of cases) {
      const { event, version, budget } = await stored(auditor, m, id, n);
      expect(event, `${action} of budget ${id}`).toBeDefined();
      expect(event!.action).toBe(action);
      // the clone's event once left its note out; every stored version's event now names it
      expect(event!.detail).toMatchObject({ documentSha256: version.documentSha256, note });
      expect(version.note).toBe(note);
      // the budget points at its newest version, as a draft under that version's title
      if (!cases.some(([other, later]) => other === id && later > n)) {
        expect(budget).toMatchObject({ currentVersion: n, status: 'draft', title: version.document.title });
      }
    }
    // the new draft carries the approved version's document unchanged
    const v1 = (await m.get(`/api/budgets/${evidenced}/versions/1`).expect(200)).body;
    const v2 = (await m.get(`/api/budgets/${evidenced}/versions/2`).expect(200)).body;
    expect(v2.documentSha256).toBe(v1.documentSha256);
    expect(v2.seed).toBe(v1.seed);
    expect(v2.result).toEqual(v1.result);
  });
});

describe('route ids', () => {
  it('refuses an id that is not a positive whole number, saying what kind of id it must be', async () => {
    const m = await s.as('metrologist');
    const admin = await s.as('admin');
    const id = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Ids'), note: '' })
        .expect(201)
    ).body.id;
    const cases: [Agent, 'get' | 'patch', string, string, string][] = [
      [m, 'get', '/api/budgets/x', 'id', 'must be a budget id'],
      [m, 'get', `/api/budgets/${id}/versions/0`, 'n', 'must be a version number'],
      [m, 'get', `/api/budgets/${id}/versions/1.5/report.pdf`, 'n', 'must be a version number'],
      [m, 'patch', `/api/budgets/${id}/comments/abc`, 'cid', 'must be a comment id'],
      [m, 'get', `/api/budgets/${id}/attachments/-1`, 'aid', 'must be an attachment id'],
      [admin, 'patch', '/api/users/nobody', 'id', 'must be a user id'],
    ];
    for (const [agent, method, path, field, message] of cases) {
      const r = await agent[method](path).send({}).expect(400);
      expect(r.body.error, path).toMatchObject({ field, message: `${field}: ${message}` });
    }
  });
});
