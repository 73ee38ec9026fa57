import { BudgetError } from './budget-error';
import { problemError, problemOfIssue, type BudgetProblem } from './problems';
import { budgetDocumentSchema, type BudgetDocument } from './schema';

/**
 * Validates a parsed budget file (any JSON value) against format v1.
 * Unknown fields are kept; the first problem is thrown as a BudgetError naming its field.
 */
export function validateBudget(value: unknown): BudgetDocument {
  const parsed = budgetDocumentSchema.safeParse(value);
  if (!parsed.success) throw problemError(problemOfIssue(parsed.error.issues[0]));
  return parsed.data;
}

/** All problems of a budget at once, for forms that mark every field. */
export function budgetProblems(value: unknown): BudgetProblem[] {
  const parsed = budgetDocumentSchema.safeParse(value);
  if (parsed.success) return [];
  return parsed.error.issues.map(problemOfIssue);
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
