import { useDeferredValue, useEffect, useMemo, useRef, useState } from 'react';
import { BudgetError, type ModelLocation } from '../../../shared/budget/budget-error';
import { budgetProblems } from '../../../shared/budget/budget-file';
import type { BudgetResult } from '../../../shared/budget/result';
import type { BudgetDocument } from '../../../shared/budget/schema';
import { computeBudget } from '../../../shared/compute/compute-budget';
import { nextUMove, uReadingOf, type UReading } from './u-move';

export interface Problem {
  field: string;
  message: string;
  location?: ModelLocation;
}

export interface LiveOutcome {
  /** Field problems by path (`inputs[2].distribution.u`, `model`, `correlations`…). */
  problems: Problem[];
  result: BudgetResult | null;
  /** The document as validated (null when it has problems). */
  valid: BudgetDocument | null;
}

/** The engine's message without the leading field path, which the UI shows by placing it. */
export function plainMessage(p: Problem): string {
  const m = p.message;
  if (p.field && m.startsWith(`${p.field}: `)) return m.slice(p.field.length + 2);
  return m.replace(/^model line \d+(, column \d+)?: /, '').replace(/^(correlations|model|monteCarlo): /, '');
}

/** Removes values the editor keeps while typing (NaN from unreadable text) so the schema names them. */
function clean(doc: BudgetDocument): unknown {
  return JSON.parse(JSON.stringify(doc, (_k, v) => (typeof v === 'number' && Number.isNaN(v) ? 'not a number' : v)));
}

export function evaluateDraft(doc: BudgetDocument): LiveOutcome {
  const value = clean(doc);
  const problems = budgetProblems(value);
  if (problems.length) {
    return { problems, result: null, valid: null };
  }
  try {
    const result = computeBudget(value as BudgetDocument, { monteCarlo: false });
    return { problems: [], result, valid: value as BudgetDocument };
  } catch (e) {
    if (e instanceof BudgetError) {
      return { problems: [{ field: e.field ?? '', message: e.message, location: e.location }], result: null, valid: null };
    }
    return { problems: [{ field: '', message: (e as Error).message }], result: null, valid: null };
  }
}

export interface UMove {
  from: number;
  to: number;
}

/** Recomputes the GUM result on every edit (deferred, so typing stays fluid) and tracks how U moved with the last edit. */
export function useLiveResult(doc: BudgetDocument) {
  const deferred = useDeferredValue(doc);
  const outcome = useMemo(() => evaluateDraft(deferred), [deferred]);
  const last = useRef<UReading | null>(null);
  const [move, setMove] = useState<UMove | null>(null);
  useEffect(() => {
    if (!outcome.result) return;
    const reading = uReadingOf(outcome.result);
    const before = last.current;
    setMove((shown) => nextUMove(before, reading, shown));
    last.current = reading;
  }, [outcome.result]);
  return { ...outcome, move, stale: deferred !== doc };
}

/** Problems under a field path prefix, e.g. all of `inputs[2]`. */
export function problemsUnder(problems: readonly Problem[], prefix: string): Problem[] {
  return problems.filter((p) => p.field === prefix || p.field.startsWith(prefix + '.') || p.field.startsWith(prefix + '['));
}

export function problemAt(problems: readonly Problem[], field: string): string | null {
  const p = problems.find((x) => x.field === field);
  return p ? plainMessage(p) : null;
}
