import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../server/demo-seed';
import { PASSWORD, sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;

beforeAll(async () => {
  s = await startTestServer();
});
afterAll(async () => {
  await s?.stop();
});

describe('diff, clone and templates', () => {
  it('reports model, inputs field by field and result deltas between versions', async () => {
    const m = await s.as('metrologist');
    const id = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Diffed'), note: '' })
        .expect(201)
    ).body.id;
    const v2 = sampleDocument('Diffed', {
      model: 'y = a + b * c + d',
      inputs: [
        { symbol: 'a', unit: 'mm', distribution: { kind: 'normal', value: 100, u: 0.004 } },
        { symbol: 'b', unit: 'mm', distribution: { kind: 'rectangular', value: 0.01, halfWidth: 0.001 } },
        { symbol: 'c', distribution: { kind: 'normal', value: 1, u: 0.01 } },
        { symbol: 'd', unit: 'mm', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.001 } },
      ],
    });
    await m.put(`/api/budgets/${id}`).send({ baseVersion: 1, document: v2, note: 'more' }).expect(200);
    const d = (await m.get(`/api/budgets/${id}/diff?from=1&to=2`).expect(200)).body;
    expect(d.model).toEqual({ changed: true, from: 'y = a + b * c', to: 'y = a + b * c + d' });
    expect(d.inputs.added.map((q: { symbol: string }) => q.symbol)).toEqual(['d']);
    expect(d.inputs.removed).toEqual([]);
    expect(d.inputs.changed).toEqual([{ key: 'a', changes: [{ field: 'distribution.u', from: 0.002, to: 0.004 }] }]);
    expect(d.result.standardUncertainty.delta).toBeGreaterThan(0);
    expect(d.result.expandedUncertainty.to).toBeGreaterThan(d.result.expandedUncertainty.from);
    const a = d.result.contributions.find((c: { symbol: string }) => c.symbol === 'a');
    expect(a.contribution.to / a.contribution.from).toBeCloseTo(2, 6);
    expect(d.result.contributions.find((c: { symbol: string }) => c.symbol === 'd').contribution.from).toBeNull();
  });

  it('clones a template into a draft of the caller that records its source', async () => {
    const admin = await s.as('admin');
    const t = (
      await admin
        .post('/api/budgets')
        .send({ document: sampleDocument('Lab template'), note: '', template: true })
        .expect(201)
    ).body.id;
    const templates = (await (await s.as('trainee')).get('/api/templates').expect(200)).body;
    expect(templates.map((x: { id: number }) => x.id)).toContain(t);
    const list = (await (await s.as('trainee')).get('/api/budgets').expect(200)).body;
    expect(list.map((x: { id: number }) => x.id)).not.toContain(t);
    const trainee = await s.as('trainee');
    const c = (await trainee.post(`/api/budgets/${t}/clone`).send({ title: 'My first budget' }).expect(201)).body;
    const b = (await trainee.get(`/api/budgets/${c.id}`).expect(200)).body;
    expect(b).toMatchObject({ ownerId: s.users.trainee.id, status: 'draft', isTemplate: false, source: { budgetId: t, version: 1 }, title: 'My first budget' });
    await trainee
      .put(`/api/budgets/${c.id}`)
      .send({ baseVersion: 1, document: sampleDocument('Mine'), note: '' })
      .expect(200);
    // Templates are the admins' to edit.
    await (await s.as('metrologist')).put(`/api/budgets/${t}`).send({ baseVersion: 1, document: sampleDocument(), note: '' }).expect(403);
  });

  it('imports an uploaded budget file', async () => {
    const m = await s.as('metrologist');
    const file = Buffer.from(JSON.stringify(sampleDocument('From a file', { labNote: 'kept on export' })));
    const r = await m.post('/api/budgets/import').field('note', 'from the bench PC').attach('file', file, { filename: 'b.json', contentType: 'application/json' }).expect(201);
    const exported = JSON.parse((await m.get(`/api/budgets/${r.body.id}/export`).expect(200)).text);
    expect(exported.labNote).toBe('kept on export');
    expect((await m.get(`/api/budgets/${r.body.id}/versions`)).body[0].note).toBe('from the bench PC');
  });
});

describe('audit trail', () => {
  it('records each change with its actor and filters by budget, actor, action and time, also as CSV', async () => {
    const m = await s.as('metrologist');
    const t0 = Date.now();
    const id = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Audited'), note: 'n1' })
        .expect(201)
    ).body.id;
    await m
      .put(`/api/budgets/${id}`)
      .send({ baseVersion: 1, document: sampleDocument('Audited 2'), note: 'n2' })
      .expect(200);
    await m.post(`/api/budgets/${id}/comments`).send({ version: 2, body: 'self note' }).expect(201);
    const auditor = await s.as('auditor');
    const all = (await auditor.get(`/api/audit?budget=${id}`).expect(200)).body;
    expect(all.events.map((e: { action: string }) => e.action)).toEqual(['comment.created', 'budget.version_saved', 'budget.created']);
    expect(all.events.every((e: { actorId: number }) => e.actorId === s.users.metrologist.id)).toBe(true);
    const saves = (await auditor.get(`/api/audit?budget=${id}&action=budget.version_saved`).expect(200)).body;
    expect(saves.events).toHaveLength(1);
    expect(saves.events[0]).toMatchObject({ versionNumber: 2, actorEmail: s.users.metrologist.email });
    const byActor = (await auditor.get(`/api/audit?actor=${s.users.metrologist.id}&action=budget&from=${new Date(t0).toISOString()}`).expect(200)).body;
    expect(byActor.events.length).toBeGreaterThanOrEqual(2);
    const none = (await auditor.get(`/api/audit?budget=${id}&to=${t0 - 1}`).expect(200)).body;
    expect(none.events).toEqual([]);
    const csv = await auditor.get(`/api/audit?budget=${id}&format=csv`).expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const lines = csv.text
      .replace(/^\uFEFF/, '')
      .trim()
      .split('\r\n');
    expect(lines[0]).toBe('event,time,actor_id,actor_name,action,budget_id,budget_title,version,details,hash');
    expect(lines).toHaveLength(4);
    expect(lines[2]).toContain('budget.version_saved');
  });
});

describe('demo seed', () => {
  it('creates the demo accounts, the examples, templates and a reviewed budget', async () => {
    const t = await startTestServer();
    try {
      const examplesDir = fileURLToPath(new URL('../../examples', import.meta.url));
      const examples = readdirSync(examplesDir).filter((f) => f.endsWith('.json'));
      const logs: string[] = [];
      await seedDemo(t.services, { examplesDir, log: (m) => logs.push(m) });
      const a = t.anonymous();
      await a.post('/api/auth/login').send({ email: 'metrologist@dubito.example', password: PASSWORD }).expect(200);
      const budgets = (await a.get('/api/budgets').expect(200)).body as { id: number; status: string; currentVersion: number }[];
      const skipped = logs.filter((l) => l.startsWith('skipped')).length;
      expect(budgets.length).toBe(examples.length - skipped + 2);
      const reviewed = budgets.find((b) => b.status === 'approved')!;
      expect(reviewed.currentVersion).toBe(3);
      const comments = (await a.get(`/api/budgets/${reviewed.id}/comments`).expect(200)).body;
      expect(comments.length).toBeGreaterThanOrEqual(3);
      expect((await a.get('/api/templates').expect(200)).body).toHaveLength(2);
      for (const role of ['admin', 'reviewer', 'auditor', 'trainee']) {
        await t
          .anonymous()
          .post('/api/auth/login')
          .send({ email: `${role}@dubito.example`, password: PASSWORD })
          .expect(200);
      }
    } finally {
      await t.stop();
    }
  });
});
