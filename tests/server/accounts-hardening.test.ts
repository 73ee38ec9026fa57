import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { loadConfig, startProblem } from '../../server/config';
import { PASSWORD, sampleDocument, startTestServer, type TestServer } from './helpers';

/** The delays' clock, moved by the tests instead of waiting. */
let now = Date.UTC(2026, 11, 2, 8, 0, 0);
let s: TestServer;

beforeAll(async () => {
  s = await startTestServer({
    trustProxy: 1,
    signIn: { windowMs: 15 * 60_000, perAddress: 10_000, freeFailures: 5, firstDelayMs: 1_000, maxDelayMs: 15 * 60_000, now: () => now },
  });
});
afterAll(async () => {
  await s?.stop();
});

const from = (ip: string) => s.anonymous().set('X-Forwarded-For', ip);

describe('failed sign-ins slow the guesser, never the owner', () => {
  it('lets the admin in from their own address after five failures elsewhere, and doubles the guesser’s wait', async () => {
    const email = s.users.admin.email;
    const guesser = '203.0.113.9';
    for (let i = 0; i < 5; i++)
      await from(guesser)
        .post('/api/auth/login')
        .send({ email, password: `guess number ${i}` })
        .expect(401);
    // The sixth attempt from the guesser waits, even with the right password...
    const waiting = await from(guesser).post('/api/auth/login').send({ email, password: PASSWORD }).expect(429);
    expect(waiting.body.error.code).toBe('rate_limited');
    expect(waiting.headers['retry-after']).toBe('1');
    // ...while the owner at another address signs in at once.
    await from('198.51.100.7').post('/api/auth/login').send({ email, password: PASSWORD }).expect(200);

    const waits: string[] = [];
    for (let i = 0; i < 3; i++) {
      now += Number(waiting.headers['retry-after']) * 1000 * 2 ** i;
      await from(guesser)
        .post('/api/auth/login')
        .send({ email, password: `more guesses ${i}` })
        .expect(401);
      waits.push(
        (
          await from(guesser)
            .post('/api/auth/login')
            .send({ email, password: `more guesses ${i}` })
            .expect(429)
        ).headers['retry-after'],
      );
    }
    // 1 s · 2^k after the k-th failure beyond the five free ones.
    expect(waits).toEqual(['2', '4', '8']);
    // Once the wait is over the right password works from there too: a delay, not a lock.
    now += 8_000;
    await from(guesser).post('/api/auth/login').send({ email, password: PASSWORD }).expect(200);
  });
});

describe('guesses sent in parallel', () => {
  it('count before the password is checked, so no more than the free ones get through', async () => {
    const email = s.users.metrologist.email;
    const answers = await Promise.all(
      Array.from({ length: 12 }, (_, i) =>
        from('203.0.113.77')
          .post('/api/auth/login')
          .send({ email, password: `parallel guess ${i}` }),
      ),
    );
    const statuses = answers.map((r) => r.status).sort();
    expect(statuses.filter((x) => x === 401)).toHaveLength(5);
    expect(statuses.filter((x) => x === 429)).toHaveLength(7);
  });
});

describe('approval signatures', () => {
  it('slows repeated wrong signatures and writes each rejection to the audit trail', async () => {
    const m = await s.as('metrologist');
    const r = await s.as('reviewer');
    const id = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Signed with care') })
        .expect(201)
    ).body.id;
    await m.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
    // the sample's short Monte Carlo run leaves its validation inconclusive; the reason keeps this test on the signature
    for (let i = 0; i < 5; i++) {
      const no = await r
        .post(`/api/budgets/${id}/transitions`)
        .send({ to: 'approved', password: `not it ${i}`, reason: 'checked by hand' })
        .expect(403);
      expect(no.body.error.code).toBe('signature_rejected');
    }
    const slowed = await r.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', password: PASSWORD, reason: 'checked by hand' }).expect(429);
    expect(slowed.headers['retry-after']).toBe('1');
    const auditor = await s.as('auditor');
    const trail = (await auditor.get(`/api/audit?budget=${id}&action=auth.signature_rejected`).expect(200)).body;
    expect(trail.events).toHaveLength(5);
    expect(trail.events[0]).toMatchObject({ actorId: s.users.reviewer.id, budgetId: id, versionNumber: 1 });
    now += 1_000;
    await r.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', password: PASSWORD, reason: 'checked by hand' }).expect(200);
  });
});

describe('password reset requests', () => {
  it('answer the same for known and unknown addresses, before any reset work is done', async () => {
    const notify = vi.spyOn(s.services.mail, 'notify').mockImplementation(() => {
      throw new Error('the mail queue is broken');
    });
    try {
      const known = await s.anonymous().post('/api/auth/password-reset').send({ email: s.users.trainee.email }).expect(202);
      const unknown = await s.anonymous().post('/api/auth/password-reset').send({ email: 'ghost@lab.test' }).expect(202);
      expect(known.body).toEqual(unknown.body);
      expect(known.headers['content-length']).toBe(unknown.headers['content-length']);
      // The work that failed ran after the answer had gone.
      await vi.waitFor(() => expect(notify).toHaveBeenCalledTimes(1));
    } finally {
      notify.mockRestore();
    }
  });
});

describe('password rules', () => {
  async function invitationToken(email: string): Promise<string> {
    const admin = await s.as('admin');
    await admin.post('/api/invitations').send({ email, name: 'Rowan Tern', role: 'metrologist' }).expect(201);
    await s.services.mail.flush();
    const mail = s.services.mail.outbox(500).find((m) => m.recipients.includes(email))!;
    return mail.text.match(/token=([A-Za-z0-9_-]+)/)![1];
  }

  it('refuses short, repeated, sequential and common passwords with the reason, and accepts a phrase', async () => {
    const token = await invitationToken('rowan.tern@lab.test');
    const tries: Record<string, RegExp> = {
      aaaaaaaaaa: /at least 12 characters \(it has 10\)/,
      aaaaaaaaaaaa: /one character repeated/,
      abcdefghijklm: /simple sequence/,
      '1234567890123': /simple sequence/,
      'P@ssw0rd2026!': /many people use/,
      'rowan tern 2026': /your name or e-mail/,
    };
    for (const [password, reason] of Object.entries(tries)) {
      const r = await s.anonymous().post('/api/auth/password-reset/complete').send({ token, password }).expect(400);
      expect(r.body.error).toMatchObject({ code: 'weak_password', field: 'password' });
      expect(r.body.error.message).toMatch(reason);
    }
    await s.anonymous().post('/api/auth/password-reset/complete').send({ token, password: 'heron gauge block wax' }).expect(200);
  });

  it('applies to accounts an admin creates with a password', async () => {
    const admin = await s.as('admin');
    const r = await admin.post('/api/users').send({ email: 'weak@lab.test', name: 'Weak Choice', role: 'auditor', password: 'qwertyuiopasdf' }).expect(400);
    expect(r.body.error.code).toBe('weak_password');
  });
});

describe('role changes and deactivation', () => {
  it('need a reason, which the audit trail keeps with the change', async () => {
    const admin = await s.as('admin');
    const u = await s.services.accounts.create(null, { email: 'mover@lab.test', name: 'Mover', role: 'trainee', password: PASSWORD });
    const no = await admin.patch(`/api/users/${u.id}`).send({ role: 'metrologist' }).expect(400);
    expect(no.body.error.field).toBe('reason');
    await admin.patch(`/api/users/${u.id}`).send({ active: false, reason: '  ' }).expect(400);
    await admin.patch(`/api/users/${u.id}`).send({ role: 'metrologist', reason: 'passed the mass comparison training' }).expect(200);
    const auditor = await s.as('auditor');
    const [e] = (await auditor.get(`/api/audit?action=user.updated&actor=${s.users.admin.id}`).expect(200)).body.events;
    expect(e.detail).toEqual({ userId: u.id, changes: { role: { from: 'trainee', to: 'metrologist' } }, reason: 'passed the mass comparison training' });
  });
});

describe('secure cookies over plain HTTP', () => {
  it('refuses to start in production without a proxy that terminates TLS, and says what to set', () => {
    const problem = startProblem(loadConfig({ NODE_ENV: 'production' }));
    expect(problem).toMatch(/DUBITO_TRUST_PROXY/);
    expect(problem).toMatch(/HTTPS|TLS/);
    expect(problem).toMatch(/DUBITO_COOKIE_SECURE=0/);
    expect(startProblem(loadConfig({ NODE_ENV: 'production', DUBITO_TRUST_PROXY: '1' }))).toBeNull();
    expect(startProblem(loadConfig({ NODE_ENV: 'production', DUBITO_COOKIE_SECURE: '0' }))).toBeNull();
    expect(startProblem(loadConfig({}))).toBeNull();
  });

  it('refuses a sign-in that did not come over HTTPS instead of answering 200 without a cookie', async () => {
    const t = await startTestServer({ cookieSecure: true, trustProxy: 1 });
    try {
      const plain = await t.anonymous().post('/api/auth/login').send({ email: t.users.admin.email, password: PASSWORD }).expect(400);
      expect(plain.body.error.code).toBe('https_required');
      expect(plain.body.error.message).toMatch(/DUBITO_TRUST_PROXY/);
      const tls = await t.anonymous().set('X-Forwarded-Proto', 'https').post('/api/auth/login').send({ email: t.users.admin.email, password: PASSWORD }).expect(200);
      expect(String(tls.headers['set-cookie'])).toMatch(/dubito\.sid=.*Secure/);
    } finally {
      await t.stop();
    }
  });
});
