import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;
beforeAll(async () => {
  s = await startTestServer();
});
afterAll(async () => {
  await s.stop();
});

describe('a budget goes from draft to approved', () => {
  it('creates, saves, reviews and approves', async () => {
    const m = await s.as('metrologist');
    const created = await m.post('/api/budgets').send({ document: sampleDocument(), note: 'first' }).expect(201);
    expect(created.body.version).toBe(1);
    expect(created.body.result.gum.estimate).toBeCloseTo(100.01, 6);
    const id = created.body.id;
    const got = await m.get(`/api/budgets/${id}`).expect(200);
    expect(got.body.document.title).toBe('Length of a test bar');
    expect(got.body.version.documentSha256).toMatch(/^[0-9a-f]{64}$/);
    const saved = await m
      .put(`/api/budgets/${id}`)
      .send({ baseVersion: 1, document: sampleDocument('Length v2'), note: 'second' })
      .expect(200);
    expect(saved.body.version).toBe(2);
    await m.post(`/api/budgets/${id}/transitions`).send({ to: 'in_review' }).expect(200);
    const r = await s.as('reviewer');
    await r.post(`/api/budgets/${id}/transitions`).send({ to: 'approved', reason: 'the open points are minor', password: 'dubito-demo' }).expect(200);
    const after = await m.get(`/api/budgets/${id}`).expect(200);
    expect(after.body.status).toBe('approved');
    expect(after.body.approvedVersion).toBe(2);
  });
});
