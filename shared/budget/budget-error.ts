/**
 * A budget refused by the engine. `field` names the place in the budget file
 * (e.g. `inputs[2].distribution.u`, `model`, `correlations[0]`) so every user
 * interface can show the message beside the culprit.
 */
export class BudgetError extends Error {
  constructor(
    readonly code: BudgetErrorCode,
    message: string,
    readonly field?: string,
    /** For model errors: the line (1-based), column (1-based) and offending token. */
    readonly location?: ModelLocation,
  ) {
    super(message);
    this.name = 'BudgetError';
  }
}

export interface ModelLocation {
  line: number;
  column?: number;
  token?: string;
}

export type BudgetErrorCode =
  | 'invalid_file'
  | 'invalid_field'
  | 'model_syntax'
  | 'model_forbidden'
  | 'unknown_symbol'
  | 'duplicate_symbol'
  | 'unit'
  | 'not_finite'
  | 'correlation'
  | 'limit'
  /** No figure the engine can stand behind could be reported (see reportedResult). */
  | 'unreportable';
