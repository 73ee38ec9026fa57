import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { ROLES, can, type Role } from '../../shared/policy/policy';
import type { RouteInfo } from '../../server/http/routes';
import { CSV, PNG } from './fixtures';
import { PASSWORD, sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;
let shared: number; // a budget owned by the metrologist, two versions
let seq = 0;

beforeAll(async () => {
  s = await startTestServer();
  const b = await s.services.budgets.create(s.users.metrologist, { document: sampleDocument('Shared'), note: 'v1' });
  await s.services.budgets.save(s.users.metrologist, b.id, { baseVersion: 1, document: sampleDocument('Shared v2'), note: 'v2' });
  shared = b.id;
});
afterAll(async () => {
  await s?.stop();
});

interface Prepared {
  url: string;
  body?: unknown;
  file?: { field: string; data: Buffer; name: string; type: string; fields?: Record<string, string> };
  /** Use a fresh signed-in client (the route ends the session). */
  fresh?: boolean;
  ok: number;
}

type Case = (role: Role | null) => Promise<Prepared> | Prepared;

/** A draft owned by `role` (or by the metrologist when the role cannot own budgets). */
async function ownDraft(role: Role | null): Promise<number> {
  const owner = role && can(role, 'budget.create') ? s.users[role] : s.users.metrologist;
  return (await s.services.budgets.create(owner, { document: sampleDocument(`Own ${++seq}`), note: '' })).id;
}

const cases: Record<string, Case> = {
  'get /api/health': () => ({ url: '/api/health', ok: 200 }),
  'post /api/auth/login': () => ({ url: '/api/auth/login', body: { email: s.users.trainee.email, password: PASSWORD }, fresh: true, ok: 200 }),
  'post /api/auth/logout': () => ({ url: '/api/auth/logout', fresh: true, ok: 204 }),
  'get /api/me': () => ({ url: '/api/me', ok: 200 }),
  'get /api/config': () => ({ url: '/api/config', ok: 200 }),
  'post /api/auth/password-reset': () => ({ url: '/api/auth/password-reset', body: { email: 'nobody@lab.test' }, ok: 202 }),
  'get /api/auth/token': () => ({ url: '/api/auth/token?token=not-a-real-token-at-all', ok: 404 }),
  'post /api/auth/password-reset/complete': () => ({
    url: '/api/auth/password-reset/complete',
    body: { token: 'not-a-real-token-at-all', password: 'long enough password' },
    ok: 404,
  }),
  'get /api/users': () => ({ url: '/api/users', ok: 200 }),
  'post /api/users': () => ({ url: '/api/users', body: { email: `new${++seq}@lab.test`, name: 'New', role: 'trainee' }, ok: 201 }),
  'patch /api/users/:id': () => ({ url: `/api/users/${s.users.auditor.id}`, body: { name: `Auditor ${++seq}` }, ok: 200 }),
  'post /api/invitations': () => ({ url: '/api/invitations', body: { email: `inv${++seq}@lab.test`, name: 'Invitee', role: 'reviewer' }, ok: 201 }),
  'get /api/budgets': () => ({ url: '/api/budgets?status=draft', ok: 200 }),
  'get /api/templates': () => ({ url: '/api/templates', ok: 200 }),
  'post /api/budgets': () => ({ url: '/api/budgets', body: { document: sampleDocument('Created'), note: 'n' }, ok: 201 }),
  'post /api/budgets/import': () => ({ url: '/api/budgets/import', body: sampleDocument('Imported'), ok: 201 }),
  'get /api/budgets/:id': () => ({ url: `/api/budgets/${shared}`, ok: 200 }),
  'put /api/budgets/:id': async (role) => ({
    url: `/api/budgets/${await ownDraft(role)}`,
    body: { baseVersion: 1, document: sampleDocument('Edited'), note: 'edit' },
    ok: 200,
  }),
  'patch /api/budgets/:id': async (role) => ({ url: `/api/budgets/${await ownDraft(role)}`, body: { isTemplate: true }, ok: 200 }),
  'get /api/budgets/:id/versions': () => ({ url: `/api/budgets/${shared}/versions`, ok: 200 }),
  'get /api/budgets/:id/versions/:n': () => ({ url: `/api/budgets/${shared}/versions/2`, ok: 200 }),
  'get /api/budgets/:id/report.pdf': () => ({ url: `/api/budgets/${shared}/report.pdf`, ok: 200 }),
  'get /api/budgets/:id/versions/:n/report.pdf': () => ({ url: `/api/budgets/${shared}/versions/1/report.pdf`, ok: 200 }),
  'get /api/budgets/:id/diff': () => ({ url: `/api/budgets/${shared}/diff?from=1&to=2`, ok: 200 }),
  'post /api/budgets/:id/clone': () => ({ url: `/api/budgets/${shared}/clone`, body: {}, ok: 201 }),
  'get /api/budgets/:id/export': () => ({ url: `/api/budgets/${shared}/export`, ok: 200 }),
  'get /api/budgets/:id/comments': () => ({ url: `/api/budgets/${shared}/comments`, ok: 200 }),
  'post /api/budgets/:id/comments': () => ({ url: `/api/budgets/${shared}/comments`, body: { version: 2, symbol: 'a', body: 'Check a.' }, ok: 201 }),
  'patch /api/budgets/:id/comments/:cid': (role) => {
    const author = role && can(role, 'comment.create') ? s.users[role] : s.users.reviewer;
    const c = s.services.reviews.addComment(author, shared, { version: 1, body: 'to resolve' });
    return { url: `/api/budgets/${shared}/comments/${c.id}`, body: { resolved: true }, ok: 200 };
  },
  'get /api/budgets/:id/review': () => ({ url: `/api/budgets/${shared}/review`, ok: 200 }),
  'get /api/reviews/queue': () => ({ url: '/api/reviews/queue', ok: 200 }),
  'post /api/budgets/:id/transitions': async (role) => {
    if (role === 'reviewer') {
      const id = await ownDraft('metrologist');
      await s.services.reviews.transition(s.users.metrologist, id, { to: 'in_review' });
      return { url: `/api/budgets/${id}/transitions`, body: { to: 'approved', reason: 'the open points are minor', password: PASSWORD }, ok: 200 };
    }
    return { url: `/api/budgets/${await ownDraft(role)}/transitions`, body: { to: 'in_review' }, ok: 200 };
  },
  'post /api/uploads/observations': () => ({
    url: '/api/uploads/observations',
    file: { field: 'file', data: CSV, name: 'readings.csv', type: 'text/csv', fields: { column: 'reading_mm' } },
    ok: 200,
  }),
  'get /api/budgets/:id/attachments': () => ({ url: `/api/budgets/${shared}/attachments`, ok: 200 }),
  'post /api/budgets/:id/attachments': async (role) => ({
    url: `/api/budgets/${await ownDraft(role)}/attachments`,
    file: { field: 'file', data: PNG, name: 'certificate.png', type: 'image/png', fields: { symbol: 'a' } },
    ok: 201,
  }),
  'get /api/budgets/:id/attachments/:aid': () => {
    const a = s.services.attachments.add(s.users.metrologist, shared, { originalname: 'c.png', mimetype: 'image/png', buffer: PNG, size: PNG.length }, null);
    return { url: `/api/budgets/${shared}/attachments/${a.id}`, ok: 200 };
  },
  'get /api/audit': () => ({ url: '/api/audit?action=budget', ok: 200 }),
  'get /api/audit/verify': () => ({ url: '/api/audit/verify', ok: 200 }),
  'get /api/dev/mail': () => ({ url: '/api/dev/mail', ok: 200 }),
};

function expected(route: RouteInfo, role: Role | null, ok: number): number {
  if (route.access === 'public') return ok;
  if (!role) return 401;
  if (route.access === 'signed-in') return ok;
  return can(role, route.access) ? ok : 403;
}

async function send(route: RouteInfo, role: Role | null, p: Prepared): Promise<request.Response> {
  let agent = await s.as(role);
  if (p.fresh) {
    agent = s.anonymous();
    if (role) await agent.post('/api/auth/login').send({ email: s.users[role].email, password: PASSWORD }).expect(200);
  }
  let req = agent[route.method](p.url);
  if (p.file) {
    for (const [k, v] of Object.entries(p.file.fields ?? {})) req = req.field(k, v);
    return req.attach(p.file.field, p.file.data, { filename: p.file.name, contentType: p.file.type });
  }
  return p.body === undefined ? req : req.send(p.body as object);
}

describe('route × role matrix from the policy map', () => {
  it('has a case for every registered route', () => {
    const missing = s.routes.map((r) => `${r.method} ${r.path}`).filter((k) => !cases[k]);
    expect(missing).toEqual([]);
    expect(s.routes.length).toBeGreaterThanOrEqual(30);
    // Every case still names a registered route, so a renamed route cannot leave its case behind untested.
    const registered = new Set(s.routes.map((r) => `${r.method} ${r.path}`));
    expect(Object.keys(cases).filter((k) => !registered.has(k))).toEqual([]);
    expect([...registered]).toEqual(expect.arrayContaining(['get /api/config', 'get /api/audit/verify', 'get /api/budgets/:id/review', 'get /api/reviews/queue']));
  });

  it('answers every route for every role and for anonymous as the policy says', async () => {
    const failures: string[] = [];
    for (const route of s.routes) {
      for (const role of [...ROLES, null]) {
        const p = await cases[`${route.method} ${route.path}`](role);
        const res = await send(route, role, p);
        const want = expected(route, role, p.ok);
        if (res.status !== want) {
          failures.push(`${route.method.toUpperCase()} ${route.path} as ${role ?? 'anonymous'}: ${res.status} (want ${want}) ${JSON.stringify(res.body).slice(0, 200)}`);
        }
        if (res.status >= 400 && res.type === 'application/json') {
          expect(typeof res.body.error?.code).toBe('string');
          expect(JSON.stringify(res.body)).not.toMatch(/\n\s+at |\.ts:\d+/);
        }
      }
    }
    expect(failures).toEqual([]);
  });
});

describe('rules beyond the role', () => {
  it('nobody approves a budget they own or wrote', async () => {
    const admin = await s.as('admin');
    const created = await admin
      .post('/api/budgets')
      .send({ document: sampleDocument('Admin own'), note: '' })
      .expect(201);
    const id = created.body.id;
    await admin.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
    const own = await admin.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: PASSWORD }).expect(403);
    expect(own.body.error.message).toMatch(/own or wrote/);
    const reviewer = await s.as('reviewer');
    const bad = await reviewer.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: 'wrong password' }).expect(403);
    expect(bad.body.error.code).toBe('signature_rejected');
    expect((await admin.get(`/api/budgets/${id}`)).body.status).toBe('in_review');
    await reviewer.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: PASSWORD }).expect(200);
    const after = (await admin.get(`/api/budgets/${id}/versions/1`)).body;
    expect(after.approvedBy).toBe(s.users.reviewer.id);
  });

  it('the author of the version under review cannot approve it even when someone else owns the budget', async () => {
    const admin = await s.as('admin');
    const t = await admin
      .post('/api/budgets')
      .send({ document: sampleDocument('Template'), note: '', template: true })
      .expect(201);
    // A second admin owns nothing here but wrote nothing either; the author (first admin) may not sign.
    const other = await s.services.accounts.create(null, { email: 'admin2@lab.test', name: 'Second admin', role: 'admin', password: PASSWORD });
    await s.services.budgets.save(other, t.body.id, { baseVersion: 1, document: sampleDocument('Template v2'), note: 'by admin 2' });
    await admin.post(`/api/budgets/${t.body.id}/transitions`).send({ to: 'in_review' }).expect(200);
    const a2 = s.anonymous();
    await a2.post('/api/auth/login').send({ email: 'admin2@lab.test', password: PASSWORD }).expect(200);
    await a2.post(`/api/budgets/${t.body.id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: PASSWORD }).expect(403);
  });

  it('trainees edit only their own drafts and never approve', async () => {
    const trainee = await s.as('trainee');
    await trainee.put(`/api/budgets/${shared}`).send({ baseVersion: 2, document: sampleDocument(), note: '' }).expect(403);
    const own = await trainee
      .post('/api/budgets')
      .send({ document: sampleDocument('Trainee'), note: '' })
      .expect(201);
    const id = own.body.id;
    await trainee
      .put(`/api/budgets/${id}`)
      .send({ baseVersion: 1, document: sampleDocument('Trainee 2'), note: '' })
      .expect(200);
    await trainee.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
    await trainee
      .put(`/api/budgets/${id}`)
      .send({ baseVersion: 2, document: sampleDocument('Trainee 3'), note: '' })
      .expect(403);
    const reviewer = await s.as('reviewer');
    await reviewer.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: PASSWORD }).expect(200);
    // Approved: a trainee may not start a new draft from it; a metrologist owner could.
    await trainee
      .put(`/api/budgets/${id}`)
      .send({ baseVersion: 2, document: sampleDocument('Trainee 3'), note: '' })
      .expect(403);
    const other = await s.services.budgets.create(s.users.metrologist, { document: sampleDocument('M'), note: '' });
    await s.services.reviews.transition(s.users.metrologist, other.id, { to: 'in_review' });
    await trainee.post(`/api/budgets/${other.id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: PASSWORD }).expect(403);
  });

  it('editing an approved budget makes a new draft and keeps the approved version', async () => {
    const m = await s.as('metrologist');
    const id = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('To approve'), note: '' })
        .expect(201)
    ).body.id;
    await m.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
    await m
      .put(`/api/budgets/${id}`)
      .send({ baseVersion: 1, document: sampleDocument('x'), note: '' })
      .expect(409);
    const r = await s.as('reviewer');
    await r.post(`/api/budgets/${id}/transitions`).send({ to: 'draft' }).expect(400);
    await r.post(`/api/budgets/${id}/transitions`).send({ to: 'draft', comment: 'Add the resolution term.' }).expect(200);
    expect((await m.get(`/api/budgets/${id}`)).body.returned).toBe(true);
    await m.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
    await r.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: PASSWORD }).expect(200);
    const approved = (await m.get(`/api/budgets/${id}/versions/1`)).body;
    await m
      .put(`/api/budgets/${id}`)
      .send({ baseVersion: 1, document: sampleDocument('After approval'), note: 'next' })
      .expect(200);
    const b = (await m.get(`/api/budgets/${id}`)).body;
    expect(b).toMatchObject({ status: 'draft', currentVersion: 2, approvedVersion: 1 });
    const again = (await m.get(`/api/budgets/${id}/versions/1`)).body;
    expect(again).toEqual(approved);
    // The database itself refuses to rewrite a stored version.
    expect(() => s.connection.sqlite.prepare('UPDATE budget_versions SET document = ? WHERE budget_id = ?').run('{}', id)).toThrow(/append-only/);
    expect(() => s.connection.sqlite.prepare('DELETE FROM audit_events').run()).toThrow(/append-only/);
  });
});
