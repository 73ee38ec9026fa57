/*
 * The engine's warnings: each one a code from one closed list, so a screen, the
 * report, the PDF, the command line and the signing brief decide by the code
 * and show the message; none of them reads the words.
 */

/**
 * What a warning is about:
 * - `input-not-in-model`: an input the model does not use;
 * - `derivatives-disagree`: the symbolic and numerical c_i differ (JCGM 100:2008 5.1.3): the model may not be smooth;
 * - `numerical-step-exceeds-u`: the difference step for c_i is wider than u(x_i): c_i is an average slope;
 * - `first-order-zero-correlated`: u_c = 0 at first order and the higher-order terms are not evaluated with correlated inputs;
 * - `second-order-not-evaluated`: too many inputs for the higher-order terms (5.1.2 note);
 * - `second-order-omitted`: the higher-order terms leave out t inputs with ν ≤ 4 (no fourth moment);
 * - `second-order-significant`: the higher-order terms raise u_c by more than 5 %: the model is markedly non-linear;
 * - `not-reportable`: the first-order u_c, k and U must not be reported (`GumUnreportable`);
 * - `dof-undefined-variance`: an input is drawn from t with ν ≤ 2 (e.g. n ≤ 3 observations), which has no variance (JCGM 101:2008 6.4.9);
 * - `correlated-drawn-gaussian`: correlated inputs that state ν are drawn jointly Gaussian (JCGM 101:2008 6.4.8);
 * - `adaptive-not-possible`: the adaptive procedure (7.9) cannot judge stability without a variance; fixed trials were run;
 * - `monte-carlo-trials-capped`: the trials asked for exceed the cap;
 * - `monte-carlo-not-stable`: the adaptive procedure stopped at the cap before the 7.9.4 criterion held;
 * - `monte-carlo-constant-output`: every trial gave the same value, u = 0;
 * - `recorded`: a warning stored as words alone, before warnings had codes.
 */
export type WarningCode =
  | 'input-not-in-model'
  | 'derivatives-disagree'
  | 'numerical-step-exceeds-u'
  | 'first-order-zero-correlated'
  | 'second-order-not-evaluated'
  | 'second-order-omitted'
  | 'second-order-significant'
  | 'not-reportable'
  | 'dof-undefined-variance'
  | 'correlated-drawn-gaussian'
  | 'adaptive-not-possible'
  | 'monte-carlo-trials-capped'
  | 'monte-carlo-not-stable'
  | 'monte-carlo-constant-output'
  | 'recorded';

export const WARNING_CODES: readonly WarningCode[] = [
  'input-not-in-model',
  'derivatives-disagree',
  'numerical-step-exceeds-u',
  'first-order-zero-correlated',
  'second-order-not-evaluated',
  'second-order-omitted',
  'second-order-significant',
  'not-reportable',
  'dof-undefined-variance',
  'correlated-drawn-gaussian',
  'adaptive-not-possible',
  'monte-carlo-trials-capped',
  'monte-carlo-not-stable',
  'monte-carlo-constant-output',
  'recorded',
];

export interface BudgetWarning {
  code: WarningCode;
  /** In words, for the reader. */
  message: string;
  /** The input quantities the warning concerns, by symbol; absent when it concerns the whole budget. */
  symbols?: string[];
  /** For a warning about one input: its place in the budget file (`inputs[2]`). */
  field?: string;
}

/** A warning about the whole budget. */
export function budgetWarning(code: WarningCode, message: string): BudgetWarning {
  return { code, message };
}

/** A warning about the input quantity `symbol`, at index `index` of the budget's inputs when known. */
export function inputWarning(code: WarningCode, message: string, symbol: string, index?: number): BudgetWarning {
  return { code, message, symbols: [symbol], ...(index !== undefined ? { field: `inputs[${index}]` } : {}) };
}

/** A warning about several input quantities. */
export function inputsWarning(code: WarningCode, message: string, symbols: readonly string[]): BudgetWarning {
  return { code, message, symbols: [...symbols] };
}
