import { readFileSync } from 'node:fs';
import { BudgetError, type ModelLocation } from '../shared/budget/budget-error';
import { problemOf } from '../shared/budget/problems';
import { parseBudgetFile } from '../shared/budget/budget-file';
import type { BudgetResult } from '../shared/budget/result';
import type { BudgetDocument } from '../shared/budget/schema';
import { computeBudget } from '../shared/compute/compute-budget';

/** What the command line asks of every budget of a run. */
export interface RunOptions {
  trials?: number | 'adaptive';
  seed?: string;
  monteCarlo: boolean;
}

/**
 * Why a budget gave no result: the engine's problem (`BudgetProblem`: code, message, field — null where it names none —
 * and the model location where there is one), or `file_unreadable`, or `internal` for a fault of the program.
 */
interface Refusal {
  code: string;
  message: string;
  field: string | null;
  location?: ModelLocation;
}

export type FileOutcome = { file: string; document: BudgetDocument; result: BudgetResult } | { file: string; error: Refusal };

/** Reads, validates and computes one budget file; never throws: every refusal becomes the outcome. */
export function computeFile(file: string, options: RunOptions): FileOutcome {
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? `a folder, not a file (its budgets: ${file.replace(/\/+$/, '')}/*.json)` : (e as Error).message;
    return { file, error: { code: 'file_unreadable', message: `cannot read ${file}: ${why}`, field: null } };
  }
  return computeText(file, text, options);
}

/** Validates and computes the text of the budget file `file`; never throws. */
export function computeText(file: string, text: string, options: RunOptions): FileOutcome {
  try {
    const document = parseBudgetFile(text);
    const result = computeBudget(document, options);
    return { file, document, result };
  } catch (e) {
    if (e instanceof BudgetError) {
      const p = problemOf(e);
      return { file, error: { ...p, field: p.field || null } };
    }
    return { file, error: { code: 'internal', message: `internal error: ${(e as Error)?.message ?? String(e)}`, field: null } };
  }
}
