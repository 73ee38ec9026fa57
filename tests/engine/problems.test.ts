import { describe, expect, it } from 'vitest';
import { BudgetError } from '../../shared/budget/budget-error';
import { budgetProblems, validateBudget } from '../../shared/budget/budget-file';
import { problemOf, problemOfFailure, problemWords } from '../../shared/budget/problems';
import { computeBudget } from '../../shared/compute/compute-budget';
import { budget, N } from '../support/budget-builder';

/* One builder turns a refusal or a schema issue into the problem the editor and the server both carry. */
const refusal = (f: () => unknown): BudgetError => {
  try {
    f();
  } catch (e) {
    if (e instanceof BudgetError) return e;
    throw e;
  }
  throw new Error('not refused');
};

describe('the problem builder', () => {
  it('a model syntax error: code model_syntax, field model, line and column of the model', () => {
    const p = problemOf(refusal(() => computeBudget(budget('q = a +\nY = q * )', { a: N(1, 0.1) }), { monteCarlo: false })));
    expect(p.code).toBe('model_syntax');
    expect(p.field).toBe('model');
    expect(p.location?.line).toBe(1);
    expect(p.location?.column).toEqual(expect.any(Number));
    expect(p.message.startsWith(`model line 1, column ${p.location!.column}: `)).toBe(true);
    expect(problemWords(p)).toBe(p.message.slice(`model line 1, column ${p.location!.column}: `.length));
  });

  it('a second-line error names line 2', () => {
    const p = problemOf(refusal(() => computeBudget(budget('q = a\nY = q * * 2', { a: N(1, 0.1) }), { monteCarlo: false })));
    expect([p.code, p.field, p.location?.line]).toEqual(['model_syntax', 'model', 2]);
  });

  it('an unknown symbol names its token', () => {
    const p = problemOf(refusal(() => computeBudget(budget('Y = a + zz', { a: N(1, 0.1) }), { monteCarlo: false })));
    expect(p).toMatchObject({ code: 'unknown_symbol', field: 'model', location: { line: 1, token: 'zz' } });
  });

  it('a schema issue: invalid_field with its path, alike from validateBudget and budgetProblems', () => {
    const doc = budget('Y = a', { a: N(1, -1) });
    const [p] = budgetProblems(doc);
    expect(p).toEqual({ code: 'invalid_field', field: 'inputs[0].distribution.u', message: 'inputs[0].distribution.u: must be greater than 0' });
    expect(p.location).toBeUndefined();
    expect(problemWords(p)).toBe('must be greater than 0');
    expect(problemOf(refusal(() => validateBudget(doc)))).toEqual(p);
  });

  it('anything else thrown is internal, for the budget as a whole', () => {
    expect(problemOfFailure(new RangeError('boom'))).toEqual({ code: 'internal', field: '', message: 'boom' });
  });
});
