import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import { BudgetError, type BudgetErrorCode } from '../../shared/budget/budget-error';
import type { BudgetResult } from '../../shared/budget/result';
import type { BudgetDocument } from '../../shared/budget/schema';
import { UnavailableError, UnprocessableError } from '../http/errors';
import type { ComputeJob, ComputeReply } from './compute-worker';

export const DEFAULT_ENGINE_MODULE = new URL('../../shared/compute/compute-budget.ts', import.meta.url).href;
const WORKER_URL = new URL('./compute-worker.ts', import.meta.url);
const TSX_API = pathToFileURL(
  createRequire(import.meta.url).resolve('tsx/esm/api').replace(/index\.cjs$/, 'index.mjs'),
).href;
/** The worker is TypeScript: a one-line bootstrap loads it through tsx in the worker thread itself. */
const BOOTSTRAP = `import(${JSON.stringify(TSX_API)}).then((m) => m.tsImport(${JSON.stringify(WORKER_URL.href)}, ${JSON.stringify(import.meta.url)}))`;

interface Pending {
  job: ComputeJob;
  resolve(r: BudgetResult): void;
  reject(e: unknown): void;
}

interface Slot {
  worker: Worker;
  busy: Pending | null;
  timer: NodeJS.Timeout | null;
  /** Settles when the worker has loaded the engine (true) or exited first (false). */
  ready: Promise<boolean>;
}

export interface ComputePoolOptions {
  size: number;
  trialsCap: number;
  timeoutMs: number;
  engineModule: string;
  log: (msg: string, err?: unknown) => void;
}

/** A small pool of worker threads running the engine, so a computation never blocks the server. */
export class ComputePool {
  private slots: Slot[] = [];
  private queue: Pending[] = [];
  private nextId = 1;
  private closed = false;

  constructor(private readonly o: ComputePoolOptions) {}

  private spawn(): Slot {
    const worker = new Worker(BOOTSTRAP, { eval: true, workerData: { engineModule: this.o.engineModule } });
    let loaded: (ok: boolean) => void = () => {};
    const ready = new Promise<boolean>((resolve) => (loaded = resolve));
    const slot: Slot = { worker, busy: null, timer: null, ready };
    worker.once('exit', () => loaded(false));
    worker.on('message', (msg: ComputeReply | { ready: true }) => {
      if ('ready' in msg) return loaded(true);
      const p = slot.busy;
      if (!p || p.job.id !== msg.id) return;
      this.finish(slot);
      if (msg.ok) p.resolve(msg.result);
      else if (msg.error.name === 'BudgetError') {
        p.reject(new BudgetError((msg.error.code ?? 'invalid_file') as BudgetErrorCode, msg.error.message, msg.error.field));
      } else p.reject(new UnprocessableError('compute_failed', `the engine could not compute this budget: ${msg.error.message}`));
      this.pump();
    });
    worker.on('error', (err) => this.lose(slot, err));
    worker.on('exit', (code) => {
      if (!this.closed) this.lose(slot, new Error(`compute worker exited with code ${code}`));
    });
    worker.unref();
    return slot;
  }

  private finish(slot: Slot): void {
    if (slot.timer) clearTimeout(slot.timer);
    slot.timer = null;
    slot.busy = null;
  }

  /** A worker died or hung: fail its job, replace it. */
  private lose(slot: Slot, err: unknown): void {
    const i = this.slots.indexOf(slot);
    if (i < 0) return;
    this.slots.splice(i, 1);
    const p = slot.busy;
    this.finish(slot);
    void slot.worker.terminate();
    if (p) {
      const missing = String((err as Error)?.message ?? err).match(/Cannot find module|ERR_MODULE_NOT_FOUND/);
      this.o.log('compute worker failed', err);
      p.reject(
        missing
          ? new UnavailableError('the computation engine is not installed', 'engine_unavailable')
          : new UnavailableError('the computation did not finish; try again', 'compute_unavailable'),
      );
    }
    this.pump();
  }

  private pump(): void {
    if (this.closed) return;
    while (this.queue.length) {
      let slot = this.slots.find((s) => !s.busy);
      if (!slot && this.slots.length < this.o.size) {
        slot = this.spawn();
        this.slots.push(slot);
      }
      if (!slot) return;
      const p = this.queue.shift()!;
      slot.busy = p;
      const s = slot;
      s.timer = setTimeout(() => this.lose(s, new Error('computation timed out')), this.o.timeoutMs);
      s.timer.unref();
      s.worker.ref();
      s.worker.postMessage(p.job);
    }
    for (const s of this.slots) if (!s.busy) s.worker.unref();
  }

  /** Computes a validated budget with the server's trials cap. */
  compute(document: BudgetDocument): Promise<BudgetResult> {
    if (this.closed) return Promise.reject(new UnavailableError('the server is shutting down'));
    return new Promise((resolve, reject) => {
      this.queue.push({ job: { id: this.nextId++, document, trialsCap: this.o.trialsCap }, resolve, reject });
      this.pump();
    });
  }

  /** Starts the workers ahead of the first save; true once every one has loaded the engine. */
  async warm(): Promise<boolean> {
    while (this.slots.length < this.o.size) this.slots.push(this.spawn());
    return (await Promise.all(this.slots.map((s) => s.ready))).every(Boolean);
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const p of this.queue.splice(0)) p.reject(new UnavailableError('the server is shutting down'));
    const slots = this.slots.splice(0);
    for (const s of slots) {
      if (s.timer) clearTimeout(s.timer);
      s.busy?.reject(new UnavailableError('the server is shutting down'));
    }
    await Promise.all(slots.map((s) => s.worker.terminate()));
  }
}
