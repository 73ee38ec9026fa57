/*
 * Runs the shared engine off the main thread. The engine module is given by
 * URL in workerData so the pool can load it whether the server runs from
 * TypeScript (through tsx) or from a build.
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { BudgetDocument } from '../../shared/budget/schema';
import type { BudgetResult } from '../../shared/budget/result';

interface Engine {
  computeBudget(doc: BudgetDocument, options?: { trialsCap?: number }): BudgetResult;
}

export interface ComputeJob {
  id: number;
  document: BudgetDocument;
  trialsCap: number;
}

export type ComputeReply =
  | { id: number; ok: true; result: BudgetResult }
  | { id: number; ok: false; error: { name: string; code?: string; message: string; field?: string } };

const port = parentPort!;
const engine = (await import((workerData as { engineModule: string }).engineModule)) as Engine;

port.on('message', (job: ComputeJob) => {
  let reply: ComputeReply;
  try {
    reply = { id: job.id, ok: true, result: engine.computeBudget(job.document, { trialsCap: job.trialsCap }) };
  } catch (e) {
    const err = e as { name?: string; code?: string; message?: string; field?: string };
    reply = {
      id: job.id,
      ok: false,
      error: { name: err?.name ?? 'Error', code: err?.code, message: String(err?.message ?? e), field: err?.field },
    };
  }
  port.postMessage(reply);
});
port.postMessage({ ready: true });
