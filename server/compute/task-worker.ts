/*
 * One worker thread of the compute supervisor: computes budgets with the
 * shared engine, builds report PDFs and compares versions, so none of that
 * ever runs on the server's event loop. The engine module is given by URL in
 * workerData so the supervisor can load it whether the server runs from
 * TypeScript (through tsx) or from a build; the report and diff modules are
 * loaded on first use.
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { TaskInput, TaskKind, TaskOutput } from './tasks';
import type { ModelLocation } from '../../shared/budget/budget-error';

interface Engine {
  computeBudget(doc: TaskInput<'budget'>['document'], options?: { trialsCap?: number }): TaskOutput<'budget'>;
}

export interface TaskMessage<K extends TaskKind = TaskKind> {
  id: number;
  kind: K;
  input: TaskInput<K>;
}

export type TaskReply = { id: number; ok: true; output: unknown } | { id: number; ok: false; error: { name: string; code?: string; message: string; field?: string; location?: ModelLocation } };

const port = parentPort!;
const engine = (await import((workerData as { engineModule: string }).engineModule)) as Engine;

const runners: { [K in TaskKind]: (input: TaskInput<K>) => Promise<TaskOutput<K>> | TaskOutput<K> } = {
  budget: (input) => engine.computeBudget(input.document, { trialsCap: input.trialsCap }),
  report: async (input) => {
    const { renderReportPdf } = await import('../reports/report-pdf');
    const pdf = await renderReportPdf(input);
    return new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength);
  },
  diff: async (input) => {
    const { diffBudgets } = await import('../budgets/budget-diff');
    const load = (v: TaskInput<'diff'>['from']) => ({ number: v.number, document: JSON.parse(v.document), result: JSON.parse(v.result) });
    return diffBudgets(load(input.from), load(input.to));
  },
};

port.on('message', async (task: TaskMessage) => {
  let reply: TaskReply;
  try {
    const run = runners[task.kind] as (input: unknown) => unknown;
    reply = { id: task.id, ok: true, output: await run(task.input) };
  } catch (e) {
    const err = e as { name?: string; code?: string; message?: string; field?: string; location?: ModelLocation };
    reply = {
      id: task.id,
      ok: false,
      error: { name: err?.name ?? 'Error', code: err?.code, message: String(err?.message ?? e), field: err?.field, location: err?.location },
    };
  }
  try {
    port.postMessage(reply);
  } catch (e) {
    // An answer that cannot be copied to the main thread still frees the slot.
    port.postMessage({ id: task.id, ok: false, error: { name: 'Error', message: `the answer could not be returned (${(e as Error).message})` } } satisfies TaskReply);
  }
});
port.postMessage({ ready: true });
