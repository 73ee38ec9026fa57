import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signingCaveats } from '../../server/reviews/reviews-service';
import type { BudgetResult } from '../../shared/budget/result';
import { PDF, PNG } from './fixtures';
import { PASSWORD, sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;
let seq = 0;

beforeAll(async () => {
  s = await startTestServer();
});
afterAll(async () => {
  await s?.stop();
});

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

async function draft(): Promise<number> {
  return (await s.services.budgets.create(s.users.metrologist, { document: sampleDocument(`Review ${++seq}`), note: 'v1' })).id;
}

async function submitted(): Promise<number> {
  const id = await draft();
  await (await s.as('metrologist')).post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
  return id;
}

async function approved(): Promise<number> {
  const id = await submitted();
  await (await s.as('reviewer')).post(`/api/budgets/${id}/transitions`).send({ to: 'approved', password: PASSWORD, reason: 'validated by hand' }).expect(200);
  return id;
}

function attach(agent: Awaited<ReturnType<TestServer['as']>>, id: number, file: Buffer, name: string, symbol?: string) {
  let r = agent.post(`/api/budgets/${id}/attachments`);
  if (symbol !== undefined) r = r.field('symbol', symbol);
  return r.attach('file', file, { filename: name, contentType: name.endsWith('.pdf') ? 'application/pdf' : 'image/png' });
}

describe('evidence is part of the version record', () => {
  it('refuses a symbol that is not an input of the version, "__proto__" included, and stores nothing', async () => {
    const id = await draft();
    const m = await s.as('metrologist');
    for (const symbol of ['__proto__', 'y', 'zz']) {
      const r = await attach(m, id, PDF, 'cert.pdf', symbol).expect(400);
      expect(r.body.error.field).toBe('symbol');
      expect(r.body.error.message).toContain(`"${symbol}" is not an input quantity of version 1`);
    }
    expect((await m.get(`/api/budgets/${id}/attachments`).expect(200)).body).toEqual([]);
  });

  it('attaches to the current draft version with its SHA-256, uploader and version', async () => {
    const id = await draft();
    const m = await s.as('metrologist');
    const r = await attach(m, id, PDF, 'reference certificate.pdf', 'a').expect(201);
    expect(r.body).toMatchObject({ versionNumber: 1, symbol: 'a', size: PDF.length, sha256: sha256(PDF), uploaderName: 'Test metrologist', newVersion: false });
    const budget = (await m.get(`/api/budgets/${id}`).expect(200)).body;
    expect(budget.currentVersion).toBe(1);
    const file = await m.get(`/api/budgets/${id}/attachments/${r.body.id}`).buffer(true).expect(200);
    expect(file.headers['x-content-sha256']).toBe(sha256(PDF));
  });

  it('never changes an approved version: new evidence makes a new draft version with the same document', async () => {
    const id = await approved();
    const m = await s.as('metrologist');
    const before = (await m.get(`/api/budgets/${id}/versions/1`).expect(200)).body;
    const r = await attach(m, id, PNG, 'thermometer.png', 'b').expect(201);
    expect(r.body).toMatchObject({ versionNumber: 2, newVersion: true, symbol: 'b' });
    const budget = (await m.get(`/api/budgets/${id}`).expect(200)).body;
    expect(budget).toMatchObject({ status: 'draft', currentVersion: 2, approvedVersion: 1 });
    expect(budget.version.documentSha256).toBe(before.documentSha256);
    expect(budget.version.note).toBe('evidence added: thermometer.png');
    const v1 = (await m.get(`/api/budgets/${id}/versions/1`).expect(200)).body;
    expect(v1.approvedAt).toBe(before.approvedAt);
    // the approved version's evidence is what it was when it was signed
    expect((await m.get(`/api/budgets/${id}/attachments?version=1`).expect(200)).body).toEqual([]);
    expect((await m.get(`/api/budgets/${id}/attachments?version=2`).expect(200)).body.map((a: { fileName: string }) => a.fileName)).toEqual(['thermometer.png']);
    // a second file on the new draft stays on it
    const again = await attach(m, id, PDF, 'second.pdf').expect(201);
    expect(again.body).toMatchObject({ versionNumber: 2, newVersion: false, symbol: null });
  });

  it('takes no evidence while the budget is in review, and no rows are ever rewritten', async () => {
    const id = await submitted();
    const r = await attach(await s.as('metrologist'), id, PDF, 'late.pdf').expect(409);
    expect(r.body.error.code).toBe('in_review');
    expect(() => s.connection.sqlite.prepare('UPDATE attachments SET symbol = NULL').run()).toThrow(/append-only/);
  });
});

describe('signing shows what is signed and asks why when it should', () => {
  it('asks for a reason to approve over open threads, stores it with the signature and in the audit trail', async () => {
    const id = await submitted();
    const r = await s.as('reviewer');
    await r.post(`/api/budgets/${id}/comments`).send({ version: 1, symbol: 'b', body: 'Where does the half-width of b come from?' }).expect(201);
    const state = (await r.get(`/api/budgets/${id}/review`).expect(200)).body;
    expect(state.openThreads.map((c: { body: string }) => c.body)).toEqual(['Where does the half-width of b come from?']);
    expect(state.caveats.map((c: { code: string }) => c.code)).toContain('open_threads');
    expect(state.validation).not.toBeNull();
    const refused = await r.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', password: PASSWORD }).expect(400);
    expect(refused.body.error).toMatchObject({ code: 'reason_required', field: 'reason' });
    expect(refused.body.error.message).toContain('1 comment thread is still open');
    const blank = await r.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', password: PASSWORD, reason: '   ' }).expect(400);
    expect(blank.body.error.code).toBe('reason_required');
    await r.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', password: PASSWORD, reason: 'Half-width is from the thermometer certificate; noted for next time.' }).expect(200);
    const after = (await r.get(`/api/budgets/${id}/review`).expect(200)).body;
    expect(after.decisions).toHaveLength(1);
    expect(after.decisions[0]).toMatchObject({
      decision: 'approved',
      versionNumber: 1,
      actorName: 'Test reviewer',
      reason: 'Half-width is from the thermometer certificate; noted for next time.',
      openThreads: 1,
    });
    const audit = (await (await s.as('auditor')).get(`/api/audit?budget=${id}&action=budget.approved`).expect(200)).body;
    const detail = audit.events[0].detail;
    expect(detail).toMatchObject({ reason: 'Half-width is from the thermometer certificate; noted for next time.', openThreads: 1 });
    expect(() => s.connection.sqlite.prepare('UPDATE review_decisions SET reason = NULL').run()).toThrow(/append-only/);
  });

  it('lists the evidence with its SHA-256 and what changed since the version the reviewer last commented on', async () => {
    const id = await draft();
    const m = await s.as('metrologist');
    const r = await s.as('reviewer');
    await r.post(`/api/budgets/${id}/comments`).send({ version: 1, symbol: 'a', body: 'u(a) looks small.' }).expect(201);
    const doc = sampleDocument(`Review ${seq}`);
    doc.inputs[0]!.distribution = { kind: 'normal', value: 100, u: 0.003 };
    await m.put(`/api/budgets/${id}`).send({ baseVersion: 1, document: doc, note: 'u(a) from the new certificate' }).expect(200);
    await attach(m, id, PDF, 'new certificate.pdf', 'a').expect(201);
    await m.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
    const state = (await r.get(`/api/budgets/${id}/review`).expect(200)).body;
    expect(state.baseline).toEqual({ version: 1, basis: 'seen' });
    // the figures shown for signing are the stored ones of the current version
    const stored = (await r.get(`/api/budgets/${id}`).expect(200)).body;
    expect(state.result.gum.expandedUncertainty).toBe(stored.result.gum.expandedUncertainty);
    expect(state.documentSha256).toBe(stored.version.documentSha256);
    expect(state.changes.inputs.changed).toEqual([{ key: 'a', changes: [{ field: 'distribution.u', from: 0.002, to: 0.003 }] }]);
    expect(state.evidence).toEqual([expect.objectContaining({ fileName: 'new certificate.pdf', symbol: 'a', sha256: sha256(PDF), versionNumber: 2 })]);
    // another reviewer never commented: nothing approved yet, so no baseline
    expect((await (await s.as('admin')).get(`/api/budgets/${id}/review`).expect(200)).body.baseline).toBeNull();
  });
});

describe('returns, threads and the queue', () => {
  it('shows the author who returned the budget, when and why, until it is submitted again', async () => {
    const id = await submitted();
    await (await s.as('reviewer')).post(`/api/budgets/${id}/transitions`).send({ to: 'draft', comment: 'Add the temperature input.' }).expect(200);
    const m = await s.as('metrologist');
    const state = (await m.get(`/api/budgets/${id}/review`).expect(200)).body;
    expect(state.lastReturn).toMatchObject({ decision: 'returned', actorName: 'Test reviewer', reason: 'Add the temperature input.', versionNumber: 1 });
    expect(typeof state.lastReturn.at).toBe('number');
    await m.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
    expect((await m.get(`/api/budgets/${id}/review`).expect(200)).body.lastReturn).toBeNull();
  });

  it('resolves a whole thread with who and when, and a new reply opens it again', async () => {
    const id = await draft();
    const r = await s.as('reviewer');
    const m = await s.as('metrologist');
    const root = (await r.post(`/api/budgets/${id}/comments`).send({ version: 1, symbol: 'c', body: 'Is c dimensionless?' }).expect(201)).body;
    const reply = (await m.post(`/api/budgets/${id}/comments`).send({ version: 1, parentId: root.id, body: 'Yes, a ratio.' }).expect(201)).body;
    await m.patch(`/api/budgets/${id}/comments/${reply.id}`).send({ resolved: true }).expect(200);
    const list = (await r.get(`/api/budgets/${id}/comments`).expect(200)).body as { resolved: boolean; resolvedByName: string; resolvedAt: number }[];
    expect(list.map((c) => [c.resolved, c.resolvedByName])).toEqual([
      [true, 'Test metrologist'],
      [true, 'Test metrologist'],
    ]);
    expect(list.every((c) => typeof c.resolvedAt === 'number')).toBe(true);
    expect((await r.get(`/api/budgets/${id}/review`).expect(200)).body.openThreads).toEqual([]);
    await r.post(`/api/budgets/${id}/comments`).send({ version: 1, parentId: root.id, body: 'Then say so in its description.' }).expect(201);
    const reopened = (await r.get(`/api/budgets/${id}/comments`).expect(200)).body as { resolved: boolean; resolvedBy: number | null }[];
    expect(reopened.map((c) => c.resolved)).toEqual([false, false, false]);
    expect(reopened.every((c) => c.resolvedBy === null)).toBe(true);
  });

  it('queues in-review budgets for the reviewers who may approve them, with their open threads', async () => {
    const id = await submitted();
    await (await s.as('admin')).post(`/api/budgets/${id}/comments`).send({ version: 1, body: 'General remark.' }).expect(201);
    const queue = (await (await s.as('reviewer')).get('/api/reviews/queue').expect(200)).body as { budgetId: number; openThreads: number; authorName: string }[];
    expect(queue.find((q) => q.budgetId === id)).toMatchObject({ openThreads: 1, authorName: 'Test metrologist', version: 1 });
    // a budget its reviewer wrote is not in that reviewer's queue
    const own = (await s.services.budgets.create(s.users.admin, { document: sampleDocument('Admin own'), note: '' })).id;
    await s.services.reviews.transition(s.users.admin, own, { to: 'in_review' });
    const adminQueue = (await (await s.as('admin')).get('/api/reviews/queue').expect(200)).body as { budgetId: number }[];
    expect(adminQueue.map((q) => q.budgetId)).not.toContain(own);
    expect((await (await s.as('reviewer')).get('/api/reviews/queue').expect(200)).body.map((q: { budgetId: number }) => q.budgetId)).toContain(own);
    await (await s.as('metrologist')).get('/api/reviews/queue').expect(403);
  });
});

describe('when signing needs a reason', () => {
  const result = (validation: BudgetResult['validation']) => ({ validation }) as BudgetResult;
  const v = { significantDigits: 2, tolerance: 5e-5, dLow: 1e-5, dHigh: 2e-5 };

  it('needs none for a validated result without open threads', () => {
    expect(signingCaveats(0, result({ ...v, passed: true, verdict: 'validated' }))).toEqual([]);
  });

  it('names each cause: open threads, a failed, inconclusive or impossible validation, or none at all', () => {
    expect(signingCaveats(3, result({ ...v, passed: true, verdict: 'validated' })).map((c) => c.message)).toEqual(['3 comment threads are still open']);
    expect(signingCaveats(0, result({ ...v, passed: false, verdict: 'not-validated' })).map((c) => c.code)).toEqual(['not_validated']);
    expect(signingCaveats(0, result({ ...v, passed: false, verdict: 'inconclusive', reason: 'the numerical tolerance of the Monte Carlo interval is of the size of δ' }))[0]).toEqual({
      code: 'inconclusive',
      message: 'the validation by the Monte Carlo method is inconclusive: the numerical tolerance of the Monte Carlo interval is of the size of δ',
    });
    expect(signingCaveats(1, result({ ...v, passed: false, verdict: 'not-possible' })).map((c) => c.code)).toEqual(['open_threads', 'not_possible']);
    expect(signingCaveats(0, result(null)).map((c) => c.code)).toEqual(['no_monte_carlo']);
    // results stored before verdicts existed carry only `passed`
    expect(signingCaveats(0, result({ ...v, passed: false })).map((c) => c.code)).toEqual(['not_validated']);
    expect(signingCaveats(0, result({ ...v, passed: true }))).toEqual([]);
  });

  it('lists evidence only of versions that exist', async () => {
    const id = await draft();
    const r = await (await s.as('auditor')).get(`/api/budgets/${id}/attachments?version=2`).expect(404);
    expect(r.body.error.message).toBe(`budget ${id} has no version 2`);
  });
});
