import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { VERSION_NOTE_MAX_LENGTH } from '../../shared/api/version-note';
import { PDF, PNG } from './fixtures';
import { sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;
let id: number;

const TABLES = ['users', 'budgets', 'budget_versions', 'comments', 'attachments', 'account_tokens', 'audit_events', 'outbox'];
function counts(): Record<string, number> {
  return Object.fromEntries(TABLES.map((t) => [t, (s.connection.sqlite.prepare(`SELECT count(*) AS n FROM ${t}`).get() as { n: number }).n]));
}

beforeAll(async () => {
  s = await startTestServer();
  id = (await s.services.budgets.create(s.users.metrologist, { document: sampleDocument(), note: 'v1' })).id;
  await s.as('metrologist');
  await s.as('admin');
  await s.as('reviewer');
});
afterAll(async () => {
  await s?.stop();
});

describe('saves on the same base', () => {
  it('lets exactly one of two concurrent saves through and answers the other 409 with the current version', async () => {
    const m = await s.as('metrologist');
    const before = counts();
    const [a, b] = await Promise.all([
      m.put(`/api/budgets/${id}`).send({ baseVersion: 1, document: sampleDocument('From tab A'), note: 'A' }),
      m.put(`/api/budgets/${id}`).send({ baseVersion: 1, document: sampleDocument('From tab B'), note: 'B' }),
    ]);
    const statuses = [a.status, b.status].sort();
    expect(statuses).toEqual([200, 409]);
    const loser = a.status === 409 ? a : b;
    const winner = a.status === 200 ? a : b;
    expect(loser.body.error).toMatchObject({ code: 'stale_version', currentVersion: 2 });
    expect(winner.body.version).toBe(2);
    const versions = (await m.get(`/api/budgets/${id}/versions`).expect(200)).body;
    expect(versions.map((v: { number: number }) => v.number)).toEqual([1, 2]);
    const v2 = (await m.get(`/api/budgets/${id}/versions/2`).expect(200)).body;
    expect(v2.note).toBe(winner === a ? 'A' : 'B');
    expect(v2.result.gum.estimate).toBeGreaterThan(0);
    expect(counts().budget_versions).toBe(before.budget_versions + 1);
    expect(counts().audit_events).toBe(before.audit_events + 1);
    // The loser retries on the new base and nothing is lost.
    await m
      .put(`/api/budgets/${id}`)
      .send({ baseVersion: 2, document: sampleDocument('From tab B, merged'), note: 'B again' })
      .expect(200);
  });

  it('stores the engine version, the seed and the SHA-256 of the canonical document with each version', async () => {
    const m = await s.as('metrologist');
    const doc = sampleDocument('Fingerprint');
    const created = await m.post('/api/budgets').send({ document: doc, note: '' }).expect(201);
    const reordered = Object.fromEntries(Object.entries(doc).reverse());
    const other = await m.post('/api/budgets').send({ document: reordered, note: '' }).expect(201);
    const v1 = (await m.get(`/api/budgets/${created.body.id}`)).body.version;
    const v2 = (await m.get(`/api/budgets/${other.body.id}`)).body.version;
    expect(v1.documentSha256).toBe(v2.documentSha256);
    expect(v1.seed).toBe('test');
    expect(v1.engineVersion).toMatch(/\S/);
    const exported = await m.get(`/api/budgets/${created.body.id}/export`).expect(200);
    expect(exported.headers['content-disposition']).toMatch(/fingerprint-v1\.json/);
    expect(JSON.parse(exported.text)).toEqual(doc);
  });

  it('caps server-side trials', async () => {
    const m = await s.as('metrologist');
    const r = await m
      .post('/api/budgets')
      .send({ document: sampleDocument('Many trials', { monteCarlo: { trials: 1_000_000, seed: 'x' } }), note: '' })
      .expect(201);
    expect(r.body.result.monteCarlo.trials).toBeLessThanOrEqual(5_000);
  });
});

describe('bad input on every route: a clear 4xx and nothing written', () => {
  it('refuses each malformed request', async () => {
    const m = await s.as('metrologist');
    const admin = await s.as('admin');
    const r = await s.as('reviewer');
    const cur = (await m.get(`/api/budgets/${id}`)).body.currentVersion as number;
    const bad: [string, () => Promise<{ status: number; body: { error?: { code: string; field?: string } } }>, number, string?][] = [
      ['login without password', () => s.anonymous().post('/api/auth/login').send({ email: 'x@lab.test' }), 400, 'password'],
      ['login with a number', () => s.anonymous().post('/api/auth/login').send({ email: 1, password: 'x' }), 400, 'email'],
      ['malformed JSON', () => m.post('/api/budgets').set('Content-Type', 'application/json').send('{"document":'), 400],
      ['create without document', () => m.post('/api/budgets').send({ note: 'x' }), 400, 'document'],
      ['create with a string document', () => m.post('/api/budgets').send({ document: 'text' }), 400, 'document'],
      ['create with an unknown field', () => m.post('/api/budgets').send({ document: sampleDocument(), colour: 'red' }), 400],
      ['create with a wrong format', () => m.post('/api/budgets').send({ document: { ...sampleDocument(), format: 'other/2' } }), 422, 'format'],
      [
        'create with a bad u',
        () => m.post('/api/budgets').send({ document: sampleDocument('x', { inputs: [{ symbol: 'a', distribution: { kind: 'normal', value: 1, u: -1 } }], model: 'y = a' }) }),
        422,
        'inputs[0].distribution.u',
      ],
      ['create with an unknown symbol', () => m.post('/api/budgets').send({ document: sampleDocument('x', { model: 'y = a + zz' }) }), 422],
      ['create a template without being admin', () => m.post('/api/budgets').send({ document: sampleDocument(), template: true }), 403],
      ['list with a bad status', () => m.get('/api/budgets?status=published'), 400, 'status'],
      ['get a budget by a word', () => m.get('/api/budgets/abc'), 400, 'id'],
      ['get a missing budget', () => m.get('/api/budgets/99999'), 404],
      ['save without baseVersion', () => m.put(`/api/budgets/${id}`).send({ document: sampleDocument() }), 400, 'baseVersion'],
      ['save on a stale base', () => m.put(`/api/budgets/${id}`).send({ baseVersion: 1, document: sampleDocument() }), 409],
      ['save an invalid document', () => m.put(`/api/budgets/${id}`).send({ baseVersion: cur, document: { ...sampleDocument(), inputs: [] } }), 422, 'inputs'],
      [
        'save with a note longer than the dialog allows',
        () => m.put(`/api/budgets/${id}`).send({ baseVersion: cur, document: sampleDocument(), note: 'x'.repeat(VERSION_NOTE_MAX_LENGTH + 1) }),
        400,
        'note',
      ],
      ['save a missing budget', () => m.put('/api/budgets/99999').send({ baseVersion: 1, document: sampleDocument() }), 404],
      ['template flag not boolean', () => admin.patch(`/api/budgets/${id}`).send({ isTemplate: 'yes' }), 400, 'isTemplate'],
      ['version zero', () => m.get(`/api/budgets/${id}/versions/0`), 400, 'n'],
      ['missing version', () => m.get(`/api/budgets/${id}/versions/999`), 404],
      ['diff without to', () => m.get(`/api/budgets/${id}/diff?from=1`), 400, 'to'],
      ['diff to a missing version', () => m.get(`/api/budgets/${id}/diff?from=1&to=999`), 404],
      ['clone a missing version', () => m.post(`/api/budgets/${id}/clone`).send({ version: 999 }), 404],
      ['export with a bad version', () => m.get(`/api/budgets/${id}/export?version=x`), 400, 'version'],
      ['import nonsense', () => m.post('/api/budgets/import').send({ document: { format: 'dubito-budget/1' } }), 422],
      ['import a file that is not JSON', () => m.post('/api/budgets/import').attach('file', Buffer.from('not json'), 'b.json'), 422],
      ['comment without body', () => m.post(`/api/budgets/${id}/comments`).send({ version: 1, body: '  ' }), 400, 'body'],
      ['comment on a missing version', () => m.post(`/api/budgets/${id}/comments`).send({ version: 999, body: 'x' }), 400, 'version'],
      ['comment on an unknown symbol', () => m.post(`/api/budgets/${id}/comments`).send({ version: 1, symbol: 'nope', body: 'x' }), 400, 'symbol'],
      ['resolve with a word', () => m.patch(`/api/budgets/${id}/comments/1`).send({ resolved: 'yes' }), 400, 'resolved'],
      ['resolve a missing comment', () => m.patch(`/api/budgets/${id}/comments/9999`).send({ resolved: true }), 404],
      ['transition to nowhere', () => m.post(`/api/budgets/${id}/transitions`).send({ to: 'published' }), 400, 'to'],
      ['approve a draft', () => r.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: 'dubito-demo' }), 409],
      ['observations without a file', () => m.post('/api/uploads/observations').send({}), 400, 'file'],
      [
        'observations from two columns without a choice',
        () => m.post('/api/uploads/observations').attach('file', Buffer.from('a,b\n1,2\n3,4\n'), { filename: 'x.csv', contentType: 'text/csv' }),
        400,
        'column',
      ],
      [
        'observations from a missing column',
        () => m.post('/api/uploads/observations').field('column', '7').attach('file', Buffer.from('1\n2\n'), { filename: 'x.csv', contentType: 'text/csv' }),
        400,
        'column',
      ],
      ['observations from a PDF', () => m.post('/api/uploads/observations').attach('file', PDF, { filename: 'x.pdf', contentType: 'application/pdf' }), 415],
      ['attachment of a wrong type', () => m.post(`/api/budgets/${id}/attachments`).attach('file', Buffer.from('hello'), { filename: 'x.txt', contentType: 'text/plain' }), 415],
      ['attachment claiming another type', () => m.post(`/api/budgets/${id}/attachments`).attach('file', PNG, { filename: 'x.pdf', contentType: 'application/pdf' }), 415],
      ['attachment with a bad symbol', () => m.post(`/api/budgets/${id}/attachments`).field('symbol', '1x').attach('file', PNG, { filename: 'x.png', contentType: 'image/png' }), 400, 'symbol'],
      ['attachment missing', () => m.get(`/api/budgets/${id}/attachments/999`), 404],
      ['audit with a bad time', () => admin.get('/api/audit?from=yesterday'), 400, 'from'],
      ['audit with an unknown filter', () => admin.get('/api/audit?colour=red'), 400],
      ['user with a bad address', () => admin.post('/api/users').send({ email: 'nope', name: 'x', role: 'trainee' }), 400, 'email'],
      ['user with an unknown role', () => admin.post('/api/users').send({ email: 'a@lab.test', name: 'x', role: 'boss' }), 400, 'role'],
      ['user with a short password', () => admin.post('/api/users').send({ email: 'b@lab.test', name: 'x', role: 'trainee', password: 'short' }), 400, 'password'],
      ['user that exists', () => admin.post('/api/users').send({ email: s.users.trainee.email, name: 'x', role: 'trainee' }), 409],
      ['empty user patch', () => admin.patch(`/api/users/${s.users.trainee.id}`).send({}), 400],
      ['admin demotes self', () => admin.patch(`/api/users/${s.users.admin.id}`).send({ role: 'trainee', reason: 'moving to the bench' }), 409],
      ['patch a missing user', () => admin.patch('/api/users/9999').send({ name: 'x' }), 404],
      ['invitation without role', () => admin.post('/api/invitations').send({ email: 'c@lab.test', name: 'x' }), 400, 'role'],
      ['reset without address', () => s.anonymous().post('/api/auth/password-reset').send({}), 400, 'email'],
      [
        'complete with a short password',
        () =>
          s
            .anonymous()
            .post('/api/auth/password-reset/complete')
            .send({ token: 'x'.repeat(43), password: 'short' }),
        400,
        'password',
      ],
      ['unknown API route', () => m.get('/api/nothing-here'), 404],
    ];
    const before = counts();
    const failures: string[] = [];
    for (const [what, run, status, field] of bad) {
      const res = await run();
      if (res.status !== status) failures.push(`${what}: ${res.status} ${JSON.stringify(res.body)}`);
      else if (typeof res.body?.error?.code !== 'string' || typeof (res.body.error as { message?: unknown }).message !== 'string') failures.push(`${what}: no error body`);
      else if (field && res.body.error.field !== field) failures.push(`${what}: field ${res.body.error.field}, want ${field}`);
      if (JSON.stringify(res.body).match(/\n\s+at |\.ts:\d+/)) failures.push(`${what}: leaks a stack trace`);
    }
    expect(failures).toEqual([]);
    const after = counts();
    // Refused sign-ins are audited; nothing else may change.
    expect({ ...after, audit_events: 0 }).toEqual({ ...before, audit_events: 0 });
    expect(after.audit_events).toBe(before.audit_events);
  });
});
