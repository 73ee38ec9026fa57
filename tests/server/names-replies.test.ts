import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { recordAudit } from '../../server/audit/audit-repository';
import { PASSWORD, sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;

beforeAll(async () => {
  s = await startTestServer();
});
afterAll(async () => {
  await s?.stop();
});

/** A budget of the metrologist, submitted and approved by the reviewer. */
async function approvedBudget(title: string): Promise<number> {
  const m = await s.as('metrologist');
  const id = (
    await m
      .post('/api/budgets')
      .send({ document: sampleDocument(title), note: '' })
      .expect(201)
  ).body.id as number;
  await m.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
  await (await s.as('reviewer')).post(`/api/budgets/${id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: PASSWORD }).expect(200);
  return id;
}

describe("people's names in payloads", () => {
  it('names the owner, the author and the approver of versions', async () => {
    const id = await approvedBudget('Named');
    const auditor = await s.as('auditor');
    const b = (await auditor.get(`/api/budgets/${id}`).expect(200)).body;
    expect(b.ownerName).toBe('Test metrologist');
    expect(b.version).toMatchObject({ authorId: s.users.metrologist.id, authorName: 'Test metrologist', approvedBy: s.users.reviewer.id, approverName: 'Test reviewer' });
    const one = (await auditor.get(`/api/budgets/${id}/versions/1`).expect(200)).body;
    expect(one).toMatchObject({ authorName: 'Test metrologist', approverName: 'Test reviewer' });
    const list = (await auditor.get(`/api/budgets/${id}/versions`).expect(200)).body;
    expect(list).toEqual([expect.objectContaining({ number: 1, authorName: 'Test metrologist', approverName: 'Test reviewer' })]);

    // a later draft has an author and no approver yet
    await (
      await s.as('metrologist')
    )
      .put(`/api/budgets/${id}`)
      .send({ baseVersion: 1, document: sampleDocument('Named 2'), note: '' })
      .expect(200);
    const after = (await auditor.get(`/api/budgets/${id}/versions`).expect(200)).body;
    expect(after[1]).toMatchObject({ number: 2, authorName: 'Test metrologist', approvedBy: null, approverName: null });
    expect((await auditor.get(`/api/budgets/${id}`).expect(200)).body.version.approverName).toBeNull();
  });

  it('names the author of each comment', async () => {
    const m = await s.as('metrologist');
    const id = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Commented'), note: '' })
        .expect(201)
    ).body.id;
    const c = (await (await s.as('reviewer')).post(`/api/budgets/${id}/comments`).send({ version: 1, symbol: 'a', body: 'Source of u(a)?' }).expect(201)).body;
    expect(c).toMatchObject({ authorId: s.users.reviewer.id, authorName: 'Test reviewer', parentId: null, symbol: 'a' });
    const resolved = (await m.patch(`/api/budgets/${id}/comments/${c.id}`).send({ resolved: true }).expect(200)).body;
    expect(resolved).toMatchObject({ resolved: true, resolvedBy: s.users.metrologist.id, authorName: 'Test reviewer' });
    const list = (await (await s.as('auditor')).get(`/api/budgets/${id}/comments`).expect(200)).body;
    expect(list).toEqual([expect.objectContaining({ id: c.id, authorName: 'Test reviewer' })]);
  });
});

describe('replies', () => {
  it('attaches a reply to its thread, and a reply to a reply to the thread root', async () => {
    const m = await s.as('metrologist');
    const r = await s.as('reviewer');
    const id = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Threads'), note: '' })
        .expect(201)
    ).body.id;
    const root = (await r.post(`/api/budgets/${id}/comments`).send({ version: 1, symbol: 'b', body: 'Why rectangular?' }).expect(201)).body;
    const reply = (await m.post(`/api/budgets/${id}/comments`).send({ version: 1, parentId: root.id, body: 'Only limits are known.' }).expect(201)).body;
    expect(reply).toMatchObject({ parentId: root.id, symbol: 'b', body: 'Only limits are known.', authorName: 'Test metrologist' });
    const nested = (await r.post(`/api/budgets/${id}/comments`).send({ version: 1, symbol: 'b', parentId: reply.id, body: 'Fine.' }).expect(201)).body;
    expect(nested.parentId).toBe(root.id);
    const list = (await r.get(`/api/budgets/${id}/comments`).expect(200)).body;
    expect(list.map((c: { id: number; parentId: number | null }) => [c.id, c.parentId])).toEqual([
      [root.id, null],
      [reply.id, root.id],
      [nested.id, root.id],
    ]);
    const created = (await (await s.as('auditor')).get(`/api/audit?budget=${id}&action=comment.created`).expect(200)).body.events;
    expect(created[0].detail).toMatchObject({ commentId: nested.id, parentId: root.id, symbol: 'b' });
  });

  it('refuses a parent of another budget, an unknown parent, a different thread and a malformed id', async () => {
    const m = await s.as('metrologist');
    const a = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('A'), note: '' })
        .expect(201)
    ).body.id;
    const b = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('B'), note: '' })
        .expect(201)
    ).body.id;
    const onA = (await m.post(`/api/budgets/${a}/comments`).send({ version: 1, body: 'on A' }).expect(201)).body;
    const other = await m.post(`/api/budgets/${b}/comments`).send({ version: 1, parentId: onA.id, body: 'x' }).expect(400);
    expect(other.body.error.field).toBe('parentId');
    const unknown = await m.post(`/api/budgets/${a}/comments`).send({ version: 1, parentId: 999_999, body: 'x' }).expect(400);
    expect(unknown.body.error.field).toBe('parentId');
    const thread = await m.post(`/api/budgets/${a}/comments`).send({ version: 1, symbol: 'a', parentId: onA.id, body: 'x' }).expect(400);
    expect(thread.body.error.field).toBe('symbol');
    for (const parentId of [0, -1, 1.5, 'one']) {
      const bad = await m.post(`/api/budgets/${a}/comments`).send({ version: 1, parentId, body: 'x' }).expect(400);
      expect(bad.body.error.field).toBe('parentId');
    }
    // nothing of the refused replies was stored
    expect((await m.get(`/api/budgets/${a}/comments`).expect(200)).body).toHaveLength(1);
    expect((await m.get(`/api/budgets/${b}/comments`).expect(200)).body).toHaveLength(0);
    // an explicit null is a new thread
    expect((await m.post(`/api/budgets/${a}/comments`).send({ version: 1, parentId: null, body: 'new' }).expect(201)).body.parentId).toBeNull();
  });
});

describe('audit trail order and list totals', () => {
  it('lists the newest event first, the later of equal times first, and pages in that order', async () => {
    const m = await s.as('metrologist');
    const id = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Ordered'), note: '' })
        .expect(201)
    ).body.id;
    const notes: number[] = [];
    for (let i = 1; i <= 3; i++)
      notes.push(
        (
          await m
            .post(`/api/budgets/${id}/comments`)
            .send({ version: 1, body: `note ${i}` })
            .expect(201)
        ).body.id,
      );
    const auditor = await s.as('auditor');
    const mine = (await auditor.get(`/api/audit?budget=${id}`).expect(200)).body.events;
    expect(mine.map((e: { action: string; detail: { commentId?: number } }) => e.detail.commentId ?? e.action)).toEqual([notes[2], notes[1], notes[0], 'budget.created']);
    const page = (await auditor.get(`/api/audit?budget=${id}&limit=2&offset=1`).expect(200)).body;
    expect(page.total).toBe(4);
    expect(page.events.map((e: { id: number }) => e.id)).toEqual(mine.slice(1, 3).map((e: { id: number }) => e.id));

    // two events of the same millisecond, and one recorded later with an earlier time
    const at = Date.now() + 60_000;
    recordAudit(s.connection.db, { actorId: null, action: 'test.tie', budgetId: id, at, detail: { n: 1 } });
    recordAudit(s.connection.db, { actorId: null, action: 'test.tie', budgetId: id, at, detail: { n: 2 } });
    recordAudit(s.connection.db, { actorId: null, action: 'test.tie', budgetId: id, at: at - 1, detail: { n: 3 } });
    const ties = (await auditor.get(`/api/audit?budget=${id}&action=test.tie`).expect(200)).body.events;
    expect(ties.map((e: { detail: { n: number } }) => e.detail.n)).toEqual([2, 1, 3]);
    const all = (await auditor.get('/api/audit?limit=10000').expect(200)).body.events;
    const keys = all.map((e: { at: number; id: number }) => [e.at, e.id]);
    expect(keys).toEqual([...keys].sort((x: number[], y: number[]) => y[0] - x[0] || y[1] - x[1]));
  });

  it('gives the number of matching budgets in X-Total-Count and keeps the array', async () => {
    const m = await s.as('metrologist');
    for (const t of ['Count zz-1', 'Count zz-2', 'Count zz-3'])
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument(t), note: '' })
        .expect(201);
    const r = await m.get('/api/budgets?q=zz-&limit=2').expect(200);
    expect(Array.isArray(r.body)).toBe(true);
    expect(r.body).toHaveLength(2);
    expect(r.headers['x-total-count']).toBe('3');
    const rest = await m.get('/api/budgets?q=zz-&limit=2&offset=2').expect(200);
    expect(rest.body).toHaveLength(1);
    expect(rest.headers['x-total-count']).toBe('3');
  });
});
