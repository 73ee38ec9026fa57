import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ComputeSupervisor, DEFAULT_ENGINE_MODULE, type SupervisorLimits } from '../../server/compute/supervisor';
import { AppError, BusyError } from '../../server/http/errors';
import type { BudgetDocument } from '../../shared/budget/schema';
import { sampleDocument } from './helpers';

const MISBEHAVING = new URL('./engines/misbehaving-engine.ts', import.meta.url).href;
const dir = mkdtempSync(join(tmpdir(), 'dubito-supervisor-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function supervisor(limits: Partial<SupervisorLimits> = {}, engineModule = MISBEHAVING) {
  return new ComputeSupervisor({
    size: 1,
    queueLength: 4,
    jobsPerUser: 4,
    timeoutMs: 120_000,
    workerHeapMb: 96,
    trialsCap: 2_000,
    engineModule,
    log: () => {},
    ...limits,
  });
}

const doc = (title: string, extra: Record<string, unknown> = {}) => sampleDocument(title, extra) as unknown as BudgetDocument;
let files = 0;
/** A budget that holds its worker until `release()` is called. */
function held() {
  const file = join(dir, `release-${++files}`);
  return { document: doc('hold', { releaseFile: file }), release: () => writeFileSync(file, '') };
}

/** The typed error a job was refused with. */
async function refusal(p: Promise<unknown>): Promise<AppError> {
  const e = await p.then(
    () => null,
    (err: unknown) => err,
  );
  expect(e).toBeInstanceOf(AppError);
  return e as AppError;
}

describe('ComputeSupervisor.warm', () => {
  it('settles true once the workers have loaded the engine, and they then compute', async () => {
    const p = supervisor({}, DEFAULT_ENGINE_MODULE);
    try {
      expect(await p.warm()).toBe(true);
      const sum = {
        format: 'dubito-budget/1',
        title: 'Sum',
        measurand: { symbol: 'y', unit: '1' },
        model: 'y = a + b',
        inputs: [
          { symbol: 'a', unit: '1', distribution: { kind: 'normal', value: 1, u: 0.1 } },
          { symbol: 'b', unit: '1', distribution: { kind: 'normal', value: 2, u: 0.1 } },
        ],
        monteCarlo: false,
      } as unknown as BudgetDocument;
      // u_c = √(0.1² + 0.1²) for a sum of two independent inputs (JCGM 100:2008 5.1.2).
      expect((await p.compute(sum, 1)).gum.standardUncertainty).toBeCloseTo(Math.SQRT2 * 0.1, 12);
    } finally {
      await p.close();
    }
  }, 60_000);

  it('settles false when a worker cannot load the engine', async () => {
    const p = supervisor({}, new URL('./no-such-engine.ts', import.meta.url).href);
    try {
      expect(await p.warm()).toBe(false);
    } finally {
      await p.close();
    }
  }, 60_000);
});

describe('a worker that fails is replaced and its job answered', () => {
  it('out of memory: 422 naming the memory limit, and the next budget computes', async () => {
    const p = supervisor({ workerHeapMb: 64 });
    try {
      const e = await refusal(p.compute(doc('exhaust the heap'), 1));
      expect([e.status, e.code]).toEqual([422, 'too_large_to_compute']);
      expect(e.message).toMatch(/too large to compute.*64 MiB of memory/);
      expect((await p.compute(doc('after'), 1)).gum.estimate).toBeCloseTo(100.01, 9);
    } finally {
      await p.close();
    }
  }, 120_000);

  it('a crash: 503, and the next budget computes', async () => {
    const p = supervisor();
    try {
      const e = await refusal(p.compute(doc('crash'), 1));
      expect([e.status, e.code]).toEqual([503, 'compute_unavailable']);
      expect((await p.compute(doc('after'), 1)).gum.estimate).toBeCloseTo(100.01, 9);
    } finally {
      await p.close();
    }
  }, 120_000);

  it('past the deadline: the worker is ended, 422 names the budget as too large, and a new worker computes', async () => {
    const p = supervisor({ timeoutMs: 4_000 });
    try {
      expect(await p.warm()).toBe(true);
      const e = await refusal(p.compute(doc('spin'), 1));
      expect([e.status, e.code]).toEqual([422, 'too_large_to_compute']);
      expect(e.message).toMatch(/did not finish within 4 s/);
      expect(p.load()).toEqual({ running: 0, waiting: 0, workers: 0 });
      expect(await p.warm()).toBe(true);
      expect((await p.compute(doc('after'), 1)).gum.estimate).toBeCloseTo(100.01, 9);
    } finally {
      await p.close();
    }
  }, 120_000);

  it('an input that cannot be copied to a worker (nested 10 000 deep) is refused and frees its slot at once', async () => {
    const p = supervisor();
    try {
      let deep: unknown = [];
      for (let i = 0; i < 10_000; i++) deep = [deep];
      const e = await refusal(p.compute(doc('deep', { notes: deep }), 1));
      expect([e.status, e.code]).toEqual([422, 'not_computable']);
      expect(p.load()).toMatchObject({ running: 0, waiting: 0 });
      expect((await p.compute(doc('after'), 1)).gum.estimate).toBeCloseTo(100.01, 9);
    } finally {
      await p.close();
    }
  }, 120_000);
});

describe('the queue and the jobs per user are bounded', () => {
  it('a full queue answers 503 with a retry time, and the queued job still computes', async () => {
    const p = supervisor({ queueLength: 1 });
    const h = held();
    try {
      const running = p.compute(h.document, 1);
      const queued = p.compute(doc('queued'), 2);
      expect(p.load()).toMatchObject({ running: 1, waiting: 1 });
      const e = await refusal(p.compute(doc('refused'), 3));
      expect(e).toBeInstanceOf(BusyError);
      expect([e.status, e.code]).toEqual([503, 'compute_busy']);
      expect((e as BusyError).retryAfterSeconds).toBeGreaterThanOrEqual(1);
      h.release();
      expect((await running).gum.estimate).toBeCloseTo(100.01, 9);
      expect((await queued).gum.estimate).toBeCloseTo(100.01, 9);
      expect(p.load()).toMatchObject({ running: 0, waiting: 0 });
    } finally {
      h.release();
      await p.close();
    }
  }, 120_000);

  it('one user past the jobs-per-user limit gets 429 while another user is still queued', async () => {
    const p = supervisor({ jobsPerUser: 1 });
    const h = held();
    try {
      const running = p.compute(h.document, 1);
      const e = await refusal(p.compute(doc('second of user 1'), 1));
      expect(e).toBeInstanceOf(BusyError);
      expect([e.status, e.code]).toEqual([429, 'too_many_jobs']);
      const other = p.compute(doc('user 2'), 2);
      expect(p.load()).toMatchObject({ running: 1, waiting: 1 });
      h.release();
      await running;
      expect((await other).gum.estimate).toBeCloseTo(100.01, 9);
    } finally {
      h.release();
      await p.close();
    }
  }, 120_000);

  it('the deadline counts from enqueue: a job that never reached a worker is refused with 503', async () => {
    const p = supervisor({ timeoutMs: 4_000 });
    const h = held();
    try {
      expect(await p.warm()).toBe(true);
      const running = refusal(p.compute(h.document, 1));
      const waiting = refusal(p.compute(doc('waiting'), 2));
      expect(p.load()).toMatchObject({ running: 1, waiting: 1 });
      const w = await waiting;
      expect([w.status, w.code]).toEqual([503, 'compute_busy']);
      expect(w.message).toMatch(/too busy to start computing this budget within 4 s/);
      const r = await running;
      expect([r.status, r.code]).toEqual([422, 'too_large_to_compute']);
    } finally {
      h.release();
      await p.close();
    }
  }, 120_000);
});
