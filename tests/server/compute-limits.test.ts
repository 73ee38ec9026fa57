import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkDocumentShape, DOCUMENT_LIMITS } from '../../server/budgets/document-limits';
import { loadConfig } from '../../server/config';
import { DEFAULTS } from '../../shared/budget/limits';
import type { BudgetDocument } from '../../shared/budget/schema';
import { computeBudget } from '../../shared/compute/compute-budget';
import { sampleDocument, startTestServer, type TestServer } from './helpers';

const MISBEHAVING = new URL('./engines/misbehaving-engine.ts', import.meta.url).href;
const dir = mkdtempSync(join(tmpdir(), 'dubito-limits-'));
let s: TestServer;

beforeAll(async () => {
  // One worker, one queued job, one job per user, a 64 MiB worker heap, the default trials cap (10⁶).
  s = await startTestServer({
    engineModule: MISBEHAVING,
    computeWorkers: 1,
    computeQueueLength: 1,
    computeJobsPerUser: 1,
    workerHeapMb: 64,
    trialsCap: loadConfig({}).trialsCap,
    reportMaxBytes: 50_000,
    diffMaxBytes: 100_000,
  });
  for (const role of ['metrologist', 'admin', 'trainee'] as const) await s.as(role);
});
afterAll(async () => {
  await s?.stop();
  rmSync(dir, { recursive: true, force: true });
});

/** Waits (without a fixed delay) until the supervisor shows `running` jobs. */
async function untilRunning(running: number): Promise<void> {
  while (s.pool.load().running !== running) await new Promise((r) => setImmediate(r));
}

describe('the document shape is limited at the edge, and the compute slot stays free', () => {
  it(`refuses an unknown field nested 10 000 arrays deep with 400 (limit ${DOCUMENT_LIMITS.depth}), then saves another user's budget`, async () => {
    const deep = '['.repeat(10_000) + ']'.repeat(10_000);
    const body = JSON.stringify({ document: sampleDocument('Deep', { notes: 'DEEP' }) }).replace('"DEEP"', deep);
    const m = await s.as('metrologist');
    const r = await m.post('/api/budgets').set('Content-Type', 'application/json').send(body).expect(400);
    expect(r.body.error).toMatchObject({ code: 'too_deep', field: 'document' });
    expect(r.body.error.message).toMatch(/nested more than 32 levels/);
    expect(s.pool.load()).toMatchObject({ running: 0, waiting: 0 });
    await (
      await s.as('admin')
    )
      .post('/api/budgets')
      .send({ document: sampleDocument('Trivial') })
      .expect(201);
  });

  it(`refuses unknown fields larger than ${DOCUMENT_LIMITS.unknownFieldBytes} bytes with 400 and keeps smaller ones`, async () => {
    const m = await s.as('metrologist');
    const big = Object.fromEntries(Array.from({ length: 20_000 }, (_, i) => [`k${i}`, i]));
    const r = await m
      .post('/api/budgets')
      .send({ document: sampleDocument('Big', { notes: big }) })
      .expect(400);
    expect(r.body.error).toMatchObject({ code: 'unknown_fields_too_large', field: 'notes' });
    expect(r.body.error.message).toMatch(/more than the 65536 allowed/);
    const ok = await m
      .post('/api/budgets')
      .send({ document: sampleDocument('Small', { lab: 'Kestrel Fen Metrology Laboratory' }) })
      .expect(201);
    const stored = (await m.get(`/api/budgets/${ok.body.id}`).expect(200)).body;
    expect(stored.document.lab).toBe('Kestrel Fen Metrology Laboratory');
  });
});

describe('checkDocumentShape', () => {
  const nested = (levels: number): unknown => (levels === 0 ? 1 : [nested(levels - 1)]);
  it('accepts a document exactly 32 levels deep and refuses one level more', () => {
    // The document object is level 1, each array around the number one more.
    expect(() => checkDocumentShape(sampleDocument('At the limit', { notes: nested(31) }))).not.toThrow();
    expect(() => checkDocumentShape(sampleDocument('Past the limit', { notes: nested(32) }))).toThrow(/nested more than 32 levels/);
  });

  it('counts unknown fields at every level of the format, and ignores known ones', () => {
    const half = 'x'.repeat(DOCUMENT_LIMITS.unknownFieldBytes / 2);
    const doc = sampleDocument('Spread') as ReturnType<typeof sampleDocument> & Record<string, unknown>;
    const inputs = doc.inputs.map((q, i) => (i === 0 ? { ...q, remark: half } : q));
    expect(() => checkDocumentShape({ ...doc, inputs })).not.toThrow();
    const both = { ...doc, inputs, measurand: { ...doc.measurand, remark: half } };
    expect(() => checkDocumentShape(both)).toThrow(/fields outside the budget format take \d+ bytes/);
    const known = { ...doc, model: `y = a + b * c\n# ${'y'.repeat(DOCUMENT_LIMITS.unknownFieldBytes)}` };
    expect(() => checkDocumentShape(known)).not.toThrow();
  });
});

describe('the server survives a worker running out of memory', () => {
  it('answers 422 naming the budget as too large to compute, then computes the next save', async () => {
    const m = await s.as('metrologist');
    const r = await m
      .post('/api/budgets')
      .send({ document: sampleDocument('exhaust the heap') })
      .expect(422);
    expect(r.body.error.code).toBe('too_large_to_compute');
    expect(r.body.error.message).toMatch(/too large to compute.*64 MiB/);
    await m
      .post('/api/budgets')
      .send({ document: sampleDocument('Next') })
      .expect(201);
    await s.anonymous().get('/api/health').expect(200);
  }, 120_000);
});

describe('saves beyond the limits are refused at once with Retry-After', () => {
  it('429 for a second job of the same user, 503 when the queue is full; the held and queued saves then complete', async () => {
    const release = join(dir, 'release');
    const m = await s.as('metrologist');
    const held = m
      .post('/api/budgets')
      .send({ document: sampleDocument('hold', { releaseFile: release }) })
      .then((r) => r);
    await untilRunning(1);
    const mine = await m
      .post('/api/budgets')
      .send({ document: sampleDocument('Second') })
      .expect(429);
    expect(mine.body.error.code).toBe('too_many_jobs');
    expect(Number(mine.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    const queued = (await s.as('admin'))
      .post('/api/budgets')
      .send({ document: sampleDocument('Queued') })
      .then((r) => r);
    while (s.pool.load().waiting !== 1) await new Promise((r) => setImmediate(r));
    const full = await (
      await s.as('trainee')
    )
      .post('/api/budgets')
      .send({ document: sampleDocument('Refused') })
      .expect(503);
    expect(full.body.error.code).toBe('compute_busy');
    expect(Number(full.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    writeFileSync(release, '');
    expect((await held).status).toBe(201);
    expect((await queued).status).toBe(201);
  }, 120_000);
});

describe('reports and diffs are built in the workers, with size caps', () => {
  it('builds the PDF and the diff, and refuses versions past the caps with 422', async () => {
    const m = await s.as('metrologist');
    const { id } = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Report') })
        .expect(201)
    ).body;
    await m
      .put(`/api/budgets/${id}`)
      .send({ baseVersion: 1, document: sampleDocument('Report, second'), note: '' })
      .expect(200);
    const pdf = await m.get(`/api/budgets/${id}/report.pdf`).buffer(true).expect(200);
    expect(pdf.headers['content-type']).toMatch(/application\/pdf/);
    expect((pdf.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
    const d = (await m.get(`/api/budgets/${id}/diff?from=1&to=2`).expect(200)).body;
    expect(d.other).toContainEqual({ field: 'title', from: 'Report', to: 'Report, second' });

    const notes = 'x'.repeat(60_000);
    const big = (
      await m
        .post('/api/budgets')
        .send({ document: sampleDocument('Large', { notes }) })
        .expect(201)
    ).body.id;
    await m
      .put(`/api/budgets/${big}`)
      .send({ baseVersion: 1, document: sampleDocument('Large', { notes: notes + 'y' }), note: '' })
      .expect(200);
    const report = await m.get(`/api/budgets/${big}/report.pdf`).expect(422);
    expect(report.body.error.code).toBe('too_large_to_report');
    const diff = await m.get(`/api/budgets/${big}/diff?from=1&to=2`).expect(422);
    expect(diff.body.error.code).toBe('too_large_to_compare');
  }, 120_000);
});

describe('the stored run is the run that was seen (JCGM 101:2008 7.2)', () => {
  it('GET /api/config gives the trials cap (10⁶ by default) and the default trials', async () => {
    const c = (await (await s.as('trainee')).get('/api/config').expect(200)).body;
    expect(c).toMatchObject({ trialsCap: 1_000_000, defaultTrials: DEFAULTS.trials });
    expect(c.trialsCap).toBeGreaterThanOrEqual(DEFAULTS.trials);
  });

  it('a save with the seed and trials of a browser run stores its Monte Carlo figures number for number', async () => {
    const m = await s.as('metrologist');
    const document = sampleDocument('Seen run', { monteCarlo: { trials: 50_000, seed: 'bench 7' } });
    const { id } = (await m.post('/api/budgets').send({ document }).expect(201)).body;
    const stored = (await m.get(`/api/budgets/${id}`).expect(200)).body;
    // What the Monte Carlo panel runs: the same engine, seed, trials and the server's cap.
    const seen = computeBudget(document as unknown as BudgetDocument, { monteCarlo: true, trials: 50_000, seed: 'bench 7', trialsCap: 1_000_000 });
    expect(stored.result.monteCarlo).toEqual(seen.monteCarlo);
    expect(stored.result.validation).toEqual(seen.validation);
    expect(stored.result.monteCarlo.trials).toBe(50_000);
    expect(stored.version.seed).toBe('bench 7');
  }, 120_000);
});
