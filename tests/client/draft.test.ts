import type { BudgetProblem } from '../../shared/budget/problems';
import { describe, expect, it } from 'vitest';
import type { BudgetDocument } from '../../shared/budget/schema';
import { validateBudget } from '../../shared/budget/budget-file';
import { documentText, draftStartedBehind, draftToOffer, generalProblems, isUnsaved, modelProblem, newDocument, newInput } from '../../src/features/editor/draft';
import type { StoredDraft } from '../../src/features/editor/draft-storage';

const doc = (over: Partial<BudgetDocument> = {}): BudgetDocument => ({ ...newDocument('abc123'), ...over });
const kept = (document: BudgetDocument, baseVersion = 3): StoredDraft => ({ document, baseVersion, savedAt: 1_700_000_000_000 });

describe('newDocument: the starting point of a new budget', () => {
  it('is a budget the engine accepts, with the seed suffix given', () => {
    const d = newDocument('abc123');
    expect(() => validateBudget(d)).not.toThrow();
    expect(d.monteCarlo?.seed).toBe('dubito-abc123');
    expect(d.inputs.map((q) => q.symbol)).toEqual(['x1', 'x2']);
  });

  it('runs the Monte Carlo method with the trials a budget file without them gets, 10⁶', () => {
    expect(newDocument('abc123').monteCarlo?.trials).toBe(1_000_000);
  });

  it('gives each new budget a seed of its own', () => {
    expect(newDocument().monteCarlo?.seed).not.toBe(newDocument().monteCarlo?.seed);
  });
});

describe('isUnsaved: whether the draft has something to save', () => {
  it('is unsaved for a new budget, even unchanged', () => {
    expect(isUnsaved(doc(), '')).toBe(true);
  });

  it('is saved when the draft is the stored document, unsaved after any change', () => {
    const stored = doc();
    expect(isUnsaved(doc(), documentText(stored))).toBe(false);
    expect(isUnsaved(doc({ title: 'Gauge block 50 mm' }), documentText(stored))).toBe(true);
    expect(isUnsaved(doc({ model: 'y = x1 - x2' }), documentText(stored))).toBe(true);
  });

  it('counts a change put back as no change', () => {
    const stored = doc();
    const edited = { ...stored, title: 'other' };
    expect(isUnsaved({ ...edited, title: stored.title }, documentText(stored))).toBe(false);
  });
});

describe('draftToOffer and draftStartedBehind: the draft kept in the browser', () => {
  it('offers a kept draft that differs from the document on screen', () => {
    const d = kept(doc({ title: 'changed' }));
    expect(draftToOffer(d, doc(), false)).toBe(d);
  });

  it('offers nothing when the kept draft is what is on screen, when none is kept, or over a past version', () => {
    expect(draftToOffer(kept(doc()), doc(), false)).toBeNull();
    expect(draftToOffer(null, doc(), false)).toBeNull();
    expect(draftToOffer(kept(doc({ title: 'changed' })), doc(), true)).toBeNull();
  });

  it('says which version a draft started from only when the budget has moved on since', () => {
    expect(draftStartedBehind(kept(doc(), 3), 5)).toBe(3);
    expect(draftStartedBehind(kept(doc(), 5), 5)).toBeNull();
    expect(draftStartedBehind(kept(doc(), 0), 5)).toBeNull(); // a new budget's draft
    expect(draftStartedBehind(kept(doc(), 3), undefined)).toBeNull();
  });
});

describe('newInput: the input added by "Add input"', () => {
  it('is the next x<n> after the inputs there are', () => {
    expect(newInput(doc().inputs)).toEqual({ symbol: 'x3', distribution: { kind: 'normal', value: 0, u: 1 } });
  });

  it('skips a symbol in use', () => {
    const inputs = [...doc().inputs, { symbol: 'x3', distribution: { kind: 'normal' as const, value: 0, u: 1 } }].filter((q) => q.symbol !== 'x1');
    // two inputs would suggest x3, which is taken
    expect(newInput(inputs).symbol).toBe('x4');
  });

  it('starts at x1 in an empty list', () => {
    expect(newInput([]).symbol).toBe('x1');
  });
});

describe('modelProblem and generalProblems: where each problem is shown', () => {
  const problems: BudgetProblem[] = [
    { code: 'invalid_field', field: 'model', message: 'model line 1: unknown symbol "z"' },
    { code: 'invalid_field', field: 'inputs[0].distribution.u', message: 'must be greater than 0' },
    { code: 'invalid_field', field: '', message: 'live recompute stopped after 20 s' },
    { code: 'invalid_field', field: 'monteCarlo', message: 'monteCarlo: too few trials' },
    { code: 'invalid_field', field: 'coverageProbability', message: 'must be below 1' },
    { code: 'invalid_field', field: 'inputs', message: 'inputs: at least one input' },
    { code: 'invalid_field', field: 'title', message: 'title: required' },
    { code: 'invalid_field', field: 'measurand.unit', message: 'unknown unit' },
  ];

  it('gives the model editor the model problem', () => {
    expect(modelProblem(problems)?.message).toBe('model line 1: unknown symbol "z"');
    expect(modelProblem([])).toBeNull();
  });

  it('lists above the table the problems with no field on the page, and leaves field problems beside their fields', () => {
    expect(generalProblems(problems).map((p) => p.field)).toEqual(['', 'monteCarlo', 'coverageProbability', 'inputs', 'title']);
  });
});
