import { describe, expect, it } from 'vitest';
import { BudgetError } from '../../shared/budget/budget-error';
import { parseModel } from '../../shared/model/parse-model';

// A model edit re-reads every line; the lines kept parsed must give exactly what a fresh parse gives.
describe('parsing a model again after a one-line edit', () => {
  const quantities = new Set(['a', 'b', 'c']);
  const before = 'u = a * b\nv = u / (1 + c^2)\ny = v - c';
  const after = 'u = a * b\nv = u / (2 + c^2)\ny = v - c';

  it('shares the unchanged lines and reads the edited one afresh', () => {
    const first = parseModel(before, quantities, 'y');
    const second = parseModel(after, quantities, 'y');
    expect(second.lines[0].expression).toBe(first.lines[0].expression);
    expect(second.lines[2].expression).toBe(first.lines[2].expression);
    expect(second.lines[1].expression.toString()).toBe('u / (2 + c ^ 2)');
    expect([...second.usedSymbols].sort()).toEqual(['a', 'b', 'c']);
  });

  it('still refuses, with its line, what a line that was parsed before defines twice', () => {
    parseModel(before, quantities, 'y');
    // "u = a * b" is kept parsed; defining u again on line 2 is refused all the same.
    expect(() => parseModel('u = a * b\nu = a * b\ny = u', quantities, 'y')).toThrow(BudgetError);
    expect(() => parseModel('u = a * b\nu = a * b\ny = u', quantities, 'y')).toThrow(/line 2: "u" is already defined by an earlier line/);
  });

  it('refuses an unknown name in a line that was parsed before in a budget that defined it', () => {
    parseModel('y = a * d', new Set(['a', 'd']), 'y');
    expect(() => parseModel('y = a * d', quantities, 'y')).toThrow(BudgetError);
  });
});
