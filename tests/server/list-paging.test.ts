import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;
let ids: Record<string, number>;

beforeAll(async () => {
  s = await startTestServer();
  const m = await s.as('metrologist');
  ids = {};
  // titles whose order differs with and without case
  for (const title of ['beta gauge', 'Alpha bath', 'charlie thermometer', 'Delta balance']) {
    ids[title] = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument(title), note: 'v1' })
        .expect(201)
    ).body.id;
  }
  // two more versions of one budget, and one budget sent back by the reviewer
  await m
    .put(`/api/budgets/${ids['beta gauge']}`)
    .send({ baseVersion: 1, document: sampleDocument('beta gauge'), note: 'v2' })
    .expect(200);
  await m
    .put(`/api/budgets/${ids['beta gauge']}`)
    .send({ baseVersion: 2, document: sampleDocument('beta gauge'), note: 'v3' })
    .expect(200);
  await m.post(`/api/budgets/${ids['Delta balance']}/transitions`).send({ to: 'in_review' }).expect(200);
  await (await s.as('reviewer')).post(`/api/budgets/${ids['Delta balance']}/transitions`).send({ to: 'draft', comment: 'state the balance class' }).expect(200);
  await m.post(`/api/budgets/${ids['charlie thermometer']}/transitions`).send({ to: 'in_review' }).expect(200);
});
afterAll(async () => {
  await s?.stop();
});

const titles = (rows: { title: string }[]) => rows.map((r) => r.title);

describe('GET /api/budgets sorted and paged by the server', () => {
  it('sorts by title without regard to case, in either order, and pages through the sorted list', async () => {
    const m = await s.as('metrologist');
    const all = await m.get('/api/budgets?sort=title&order=asc').expect(200);
    expect(titles(all.body)).toEqual(['Alpha bath', 'beta gauge', 'charlie thermometer', 'Delta balance']);
    expect(all.headers['x-total-count']).toBe('4');
    const first = await m.get('/api/budgets?sort=title&order=desc&limit=3&offset=0').expect(200);
    const second = await m.get('/api/budgets?sort=title&order=desc&limit=3&offset=3').expect(200);
    expect(titles(first.body)).toEqual(['Delta balance', 'charlie thermometer', 'beta gauge']);
    expect(titles(second.body)).toEqual(['Alpha bath']);
    expect(second.headers['x-total-count']).toBe('4');
  });

  it('orders statuses draft, returned, in review, approved, and filters the returned drafts', async () => {
    const m = await s.as('metrologist');
    const byStatus = await m.get('/api/budgets?sort=status&order=asc').expect(200);
    expect(titles(byStatus.body).slice(-2)).toEqual(['Delta balance', 'charlie thermometer']);
    const returned = await m.get('/api/budgets?status=draft&returned=true').expect(200);
    expect(titles(returned.body)).toEqual(['Delta balance']);
    expect(returned.headers['x-total-count']).toBe('1');
    const plainDrafts = await m.get('/api/budgets?status=draft&returned=false&sort=title&order=asc').expect(200);
    expect(titles(plainDrafts.body)).toEqual(['Alpha bath', 'beta gauge']);
  });

  it('sorts by current version and keeps the newest change first by default', async () => {
    const m = await s.as('metrologist');
    const byVersion = await m.get('/api/budgets?sort=version&order=desc&limit=1').expect(200);
    expect(titles(byVersion.body)).toEqual(['beta gauge']);
    const newest = await m.get('/api/budgets?limit=1').expect(200);
    // the last change was the submission of "charlie thermometer"
    expect(titles(newest.body)).toEqual(['charlie thermometer']);
  });

  it.each([
    ['an unknown sort column', 'sort=colour', 'sort'],
    ['an unknown order', 'order=up', 'order'],
    ['a page of no rows', 'limit=0', 'limit'],
    ['a page beyond the largest', 'limit=1001', 'limit'],
    ['a negative offset', 'offset=-1', 'offset'],
    ['returned neither true nor false', 'returned=maybe', 'returned'],
  ])('refuses %s with 400 naming the field', async (_what, query, field) => {
    const m = await s.as('metrologist');
    const r = await m.get(`/api/budgets?${query}`).expect(400);
    expect(r.body.error.field).toBe(field);
  });
});

describe('GET /api/budgets/:id/versions paged by the server', () => {
  it('gives a page of versions in either order with the count of all in X-Total-Count', async () => {
    const m = await s.as('metrologist');
    const id = ids['beta gauge'];
    const whole = await m.get(`/api/budgets/${id}/versions`).expect(200);
    expect(whole.body.map((v: { number: number }) => v.number)).toEqual([1, 2, 3]);
    expect(whole.headers['x-total-count']).toBe('3');
    const newest = await m.get(`/api/budgets/${id}/versions?order=desc&limit=2`).expect(200);
    expect(newest.body.map((v: { number: number; note: string }) => [v.number, v.note])).toEqual([
      [3, 'v3'],
      [2, 'v2'],
    ]);
    expect(newest.headers['x-total-count']).toBe('3');
    const rest = await m.get(`/api/budgets/${id}/versions?order=desc&limit=2&offset=2`).expect(200);
    expect(rest.body.map((v: { number: number }) => v.number)).toEqual([1]);
  });

  it.each([
    ['limit=1001', 'limit'],
    ['limit=0', 'limit'],
    ['offset=-3', 'offset'],
    ['order=sideways', 'order'],
    ['sort=number', undefined],
  ])('refuses %s with 400', async (query, field) => {
    const m = await s.as('metrologist');
    const r = await m.get(`/api/budgets/${ids['beta gauge']}/versions?${query}`).expect(400);
    expect(r.body.error.field).toBe(field);
  });
});

describe('GET /api/users paged, sorted and filtered by the server', () => {
  it('sorts by e-mail, pages, and counts every match in X-Total-Count', async () => {
    const admin = await s.as('admin');
    const first = await admin.get('/api/users?sort=email&order=desc&limit=2').expect(200);
    expect(first.body.map((u: { email: string }) => u.email)).toEqual(['trainee@lab.test', 'reviewer@lab.test']);
    expect(first.headers['x-total-count']).toBe('5');
    const last = await admin.get('/api/users?sort=email&order=desc&limit=2&offset=4').expect(200);
    expect(last.body.map((u: { email: string }) => u.email)).toEqual(['admin@lab.test']);
  });

  it('filters by part of the name or address and by role', async () => {
    const admin = await s.as('admin');
    const found = await admin.get('/api/users?q=REVIEW').expect(200);
    expect(found.body.map((u: { email: string }) => u.email)).toEqual(['reviewer@lab.test']);
    expect(found.headers['x-total-count']).toBe('1');
    // a LIKE wildcard typed into the search is a plain character
    await admin.get('/api/users?q=%25').expect(200).expect('x-total-count', '0');
    const auditors = await admin.get('/api/users?role=auditor').expect(200);
    expect(auditors.body.map((u: { role: string }) => u.role)).toEqual(['auditor']);
  });

  it.each([
    ['sort=password', 'sort'],
    ['limit=0', 'limit'],
    ['limit=1001', 'limit'],
    ['role=boss', 'role'],
  ])('refuses %s with 400 naming the field', async (query, field) => {
    const admin = await s.as('admin');
    const r = await admin.get(`/api/users?${query}`).expect(400);
    expect(r.body.error.field).toBe(field);
  });
});

describe('GET /api/audit', () => {
  it('sends the number of matching events in X-Total-Count as in the body', async () => {
    const auditor = await s.as('auditor');
    const r = await auditor.get(`/api/audit?budget=${ids['beta gauge']}&limit=1`).expect(200);
    expect(r.body.events).toHaveLength(1);
    // created and two saves
    expect(r.body.total).toBe(3);
    expect(r.headers['x-total-count']).toBe('3');
  });
});

describe('GET /api/audit in either order', () => {
  it('gives the oldest events first with order=asc and refuses another order', async () => {
    const auditor = await s.as('auditor');
    const oldest = await auditor.get(`/api/audit?budget=${ids['beta gauge']}&order=asc`).expect(200);
    expect(oldest.body.events.map((e: { action: string }) => e.action)).toEqual(['budget.created', 'budget.version_saved', 'budget.version_saved']);
    expect(oldest.body.events.map((e: { versionNumber: number }) => e.versionNumber)).toEqual([1, 2, 3]);
    const r = await auditor.get('/api/audit?order=oldest').expect(400);
    expect(r.body.error.field).toBe('order');
  });
});
