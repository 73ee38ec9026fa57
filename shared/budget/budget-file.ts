import type { z } from 'zod';
import { BudgetError } from './budget-error';
import { budgetDocumentSchema, type BudgetDocument } from './schema';

/** Renders a zod path as the budget file writes it: `inputs[2].distribution.u`. */
function fieldPath(path: readonly PropertyKey[]): string {
  return path
    .map((p, i) => (typeof p === 'number' ? `[${p}]` : i === 0 ? String(p) : `.${String(p)}`))
    .join('');
}

function firstIssue(error: z.ZodError): BudgetError {
  const issue = error.issues[0];
  const field = fieldPath(issue.path);
  const message = field ? `${field}: ${issue.message}` : issue.message;
  return new BudgetError('invalid_field', message, field || undefined);
}

/**
 * Validates a parsed budget file (any JSON value) against format v1.
 * Unknown fields are kept; the first problem is thrown as a BudgetError naming its field.
 */
export function validateBudget(value: unknown): BudgetDocument {
  const parsed = budgetDocumentSchema.safeParse(value);
  if (!parsed.success) throw firstIssue(parsed.error);
  return parsed.data;
}

/** All problems of a budget at once, for forms that mark every field. */
export function budgetProblems(value: unknown): { field: string; message: string }[] {
  const parsed = budgetDocumentSchema.safeParse(value);
  if (parsed.success) return [];
  return parsed.error.issues.map((i) => ({ field: fieldPath(i.path), message: i.message }));
}

/** Parses the text of a budget file. */
export function parseBudgetFile(text: string): BudgetDocument {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    throw new BudgetError('invalid_file', `not a JSON document: ${(e as Error).message}`);
  }
  return validateBudget(json);
}

/** Writes a budget file: two-space JSON, unknown fields included. */
export function serializeBudget(doc: BudgetDocument): string {
  return `${JSON.stringify(doc, null, 2)}\n`;
}
