import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;

beforeAll(async () => {
  s = await startTestServer();
  const m = await s.as('metrologist');
  // each title with a LIKE wildcard or the escape character, beside one the unescaped wildcard would also match
  for (const title of ['Hygrometer at 50% RH', 'Hygrometer at 50 RH', 'Probe a_b', 'Probe axb', 'Standard C:\\cal\\2026', 'Standard C:cal2026']) {
    await m
      .post('/api/budgets')
      .send({ document: sampleDocument(title), note: 'v1' })
      .expect(201);
  }
});
afterAll(async () => {
  await s?.stop();
});

async function titlesFound(q: string): Promise<string[]> {
  const m = await s.as('metrologist');
  const r = await m.get('/api/budgets').query({ q, sort: 'title', order: 'asc' }).expect(200);
  expect(r.headers['x-total-count']).toBe(String(r.body.length));
  return r.body.map((b: { title: string }) => b.title);
}

describe('the budget list searched by title', () => {
  it.each([
    ['50%', ['Hygrometer at 50% RH']],
    ['a_b', ['Probe a_b']],
    ['\\', ['Standard C:\\cal\\2026']],
    ['C:\\cal', ['Standard C:\\cal\\2026']],
    ['%', ['Hygrometer at 50% RH']],
    ['_', ['Probe a_b']],
  ])('finds %s as typed, the wildcard or backslash being a plain character', async (q, expected) => {
    expect(await titlesFound(q)).toEqual(expected);
  });

  it('still finds part of a title without regard to case', async () => {
    expect(await titlesFound('HYGROMETER')).toEqual(['Hygrometer at 50 RH', 'Hygrometer at 50% RH']);
  });
});

describe('the users searched by name or address', () => {
  it('reads an underscore as itself', async () => {
    const admin = await s.as('admin');
    // "Test metrologist" and "metrologist@lab.test": an unescaped "_" would match the "r" between "met" and "ologist"
    await admin.get('/api/users').query({ q: 'met_ologist' }).expect(200).expect('x-total-count', '0');
    await admin.get('/api/users').query({ q: 'metrologist' }).expect(200).expect('x-total-count', '1');
  });
});

describe('the audit trail filtered by a kind of action', () => {
  it('takes the kind literally: "budge_" is no kind, "budget" is', async () => {
    const auditor = await s.as('auditor');
    await auditor.get('/api/audit').query({ action: 'budge_' }).expect(200).expect('x-total-count', '0');
    const budget = await auditor.get('/api/audit').query({ action: 'budget' }).expect(200);
    expect(budget.body.total).toBe(6);
    expect(budget.body.events.every((e: { action: string }) => e.action === 'budget.created')).toBe(true);
  });
});
