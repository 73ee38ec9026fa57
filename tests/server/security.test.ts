import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ORIGIN, PASSWORD, sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;

beforeAll(async () => {
  s = await startTestServer();
});
afterAll(async () => {
  await s?.stop();
});

describe('sign-in', () => {
  it('gives the same answer for an unknown address and a wrong password', async () => {
    const unknown = await s.anonymous().post('/api/auth/login').send({ email: 'ghost@lab.test', password: 'whatever it is' }).expect(401);
    const wrong = await s.anonymous().post('/api/auth/login').send({ email: s.users.auditor.email, password: 'not the password' }).expect(401);
    expect(unknown.body).toEqual(wrong.body);
  });

  it('sets an httpOnly SameSite=Strict cookie, regenerates the session and destroys it at sign-out', async () => {
    const a = s.anonymous();
    await a.get('/api/me').expect(401);
    const first = await a.post('/api/auth/login').send({ email: s.users.reviewer.email, password: PASSWORD }).expect(200);
    const cookie = String(first.headers['set-cookie']);
    expect(cookie).toMatch(/dubito\.sid=/);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Strict/);
    const sid1 = cookie.match(/dubito\.sid=([^;]+)/)![1];
    const second = await a.post('/api/auth/login').send({ email: s.users.reviewer.email, password: PASSWORD }).expect(200);
    const sid2 = String(second.headers['set-cookie']).match(/dubito\.sid=([^;]+)/)![1];
    expect(sid2).not.toBe(sid1);
    expect((await a.get('/api/me').expect(200)).body).toEqual({ id: s.users.reviewer.id, email: s.users.reviewer.email, name: s.users.reviewer.name, role: 'reviewer' });
    await a.post('/api/auth/logout').expect(204);
    await a.get('/api/me').expect(401);
  });

  it('ends the sessions of a deactivated user', async () => {
    const u = await s.services.accounts.create(null, { email: 'leaver@lab.test', name: 'Leaver', role: 'auditor', password: PASSWORD });
    const a = s.anonymous();
    await a.post('/api/auth/login').send({ email: 'leaver@lab.test', password: PASSWORD }).expect(200);
    await a.get('/api/me').expect(200);
    s.services.accounts.update(s.users.admin, u.id, {}); // a no-op patch leaves the session alone
    await a.get('/api/me').expect(200);
    s.services.accounts.update(s.users.admin, u.id, { active: false });
    await a.get('/api/me').expect(401);
  });
});

describe('sessions and users kept in memory', () => {
  it('shows a renamed user under the new name at once', async () => {
    const u = await s.services.accounts.create(null, { email: 'renamed@lab.test', name: 'Before', role: 'auditor', password: PASSWORD });
    const a = s.anonymous();
    await a.post('/api/auth/login').send({ email: 'renamed@lab.test', password: PASSWORD }).expect(200);
    expect((await a.get('/api/me').expect(200)).body.name).toBe('Before');
    const admin = await s.as('admin');
    await admin.patch(`/api/users/${u.id}`).send({ name: 'After' }).expect(200);
    expect((await a.get('/api/me').expect(200)).body.name).toBe('After');
  });

  it('notices within a second a user deactivated and a session deleted by another connection', async () => {
    const u = await s.services.accounts.create(null, { email: 'by-hand@lab.test', name: 'By Hand', role: 'auditor', password: PASSWORD });
    const deactivated = s.anonymous();
    await deactivated.post('/api/auth/login').send({ email: 'by-hand@lab.test', password: PASSWORD }).expect(200);
    const signedOut = s.anonymous();
    const login = await signedOut.post('/api/auth/login').send({ email: s.users.metrologist.email, password: PASSWORD }).expect(200);
    const sid = decodeURIComponent(String(login.headers['set-cookie']).match(/dubito\.sid=s%3A([^.;]+)/)![1]);
    await deactivated.get('/api/me').expect(200);
    await signedOut.get('/api/me').expect(200);

    const other = new Database(s.config.dbFile);
    other.prepare('UPDATE users SET active = 0 WHERE id = ?').run(u.id);
    other.prepare('DELETE FROM http_sessions WHERE sid = ?').run(sid);
    other.close();
    // the cache looks at the database's change counter once a second: wait for that state, not for a time
    await expect.poll(async () => (await deactivated.get('/api/me')).status, { timeout: 5_000, interval: 100 }).toBe(401);
    await expect.poll(async () => (await signedOut.get('/api/me')).status, { timeout: 5_000, interval: 100 }).toBe(401);
  });
});

describe('cross-origin requests', () => {
  it('refuses state-changing requests from another origin or with no origin', async () => {
    const m = s.anonymous();
    await m.post('/api/auth/login').send({ email: s.users.metrologist.email, password: PASSWORD }).expect(200);
    const before = (s.connection.sqlite.prepare('SELECT count(*) AS n FROM budgets').get() as { n: number }).n;
    const evil = await m.post('/api/budgets').set('Origin', 'http://evil.test').send({ document: sampleDocument() }).expect(403);
    expect(evil.body.error.code).toBe('cross_origin');
    await m.post('/api/budgets').set('Origin', '').send({ document: sampleDocument() }).expect(403);
    await m.post('/api/budgets').set('Origin', 'null').send({ document: sampleDocument() }).expect(403);
    // An Origin, when sent, alone decides: the app's own Referer does not rescue "Origin: null".
    await m.post('/api/budgets').set('Origin', 'null').set('Referer', `${ORIGIN}/budgets`).send({ document: sampleDocument() }).expect(403);
    await m.post('/api/budgets').set('Origin', 'http://evil.test').set('Referer', `${ORIGIN}/budgets`).send({ document: sampleDocument() }).expect(403);
    await s.anonymous().post('/api/auth/login').set('Origin', 'http://evil.test').send({ email: s.users.admin.email, password: PASSWORD }).expect(403);
    const after = (s.connection.sqlite.prepare('SELECT count(*) AS n FROM budgets').get() as { n: number }).n;
    expect(after).toBe(before);
    // Same origin by Referer, or the host the request was sent to, is accepted.
    await m.post('/api/budgets').set('Origin', '').set('Referer', `${ORIGIN}/budgets`).send({ document: sampleDocument() }).expect(201);
    await m.post('/api/budgets').set('Origin', s.url).send({ document: sampleDocument() }).expect(201);
    // Reads are not state-changing.
    await m.get('/api/budgets').set('Origin', 'http://evil.test').expect(200);
  });
});

describe('sign-in limit per address', () => {
  it('refuses an address that fails on many accounts, and no other address', async () => {
    const s = await startTestServer({ trustProxy: 1, signIn: { windowMs: 60_000, perAddress: 4, freeFailures: 100, firstDelayMs: 1_000, maxDelayMs: 60_000 } });
    try {
      const from = (ip: string) => s.anonymous().set('X-Forwarded-For', ip);
      for (let i = 0; i < 4; i++)
        await from('203.0.113.50')
          .post('/api/auth/login')
          .send({ email: `nobody${i}@lab.test`, password: 'guess guess' })
          .expect(401);
      const refused = await from('203.0.113.50').post('/api/auth/login').send({ email: s.users.admin.email, password: PASSWORD }).expect(429);
      expect(refused.body.error.code).toBe('rate_limited');
      await from('198.51.100.20').post('/api/auth/login').send({ email: s.users.admin.email, password: PASSWORD }).expect(200);
    } finally {
      await s.stop();
    }
  });
});
