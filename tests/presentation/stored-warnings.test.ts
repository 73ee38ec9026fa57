import { describe, expect, it } from 'vitest';
import type { BudgetResult } from '../../shared/budget/result';
import { readResult, readStoredResult, storedWarning } from '../../shared/budget/stored-result';
import { computeBudget } from '../../shared/compute/compute-budget';
import { presentResult } from '../../shared/presentation/result-model';
import { budget, N } from '../support/budget-builder';

/* Versions are never rewritten: a result stored while warnings were words still reads, as `recorded` warnings. */
const doc = budget('Y = x^2 + a', { x: N(1, 0.5), a: N(0, 0.1), spare: N(1, 1) });
const fresh = computeBudget(doc, { monteCarlo: false });
const asStoredBefore = (r: BudgetResult) => JSON.stringify({ ...r, warnings: r.warnings.map((w) => w.message) });

describe('results stored with warnings in words', () => {
  it('reads each old warning as { code: recorded, message }, with the inputs its words name', () => {
    const old = readStoredResult(asStoredBefore(fresh));
    expect(old.warnings).toHaveLength(fresh.warnings.length);
    expect(old.warnings.every((w) => w.code === 'recorded')).toBe(true);
    expect(old.warnings.map((w) => w.message)).toEqual(fresh.warnings.map((w) => w.message));
    expect(old.warnings.find((w) => w.message.includes('"spare"'))).toEqual({ code: 'recorded', message: 'The input "spare" does not appear in the model.', symbols: ['spare'] });
    expect(old.warnings.find((w) => w.message.startsWith('Second-order'))?.symbols).toBeUndefined();
  });

  it('leaves a result of today as it is', () => {
    expect(readResult(fresh)).toBe(fresh);
    expect(readStoredResult(JSON.stringify(fresh))).toEqual(fresh);
  });

  it('a code it does not know, or no message, still reads', () => {
    expect(storedWarning({ code: 'from-a-later-engine', message: 'later' }, [])).toEqual({ code: 'recorded', message: 'later' });
    expect(storedWarning({ code: 'monte-carlo-not-stable', message: 'm' }, [])).toEqual({ code: 'monte-carlo-not-stable', message: 'm' });
    expect(storedWarning('x is "a" word', ['a', 'b'])).toEqual({ code: 'recorded', message: 'x is "a" word', symbols: ['a'] });
  });

  it('the result model places an old warning beside the input it names and shows the others apart, as for a new result', () => {
    const now = presentResult(doc, fresh);
    const then = presentResult(doc, JSON.parse(asStoredBefore(fresh)) as BudgetResult);
    const row = (m: typeof now, s: string) => m.budget.rows.find((r) => r.symbol === s)!;
    expect(row(now, 'spare').warnings).toEqual([{ code: 'input-not-in-model', message: 'The input "spare" does not appear in the model.' }]);
    expect(row(then, 'spare').warnings).toEqual([{ code: 'recorded', message: 'The input "spare" does not appear in the model.' }]);
    expect(now.warnings.map((w) => w.code)).toEqual(['second-order-significant']);
    expect(then.warnings.map((w) => [w.code, w.message])).toEqual(now.warnings.map((w) => ['recorded', w.message]));
  });
});
