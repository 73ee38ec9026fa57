/*
 * A test engine for the compute supervisor: the real computeBudget, except
 * for budgets whose title asks a worker to misbehave. Loaded in the worker
 * thread in place of the shared engine (the `engineModule` option).
 */
import { existsSync } from 'node:fs';
import { computeBudget as realCompute, type ComputeOptions } from '../../../shared/compute/compute-budget';
import type { BudgetDocument } from '../../../shared/budget/schema';

export function computeBudget(doc: BudgetDocument, options?: ComputeOptions) {
  const release = (doc as { releaseFile?: string }).releaseFile;
  switch (doc.title) {
    case 'exhaust the heap': {
      // Keeps every block reachable until V8 reaches the worker's heap limit.
      const kept: number[][] = [];
      for (;;) kept.push(Array.from({ length: 100_000 }, (_, i) => i + kept.length));
    }
    case 'spin':
      for (;;);
    case 'crash':
      process.exit(3);
    // eslint-disable-next-line no-fallthrough -- process.exit never returns
    case 'hold':
      // Holds its worker until the test creates the release file.
      while (!existsSync(release!)) Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 5);
      return realCompute(doc, options);
    default:
      return realCompute(doc, options);
  }
}
