import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import type { OutboxMessage } from '../../server/mail/outbox-repository';
import { PASSWORD, sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;

beforeAll(async () => {
  s = await startTestServer();
});
afterAll(async () => {
  await s?.stop();
});

interface Mail {
  recipients: string[];
  subject: string;
  text: string;
}

async function mailTo(address: string): Promise<Mail[]> {
  await s.services.mail.flush();
  const admin = await s.as('admin');
  const all = (await admin.get('/api/dev/mail').expect(200)).body as Mail[];
  return all.filter((m) => m.recipients.includes(address));
}

function tokenIn(text: string, path: string): string {
  const link = text.match(new RegExp(`(https?://\\S+${path}\\?token=)([A-Za-z0-9_-]+)`));
  expect(link, `a ${path} link in:\n${text}`).not.toBeNull();
  expect(link![1]).toBe(`http://dubito.test${path}?token=`);
  return link![2];
}

describe('mail through the in-process SMTP server', () => {
  it('sends an invitation whose link sets the password once', async () => {
    const admin = await s.as('admin');
    const inv = await admin.post('/api/invitations').send({ email: 'New.Colleague@lab.test', name: 'New Colleague', role: 'metrologist' }).expect(201);
    expect(inv.body.user).toMatchObject({ email: 'new.colleague@lab.test', role: 'metrologist', hasPassword: false });
    const [mail] = await mailTo('new.colleague@lab.test');
    expect(mail.subject).toBe('Your Dubito account');
    const token = tokenIn(mail.text, '/set-password');
    // Before the password is set, nobody can sign in to the account.
    await s.anonymous().post('/api/auth/login').send({ email: 'new.colleague@lab.test', password: 'anything at all' }).expect(401);
    const info = await s.anonymous().get(`/api/auth/token?token=${token}`).expect(200);
    expect(info.body).toEqual({ kind: 'invitation', email: 'new.colleague@lab.test', name: 'New Colleague' });
    await s.anonymous().post('/api/auth/password-reset/complete').send({ token, password: 'a fresh long password' }).expect(200);
    await s.anonymous().post('/api/auth/login').send({ email: 'new.colleague@lab.test', password: 'a fresh long password' }).expect(200);
    await s.anonymous().post('/api/auth/password-reset/complete').send({ token, password: 'another long password' }).expect(404);
    const stored = s.connection.sqlite.prepare('SELECT token_hash FROM account_tokens').all() as { token_hash: string }[];
    expect(stored.map((r) => r.token_hash)).not.toContain(token);
  });

  it('sends a password reset whose link replaces the old password; unknown addresses get the same answer', async () => {
    const email = s.users.trainee.email;
    const known = await s.anonymous().post('/api/auth/password-reset').send({ email }).expect(202);
    const unknown = await s.anonymous().post('/api/auth/password-reset').send({ email: 'ghost@lab.test' }).expect(202);
    expect(known.body).toEqual(unknown.body);
    // The reset is prepared after the answer: wait for its message.
    const [mail] = await vi.waitFor(async () => {
      const m = await mailTo(email);
      expect(m).toHaveLength(1);
      return m;
    });
    expect(await mailTo('ghost@lab.test')).toEqual([]);
    expect(mail.subject).toBe('Reset your Dubito password');
    const token = tokenIn(mail.text, '/reset-password');
    await s.anonymous().post('/api/auth/password-reset/complete').send({ token, password: 'larch pond seventeen' }).expect(200);
    await s.anonymous().post('/api/auth/login').send({ email, password: PASSWORD }).expect(401);
    await s.anonymous().post('/api/auth/login').send({ email, password: 'larch pond seventeen' }).expect(200);
  });

  it('tells reviewers about a review request and the owner about approval and return', async () => {
    const m = await s.as('metrologist');
    const r = await s.as('reviewer');
    const id = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Mailed budget'), note: '' })
        .expect(201)
    ).body.id;
    await m.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
    const requested = (await mailTo(s.users.reviewer.email)).filter((x) => x.subject === 'Review requested: Mailed budget');
    expect(requested).toHaveLength(1);
    expect(requested[0].text).toContain(`http://dubito.test/budgets/${id}`);
    await r.post(`/api/budgets/${id}/transitions`).send({ to: 'draft', comment: 'Please add the resolution.' }).expect(200);
    await m.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
    await r.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: PASSWORD }).expect(200);
    const toOwner = (await mailTo(s.users.metrologist.email)).map((x) => x.subject);
    expect(toOwner).toContain('Returned: Mailed budget');
    expect(toOwner).toContain('Approved: Mailed budget');
    const returned = (await mailTo(s.users.metrologist.email)).find((x) => x.subject === 'Returned: Mailed budget')!;
    expect(returned.text).toContain('Please add the resolution.');
  });
});

describe('mail through SMTP_URL', () => {
  it('hands messages to the configured server and records them in the outbox', async () => {
    const received: OutboxMessage[] = [];
    const smtp = await startFakeSmtp((m) => received.push(m));
    const t = await startTestServer({ smtpUrl: `smtp://127.0.0.1:${smtp.port}` });
    try {
      const admin = await t.as('admin');
      await admin.post('/api/invitations').send({ email: 'far@lab.test', name: 'Far Away', role: 'auditor' }).expect(201);
      expect(received).toHaveLength(1);
      expect(received[0].recipients).toEqual(['far@lab.test']);
      expect(received[0].text).toMatch(/http:\/\/dubito\.test\/set-password\?token=[A-Za-z0-9_-]{40,}/);
      const outbox = (await admin.get('/api/dev/mail').expect(200)).body as Mail[];
      expect(outbox.map((m) => m.recipients)).toEqual([['far@lab.test']]);
    } finally {
      await t.stop();
      await smtp.close();
    }
  });
});
