/** What the compute workers do, with what they take and give back (types only). */
import type { BudgetDiff } from '../../shared/api/diff';
import type { BudgetResult } from '../../shared/budget/result';
import type { BudgetDocument } from '../../shared/budget/schema';
import type { ReportData } from '../reports/report-data';

/** A stored version as text, parsed inside the worker. */
interface StoredVersionText {
  number: number;
  document: string;
  result: string;
}

interface Tasks {
  /** Computes a validated budget with the server's trials cap. */
  budget: { input: { document: BudgetDocument; trialsCap: number }; output: BudgetResult };
  /** Builds the PDF report of a version. */
  report: { input: ReportData; output: Uint8Array };
  /** Compares two stored versions. */
  diff: { input: { from: StoredVersionText; to: StoredVersionText }; output: BudgetDiff };
}

export type TaskKind = keyof Tasks;
export type TaskInput<K extends TaskKind> = Tasks[K]['input'];
export type TaskOutput<K extends TaskKind> = Tasks[K]['output'];

/** How the refusals name the work: "computing this budget", … */
export const TASK_WORDS: Record<TaskKind, { doing: string; what: string }> = {
  budget: { doing: 'computing this budget', what: 'the budget' },
  report: { doing: 'building this report', what: 'the report' },
  diff: { doing: 'comparing these versions', what: 'the comparison' },
};
