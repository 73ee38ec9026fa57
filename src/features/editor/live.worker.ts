/// <reference lib="webworker" />
/*
 * The editor's live GUM recompute, off the page's main thread: a heavy
 * budget never freezes the editor, and the page can stop a recompute that
 * takes too long by ending this worker.
 */
import { budgetProblems } from '../../../shared/budget/budget-file';
import { problemOfFailure } from '../../../shared/budget/problems';
import type { BudgetDocument } from '../../../shared/budget/schema';
import { computeBudget } from '../../../shared/compute/compute-budget';
import type { LiveOutcome, LiveReply, LiveRequest } from './live';

/** Removes values the editor keeps while typing (NaN from unreadable text) so the schema names them. */
function clean(doc: BudgetDocument): unknown {
  return JSON.parse(JSON.stringify(doc, (_k, v) => (typeof v === 'number' && Number.isNaN(v) ? 'not a number' : v)));
}

/** The draft's problems, or its GUM result (JCGM 100:2008; the Monte Carlo method runs in its own panel). */
function evaluateDraft(doc: BudgetDocument): LiveOutcome {
  const value = clean(doc);
  const problems = budgetProblems(value);
  if (problems.length) {
    return { problems, result: null, valid: null };
  }
  try {
    const result = computeBudget(value as BudgetDocument, { monteCarlo: false });
    return { problems: [], result, valid: value as BudgetDocument };
  } catch (e) {
    return { problems: [problemOfFailure(e)], result: null, valid: null };
  }
}

self.onmessage = (e: MessageEvent<LiveRequest>) => {
  const reply: LiveReply = { id: e.data.id, outcome: evaluateDraft(e.data.document) };
  (self as unknown as DedicatedWorkerGlobalScope).postMessage(reply);
};
