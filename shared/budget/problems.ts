import type { z } from 'zod';
import { BudgetError, type BudgetErrorCode, type ModelLocation } from './budget-error';

/*
 * A problem of a budget as every side carries it: the editor's live worker and
 * the server's error answers build it here, from a BudgetError or a schema
 * issue, so the client places it by `field` and `location`, never by its words.
 */

/**
 * What is wrong: a `BudgetErrorCode`, or, for the editor's live recompute,
 * `too_large_to_compute` (stopped past its time, as the server says of a budget
 * that exhausts its worker) and `internal` (the engine failed: a defect, not a
 * fault of the budget).
 */
type ProblemCode = BudgetErrorCode | 'too_large_to_compute' | 'internal';

export interface BudgetProblem {
  code: ProblemCode;
  /** The place in the budget file (`inputs[2].distribution.u`, `model`, `correlations[0]`); '' for the budget as a whole. */
  field: string;
  /** For the model: line (1-based), column (1-based) and offending token, where known. */
  location?: ModelLocation;
  /** In words, beginning with the place it names (`inputs[2].distribution.u: must be …`), so it reads alone. */
  message: string;
}

/** Renders a zod path as the budget file writes it: `inputs[2].distribution.u`. */
function fieldPath(path: readonly PropertyKey[]): string {
  return path.map((p, i) => (typeof p === 'number' ? `[${p}]` : i === 0 ? String(p) : `.${String(p)}`)).join('');
}

/** The place a problem names, as its message begins: `model line 3, column 7`, or the field. */
function placeText(field: string, location?: ModelLocation): string {
  if (location) return `model line ${location.line}${location.column !== undefined ? `, column ${location.column}` : ''}`;
  return field;
}

/** The problem a BudgetError states. */
export function problemOf(e: BudgetError): BudgetProblem {
  return { code: e.code, field: e.field ?? '', ...(e.location ? { location: e.location } : {}), message: e.message };
}

/** The problem a schema issue states: `invalid_field`, with the place before the schema's words. */
export function problemOfIssue(issue: z.core.$ZodIssue): BudgetProblem & { code: 'invalid_field' } {
  const field = fieldPath(issue.path);
  return { code: 'invalid_field', field, message: field ? `${field}: ${issue.message}` : issue.message };
}

/** The problem of anything a computation threw: a BudgetError as it is, any other error as `internal`. */
export function problemOfFailure(e: unknown): BudgetProblem {
  if (e instanceof BudgetError) return problemOf(e);
  return { code: 'internal', field: '', message: e instanceof Error ? e.message : String(e) };
}

/** The problem as a BudgetError, to throw. */
export function problemError(p: BudgetProblem & { code: BudgetErrorCode }): BudgetError {
  return new BudgetError(p.code, p.message, p.field || undefined, p.location);
}

/** A problem's words without the place it begins with, for showing beside that place. */
export function problemWords(p: BudgetProblem): string {
  const place = placeText(p.field, p.location);
  return place && p.message.startsWith(`${place}: `) ? p.message.slice(place.length + 2) : p.message;
}
