import type { BudgetProblem } from '../../../shared/budget/problems';
import type { BudgetResult } from '../../../shared/budget/result';
import type { BudgetDocument } from '../../../shared/budget/schema';

export interface RunRequest {
  type: 'run';
  document: BudgetDocument;
  trials: number | 'adaptive';
  seed: string;
  trialsCap: number;
  /** One Int32 set to 1 to stop; only where the page is cross-origin isolated. */
  stopFlag?: SharedArrayBuffer;
}

export type WorkerMessage =
  { type: 'progress'; done: number; total: number } | { type: 'done'; result: BudgetResult; ms: number } | { type: 'cancelled'; done: number } | { type: 'error'; problem: BudgetProblem };
