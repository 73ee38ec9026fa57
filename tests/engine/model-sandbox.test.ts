import { describe, expect, it } from 'vitest';
import { BudgetError } from '../../shared/budget/budget-error';
import { computeBudget } from '../../shared/compute/compute-budget';
import { budget, N } from '../support/budget-builder';

function refusal(model: string, inputs = { a: N(1, 0.1), b: N(2, 0.1) }): BudgetError {
  try {
    computeBudget(budget(model, inputs), { monteCarlo: false });
  } catch (e) {
    if (e instanceof BudgetError) return e;
    throw e;
  }
  throw new Error(`model was accepted: ${model}`);
}

// The model language: arithmetic, ^, parentheses, numbers and the whitelisted functions only (budget file v1).
describe('model sandbox refusals name the token', () => {
  const cases: [string, string, string][] = [
    ['Y = f(x) = a', 'a function definition', 'f(x) = a'],
    ['g(x) = x^2\nY = a', 'a function definition', 'g(x) = x ^ 2'],
    ['Y = a.b', 'property or index access', 'a.b'],
    ['Y = a[1]', 'index', 'a[1]'],
    ['a[1] = 2\nY = a', 'plain name', 'a[1]'],
    ['Y = "text"', 'not allowed', 'text'],
    ['Y = [a, b]', 'matrix', '[a, b]'],
    ['Y = evaluate("1+1")', 'the function "evaluate" is not allowed', 'evaluate'],
    ['Y = import(a)', 'the function "import" is not allowed', 'import'],
    ['Y = parse(a)', 'the function "parse" is not allowed', 'parse'],
    ['Y = createUnit(a)', 'the function "createUnit" is not allowed', 'createUnit'],
    ['Y = simplify(a)', 'the function "simplify" is not allowed', 'simplify'],
    ['Y = derivative(a, b)', 'the function "derivative" is not allowed', 'derivative'],
    ['Y = a mod b', 'the operator "mod" is not allowed', 'mod'],
    ['Y = a!', 'the operator "!" is not allowed', '!'],
    ['Y = a > b ? a : b', 'conditional', '(a > b) ? a : b'],
    ['Y = a == b', 'the operator "==" is not allowed', '=='],
    ['Y = 1:3', 'range', '1:3'],
    ['Y = a; b', 'several statements', ''],
    ['Y = a + c', 'unknown symbol "c"', 'c'],
    ['Y = 3 cm', 'unknown symbol "cm"', 'cm'],
    ['Y = sqrt(a, b)', '"sqrt" takes 1 argument', 'sqrt'],
    ['Y = atan2(a)', '"atan2" takes 2 arguments', 'atan2'],
    ['Y = (a + b', 'Parenthesis ) expected', ''],
  ];
  it.each(cases)('%s', (model, message, token) => {
    const e = refusal(model);
    expect(e.message).toContain(message);
    expect(e.field).toBe('model');
    if (token) expect(e.location?.token).toBe(token);
  });

  it('points at the line and column of a syntax error', () => {
    const e = refusal('m1 = a * 2\nY = m1 + * b');
    expect(e.code).toBe('model_syntax');
    expect(e.location?.line).toBe(2);
    expect(e.message).toMatch(/^model line 2, column \d+/);
  });

  it('refuses an intermediate line without a name, a later-defined symbol and a reassignment', () => {
    expect(refusal('a + b\nY = a').message).toContain('"name = expression"');
    expect(refusal('m1 = m2 * 2\nm2 = a\nY = m1').message).toContain('unknown symbol "m2"');
    expect(refusal('a = 3\nY = a').message).toContain('already an input');
    expect(refusal('m1 = a\nm1 = b\nY = m1').message).toContain('earlier line');
    expect(refusal('pi = 3\nY = a').message).toContain('reserved');
  });

  it('refuses a last line that assigns another name than the measurand', () => {
    const doc = budget('Z = a + b', { a: N(1, 0.1), b: N(2, 0.1) });
    doc.measurand.symbol = 'Y';
    expect(() => computeBudget(doc, { monteCarlo: false })).toThrow('the last line assigns "Z", but the measurand is "Y"');
  });

  it('accepts intermediate lines, comments and names mathjs knows as units or constants', () => {
    const doc = budget('# two steps\nm = 2 * V  # V is an input here\nphi = m + pi - pi\nY = phi * e / e', { V: N(3, 0.1) });
    doc.measurand.symbol = 'Y';
    const r = computeBudget(doc, { monteCarlo: false });
    expect(r.gum.estimate).toBeCloseTo(6, 12);
    expect(r.gum.intermediates.map((i) => i.symbol)).toEqual(['m', 'phi']);
    expect(r.gum.contributions[0].sensitivity).toBeCloseTo(2, 12);
  });

  // Two operands side by side are a product to mathjs; in a model they are a missing operator.
  const implicit: [string, number, number, string][] = [
    ['y = x1 x2', 1, 7, 'x1 x2'],
    ['m = 2 * x1\ny = m x2', 2, 6, 'm x2'],
    ['y = 2 x1', 1, 6, '2 x1'],
    ['y = 2x1', 1, 6, '2 x1'],
    ['y = x1 (x2 + 1)', 1, 7, 'x1 (x2 + 1)'],
    ['y = (x1 + 1)(x2 + 1)', 1, 12, '(x1 + 1) (x2 + 1)'],
    ['  y = x1 + x1 x2', 1, 14, 'x1 x2'],
    ['y = x1 * 3 mm', 1, 11, '3 mm'],
  ];
  it.each(implicit)('refuses the implicit multiplication in %j at line %i, column %i', (model, line, column, token) => {
    const e = refusal(model, { x1: N(1, 0.1), x2: N(2, 0.1), mm: N(1, 0.1) } as never);
    expect(e.code).toBe('model_syntax');
    expect(e.message).toMatch(new RegExp(`^model line ${line}, column ${column}: an operator is missing`));
    expect(e.location).toEqual({ line, column, token });
  });

  it('reads the typeset operators − × · ⋅ as - * * * (columns unchanged)', () => {
    const r = computeBudget(budget('y = a − b × a · b ⋅ 2', { a: N(2, 0.1), b: N(3, 0.1) }), { monteCarlo: false });
    expect(r.gum.estimate).toBe(2 - 3 * 2 * 3 * 2); // −34
    expect(r.gum.contributions.map((c) => c.sensitivity)).toEqual([1 - 3 * 3 * 2, -(2 * 2 * 3 * 2)]);
    const e = refusal('y = a − × b');
    expect(e.message).toMatch(/^model line 1, column 9:/); // the × as written
  });

  it('accepts a bare expression on the last line as the measurand', () => {
    const r = computeBudget(budget('a * b', { a: N(2, 0.1), b: N(3, 0.1) }), { monteCarlo: false });
    expect(r.gum.estimate).toBe(6);
  });

  it('refuses a model longer than 20 000 characters (budget file v1 limits)', () => {
    const long = `Y = a${' + a'.repeat(5001)}`;
    const e = refusal(long);
    expect(e.code).toBe('limit');
    expect(e.message).toContain('20000');
  });
});
