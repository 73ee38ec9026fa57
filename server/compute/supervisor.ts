import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import { BudgetError, type BudgetErrorCode, type ModelLocation } from '../../shared/budget/budget-error';
import { AppError, BusyError, UnavailableError, UnprocessableError } from '../http/errors';
import type { TaskMessage, TaskReply } from './task-worker';
import { TASK_WORDS, type TaskInput, type TaskKind, type TaskOutput } from './tasks';

/** Whether this module runs from the server's build (server/dist/, plain JavaScript) rather than from TypeScript through tsx. */
const BUILT = import.meta.url.endsWith('.js');
/** The engine the workers load: the build's own entry beside this chunk, or the TypeScript source. */
export const DEFAULT_ENGINE_MODULE = new URL(BUILT ? './compute-budget.js' : '../../shared/compute/compute-budget.ts', import.meta.url).href;
const WORKER_URL = new URL(BUILT ? './task-worker.js' : './task-worker.ts', import.meta.url);

/**
 * A worker thread running task-worker: the built JavaScript directly; from
 * TypeScript, a one-line bootstrap that loads it through tsx in the worker
 * thread itself (tsx is only looked up then, so a build needs no loader).
 */
function startWorker(options: ConstructorParameters<typeof Worker>[1]): Worker {
  if (BUILT) return new Worker(WORKER_URL, options);
  const tsxApi = pathToFileURL(
    createRequire(import.meta.url)
      .resolve('tsx/esm/api')
      .replace(/index\.cjs$/, 'index.mjs'),
  ).href;
  const bootstrap = `import(${JSON.stringify(tsxApi)}).then((m) => m.tsImport(${JSON.stringify(WORKER_URL.href)}, ${JSON.stringify(import.meta.url)}))`;
  return new Worker(bootstrap, { ...options, eval: true });
}

export interface SupervisorLimits {
  /** Worker threads. */
  size: number;
  /** Jobs waiting for a worker; one more is refused with 503. */
  queueLength: number;
  /** Jobs of one user running or waiting; one more is refused with 429. */
  jobsPerUser: number;
  /** Deadline of a job, counted from the moment it is accepted (queue time included). */
  timeoutMs: number;
  /** V8 old-generation heap of each worker (MiB); a worker that needs more is ended and replaced. */
  workerHeapMb: number;
}

export interface SupervisorOptions extends SupervisorLimits {
  trialsCap: number;
  engineModule: string;
  log: (msg: string, err?: unknown) => void;
}

interface Job {
  message: TaskMessage;
  user: number;
  acceptedAt: number;
  deadline: number;
  /** When a worker took the job (null while it waits). */
  startedAt: number | null;
  timer: NodeJS.Timeout;
  slot: Slot | null;
  resolve(output: unknown): void;
  reject(e: unknown): void;
}

interface Slot {
  worker: Worker;
  job: Job | null;
  /** Settles when the worker has loaded the engine (true) or exited first (false). */
  ready: Promise<boolean>;
}

/** Why a worker was lost, as the refusal of the job it was running. */
type Loss = { kind: 'deadline' } | { kind: 'memory' } | { kind: 'crash'; error: unknown };

const seconds = (ms: number) => Math.max(1, Math.ceil(ms / 1000));

/**
 * Runs engine work (budgets, reports, diffs) in worker threads with V8 heap
 * limits, and keeps the server answering whatever a job does: a worker that
 * runs out of memory, crashes or passes its job's deadline is ended and
 * replaced, and the job is answered with a typed error. The queue and the
 * jobs per user are bounded, so one user's heavy saves cannot hold everyone
 * else's for minutes.
 */
export class ComputeSupervisor {
  private slots: Slot[] = [];
  private queue: Job[] = [];
  /** Every accepted job, running or waiting. */
  private jobs = new Set<Job>();
  private nextId = 1;
  private closed = false;

  constructor(private readonly o: SupervisorOptions) {}

  get limits(): SupervisorLimits & { trialsCap: number } {
    const { size, queueLength, jobsPerUser, timeoutMs, workerHeapMb, trialsCap } = this.o;
    return { size, queueLength, jobsPerUser, timeoutMs, workerHeapMb, trialsCap };
  }

  private spawn(): Slot {
    const worker = startWorker({
      workerData: { engineModule: this.o.engineModule },
      resourceLimits: { maxOldGenerationSizeMb: this.o.workerHeapMb },
    });
    let loaded: (ok: boolean) => void = () => {};
    const ready = new Promise<boolean>((resolve) => (loaded = resolve));
    const slot: Slot = { worker, job: null, ready };
    worker.once('exit', () => loaded(false));
    worker.on('message', (msg: TaskReply | { ready: true }) => {
      if ('ready' in msg) return loaded(true);
      const job = slot.job;
      if (!job || job.message.id !== msg.id) return;
      this.settle(job);
      if (msg.ok) job.resolve(msg.output);
      else job.reject(refusal(job.message.kind, msg.error));
      this.pump();
    });
    worker.on('error', (err: Error & { code?: string }) => this.lose(slot, err.code === 'ERR_WORKER_OUT_OF_MEMORY' ? { kind: 'memory' } : { kind: 'crash', error: err }));
    worker.on('exit', (code) => {
      if (!this.closed) this.lose(slot, { kind: 'crash', error: new Error(`compute worker exited with code ${code}`) });
    });
    worker.unref();
    return slot;
  }

  /** The job leaves the books: its deadline, its slot and its place in the queue are freed. */
  private settle(job: Job): void {
    clearTimeout(job.timer);
    this.jobs.delete(job);
    const i = this.queue.indexOf(job);
    if (i >= 0) this.queue.splice(i, 1);
    if (job.slot) job.slot.job = null;
    job.slot = null;
  }

  /** A worker died, ran out of memory or passed its job's deadline: answer the job, replace the worker. */
  private lose(slot: Slot, loss: Loss): void {
    const i = this.slots.indexOf(slot);
    if (i < 0) return;
    this.slots.splice(i, 1);
    const job = slot.job;
    void slot.worker.terminate();
    if (job) {
      this.settle(job);
      const { doing, what } = TASK_WORDS[job.message.kind];
      const heap = this.o.workerHeapMb;
      if (loss.kind === 'memory') {
        job.reject(
          new UnprocessableError(
            'too_large_to_compute',
            `${what} is too large to compute: ${doing} needs more than the ${heap} MiB of memory one computation may use; reduce the trials or the size of the model`,
          ),
        );
      } else if (loss.kind === 'deadline' && this.mostlyWaited(job)) {
        job.reject(this.tooBusy(job));
      } else if (loss.kind === 'deadline') {
        job.reject(
          new UnprocessableError('too_large_to_compute', `${what} is too large to compute: ${doing} did not finish within ${seconds(this.o.timeoutMs)} s; reduce the trials or the size of the model`),
        );
      } else {
        const missing = String((loss.error as Error)?.message ?? loss.error).match(/Cannot find module|ERR_MODULE_NOT_FOUND/);
        this.o.log('compute worker failed', loss.error);
        job.reject(
          missing
            ? new UnavailableError('the computation engine is not installed', 'engine_unavailable')
            : new UnavailableError(`the worker ${doing} stopped unexpectedly; try again`, 'compute_unavailable'),
        );
      }
    }
    this.pump();
  }

  private pump(): void {
    if (this.closed) return;
    while (this.queue.length) {
      let slot = this.slots.find((s) => !s.job);
      if (!slot && this.slots.length < this.o.size) {
        slot = this.spawn();
        this.slots.push(slot);
      }
      if (!slot) return;
      const job = this.queue.shift()!;
      try {
        // Copying the input can fail (a value that cannot be cloned, or nested too deep to copy): the job is refused, the worker stays free.
        slot.worker.postMessage(job.message);
      } catch (e) {
        this.settle(job);
        job.reject(new UnprocessableError('not_computable', `${TASK_WORDS[job.message.kind].what} could not be handed to a worker: ${(e as Error).message}`));
        continue;
      }
      slot.job = job;
      job.slot = slot;
      job.startedAt = Date.now();
      slot.worker.ref();
    }
    for (const s of this.slots) if (!s.job) s.worker.unref();
  }

  /** When a worker is sure to be free: the earliest deadline among the jobs holding one. */
  private retryAfter(jobs: Iterable<Job>): number {
    let first = Infinity;
    for (const j of jobs) first = Math.min(first, j.deadline);
    return seconds(Number.isFinite(first) ? first - Date.now() : this.o.timeoutMs);
  }

  /**
   * Runs one job for a user. Refused at once with 429 when the user already
   * has `jobsPerUser` jobs, and with 503 when every worker is busy and the
   * queue is full; a job still waiting at its deadline is refused with 503.
   */
  run<K extends TaskKind>(kind: K, input: TaskInput<K>, user: number): Promise<TaskOutput<K>> {
    if (this.closed) return Promise.reject(new UnavailableError('the server is shutting down'));
    const mine = [...this.jobs].filter((j) => j.user === user);
    if (mine.length >= this.o.jobsPerUser) {
      return Promise.reject(
        new BusyError(
          429,
          'too_many_jobs',
          `you already have ${mine.length} computation${mine.length === 1 ? '' : 's'} running or waiting; wait for ${mine.length === 1 ? 'it' : 'them'} to finish`,
          this.retryAfter(mine),
        ),
      );
    }
    const idle = this.slots.some((s) => !s.job) || this.slots.length < this.o.size;
    if (!idle && this.queue.length >= this.o.queueLength) {
      return Promise.reject(new BusyError(503, 'compute_busy', `the server is busy with ${this.jobs.size} computations; try again shortly`, this.retryAfter(this.slots.map((s) => s.job!))));
    }
    return new Promise<TaskOutput<K>>((resolve, reject) => {
      const now = Date.now();
      const job: Job = {
        message: { id: this.nextId++, kind, input },
        user,
        acceptedAt: now,
        deadline: now + this.o.timeoutMs,
        startedAt: null,
        slot: null,
        timer: setTimeout(() => this.expire(job), this.o.timeoutMs),
        resolve: resolve as (o: unknown) => void,
        reject,
      };
      job.timer.unref();
      this.jobs.add(job);
      this.queue.push(job);
      this.pump();
    });
  }

  /** The deadline passed: a running job takes its worker down with it; a waiting one is refused. */
  private expire(job: Job): void {
    if (!this.jobs.has(job)) return;
    if (job.slot) return this.lose(job.slot, { kind: 'deadline' });
    this.settle(job);
    job.reject(this.tooBusy(job));
  }

  /** A job that spent more of its time waiting than running was stopped by the load, not by its own size. */
  private mostlyWaited(job: Job): boolean {
    const started = job.startedAt ?? Date.now();
    return started - job.acceptedAt > Date.now() - started;
  }

  private tooBusy(job: Job): BusyError {
    const waited = seconds((job.startedAt ?? Date.now()) - job.acceptedAt);
    return new BusyError(
      503,
      'compute_busy',
      `the server was too busy to start ${TASK_WORDS[job.message.kind].doing} within ${seconds(this.o.timeoutMs)} s (it waited ${waited} s for a worker); try again shortly`,
      seconds(this.o.timeoutMs / 4),
    );
  }

  /** Computes a validated budget with the server's trials cap. */
  compute(document: TaskInput<'budget'>['document'], user: number): Promise<TaskOutput<'budget'>> {
    return this.run('budget', { document, trialsCap: this.o.trialsCap }, user);
  }

  /** Jobs running and waiting (what a health check or a test looks at). */
  load(): { running: number; waiting: number; workers: number } {
    return { running: this.slots.filter((s) => s.job).length, waiting: this.queue.length, workers: this.slots.length };
  }

  /** Starts the workers ahead of the first job; true once every one has loaded the engine. */
  async warm(): Promise<boolean> {
    while (this.slots.length < this.o.size) this.slots.push(this.spawn());
    return (await Promise.all(this.slots.map((s) => s.ready))).every(Boolean);
  }

  async close(): Promise<void> {
    this.closed = true;
    for (const job of [...this.jobs]) {
      this.settle(job);
      job.reject(new UnavailableError('the server is shutting down'));
    }
    const slots = this.slots.splice(0);
    await Promise.all(slots.map((s) => s.worker.terminate()));
  }
}

/** A worker's refusal as the server's typed error. */
function refusal(kind: TaskKind, e: { name: string; code?: string; message: string; field?: string; location?: ModelLocation }): Error {
  if (e.name === 'BudgetError') return new BudgetError((e.code ?? 'invalid_file') as BudgetErrorCode, e.message, e.field, e.location);
  if (e.name === 'RangeError' && /call stack|memory|Invalid (array|string) length/i.test(e.message)) {
    return new UnprocessableError('too_large_to_compute', `${TASK_WORDS[kind].what} is too large to compute: ${e.message}`);
  }
  return kind === 'budget'
    ? new UnprocessableError('compute_failed', `the engine could not compute this budget: ${e.message}`)
    : new AppError(500, `${kind}_failed`, `${TASK_WORDS[kind].doing} failed: ${e.message}`);
}
