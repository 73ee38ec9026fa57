import { derivative, parse } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { BudgetError } from '../../shared/budget/budget-error';
import { SYMBOLIC_LIMITS } from '../../shared/budget/limits';
import { computeBudget } from '../../shared/compute/compute-budget';
import { compileModel } from '../../shared/model/compile-model';
import { derivativeSizeBound, inlinedSizes, nodeCount, symbolsBelow, treeDepth } from '../../shared/model/expression-size';
import { parseModel } from '../../shared/model/parse-model';
import { budget, N } from '../support/budget-builder';

/** a1 = x, a_{k+1} = sin(a_k)·cos(a_k), …, y = a_n: the inlined tree is about 4^n nodes. */
const trigChain = (n: number) => ['a1 = x', ...Array.from({ length: n - 1 }, (_, i) => `a${i + 2} = sin(a${i + 1}) * cos(a${i + 1})`), `y = a${n}`].join('\n');
/** a1 = x, a_{k+1} = a_k·a_k, …: the inlined tree doubles at each line, y = x^(2^(n−1)). */
const squareChain = (n: number) => ['a1 = x', ...Array.from({ length: n - 1 }, (_, i) => `a${i + 2} = a${i + 1} * a${i + 1}`), `y = a${n}`].join('\n');
const compile = (model: string) => compileModel({ model, measurand: { symbol: 'y' }, inputs: [{ symbol: 'x' }], constants: [] });

describe('expression size (bounds of SYMBOLIC_LIMITS)', () => {
  it('counts nodes, inlined sizes and depth without building the inlined tree', () => {
    expect(nodeCount(parse('sin(a) * cos(a)'))).toBe(7); // *, sin(…), sin, a, cos(…), cos, a
    expect(treeDepth(parse('a + b + c'))).toBe(3);
    expect(treeDepth(parse('x'))).toBe(1);
    const { lines } = parseModel(squareChain(4), new Set(['x']), 'y');
    // size(a1) = 4 (x·k in parentheses); size(k+1) = 1 + 2·(size(k) + 1) → 4, 11, 25, 53; y adds one parenthesis
    expect([...inlinedSizes(lines, new Set(['x'])).values()]).toEqual([4, 11, 25, 53, 54]);
    // 60 doublings overflow no tree: the count is a number
    const big = parseModel(squareChain(60), new Set(['x']), 'y').lines;
    expect(inlinedSizes(big, new Set(['x'])).get('y')).toBeGreaterThan(1e18);
  });

  it('keeps symbolic partials for a small chain and agrees with the closed form', () => {
    const m = compile(squareChain(4)); // y = x^8
    expect(m.symbolicDerivatives.fallback).toBe('none');
    expect(m.partials[0]?.([1.1])).toBeCloseTo(8 * 1.1 ** 7, 12);
  });

  it.each([17, 40])('compiles a %i-line sin·cos chain with numerical partials and its value line by line', (n) => {
    const m = compile(trigChain(n));
    expect(m.symbolicDerivatives.fallback).toBe('model-size');
    expect(m.symbolicDerivatives.inlinedNodes).toBeGreaterThan(SYMBOLIC_LIMITS.symbolicModelNodes);
    expect(m.partials).toEqual([null]);
    expect(m.partialReads).toEqual([null]);
    // sin(a)·cos(a) = sin(2a)/2, iterated (closed form, double-angle identity)
    let a = 0.3;
    for (let k = 1; k < n; k++) a = Math.sin(2 * a) / 2;
    expect(m.value([0.3])).toBeCloseTo(a, 14);
  });

  it.each([15, 18, 60])('compiles a %i-line squaring chain with numerical partials', (n) => {
    const m = compile(squareChain(n));
    expect(m.symbolicDerivatives.fallback).toBe('model-size');
    expect(m.partials).toEqual([null]);
    expect(m.value([1])).toBe(1);
  });

  it('gives the sensitivity of a 17-line chain by central differences (JCGM 100:2008 5.1.3)', () => {
    const r = computeBudget(budget(trigChain(17), { x: N(0.3, 1e-3) }), { monteCarlo: false });
    const c = r.gum.contributions[0];
    expect(c.sensitivityMethod).toBe('numeric');
    // dy/dx = Π cos(2 a_k) over the 16 steps (chain rule on sin(2a)/2)
    let a = 0.3;
    let d = 1;
    for (let k = 1; k < 17; k++) {
      d *= Math.cos(2 * a);
      a = Math.sin(2 * a) / 2;
    }
    expect(c.sensitivity).toBeCloseTo(d, 7);
  });

  it('leaves partials to differences when used inputs × inlined nodes exceed the work bound', () => {
    const n = 250; // y = x0·x1·…·x249: 5n − 1 nodes, times n inputs
    const inputs = Array.from({ length: n }, (_, i) => ({ symbol: `x${i}` }));
    const m = compileModel({ model: `y = ${inputs.map((q) => q.symbol).join(' * ')}`, measurand: { symbol: 'y' }, inputs, constants: [] });
    expect(m.symbolicDerivatives.inlinedNodes).toBe(5 * n - 1); // n inputs of 4 nodes, n − 1 products
    expect(m.symbolicDerivatives.inlinedNodes).toBeLessThanOrEqual(SYMBOLIC_LIMITS.symbolicModelNodes);
    expect(n * m.symbolicDerivatives.inlinedNodes).toBeGreaterThan(SYMBOLIC_LIMITS.symbolicWork);
    expect(m.symbolicDerivatives.fallback).toBe('work');
    expect(m.partials.every((p) => p === null)).toBe(true);
    expect(m.value(inputs.map(() => 1))).toBe(1);
  });

  it('keeps an unused input at sensitivity 0 when the partials fall back', () => {
    const m = compileModel({ model: trigChain(17), measurand: { symbol: 'y' }, inputs: [{ symbol: 'x' }, { symbol: 'z' }], constants: [] });
    expect(m.partials[0]).toBeNull();
    expect(m.partials[1]?.([0.3, 1])).toBe(0);
    expect(m.partialReads[1]).toEqual([]);
  });

  it('differentiates a sum of many terms term by term: c_i of y = Σ a_k·b_k/(1 + b_k²) in closed form', () => {
    // ∂y/∂a_k = b_k/(1 + b_k²), ∂y/∂b_k = a_k·(1 − b_k²)/(1 + b_k²)² (quotient rule)
    const n = 30;
    const terms = Array.from({ length: n }, (_, k) => `a${k} * b${k} / (1 + b${k}^2)`);
    const symbols = Array.from({ length: n }, (_, k) => [`a${k}`, `b${k}`]).flat();
    const m = compileModel({ model: `y = ${terms.join(' + ')}`, measurand: { symbol: 'y' }, inputs: symbols.map((symbol) => ({ symbol })), constants: [] });
    expect(m.symbolicDerivatives.fallback).toBe('none');
    const x = symbols.map((_, i) => 1 + i / 7);
    for (let k = 0; k < n; k++) {
      const [a, b] = [x[2 * k], x[2 * k + 1]];
      expect(m.partials[2 * k]!(x)).toBeCloseTo(b / (1 + b * b), 14);
      expect(m.partials[2 * k + 1]!(x)).toBeCloseTo((a * (1 - b * b)) / (1 + b * b) ** 2, 14);
      expect(m.partialReads[2 * k]).toEqual([2 * k + 1]);
      expect(m.partialReads[2 * k + 1]).toEqual([2 * k, 2 * k + 1]);
    }
  });

  it('generates code that computes each line once', () => {
    // 60 doublings inlined would be 10^18 nodes; line by line it is 60 multiplications
    const m = compile(squareChain(60));
    expect(m.lineValues([1.0000001]).length).toBe(61);
    expect(m.value.toString().length).toBeLessThan(60 * 40);
  });

  function refusal(model: string, inputs: Record<string, ReturnType<typeof N>>): BudgetError {
    try {
      computeBudget(budget(model, inputs), { monteCarlo: false });
    } catch (e) {
      if (e instanceof BudgetError) return e;
      throw e;
    }
    throw new Error('accepted');
  }

  it('refuses, naming the line, only a single line nested too deep for any code', () => {
    const deepSum = `m = a\nY = a${' + a'.repeat(1200)}`;
    const e = refusal(deepSum, { a: N(1, 0.1) });
    expect(e.code).toBe('limit');
    expect(e.message).toBe('model line 2: the expression is nested deeper than 1000 operations; split it into intermediate lines');
    expect(e.location).toEqual({ line: 2 });
    const unary = refusal(`Y = ${'-'.repeat(5000)}a`, { a: N(1, 0.1) });
    expect(unary.code).toBe('limit');
    const parens = refusal(`Y = ${'('.repeat(65)}a${')'.repeat(65)}`, { a: N(1, 0.1) });
    expect(parens.message).toBe('model line 1, column 69: parentheses nested deeper than 64; split the expression into intermediate lines');
    // the same sum split over lines is accepted
    const split = ['s1 = a' + ' + a'.repeat(599), 's2 = a' + ' + a'.repeat(599), 'Y = s1 + s2 + a'].join('\n');
    expect(computeBudget(budget(split, { a: N(1, 0.1) }), { monteCarlo: false }).gum.estimate).toBe(1201);
  });
});

describe('derivativeSizeBound', () => {
  const models = [
    'x0 * x1 + x0 / x1',
    'x0 ^ x1 + x1 ^ 2',
    'sin(x0 * x1) / (1 + x0 ^ 2)',
    'sqrt(x0) * exp(x1 / x0) - log(x0 * x1)',
    'tan(asin(x0 / 2)) ^ (x1 + 1)',
    '(x0 * x1 * x0 * x1) / (x0 - x1 / x0)',
    'acos(x0) + atan(x1 * 3) + log10(x0) + abs(x1)',
  ];
  it.each(models)('bounds the size mathjs gives for %s', (text) => {
    const tree = parse(text);
    for (const v of ['x0', 'x1']) {
      const actual = nodeCount(derivative(tree, v, { simplify: false }));
      const bound = derivativeSizeBound(tree, v);
      expect(bound).toBeGreaterThanOrEqual(actual);
      expect(bound).toBeLessThan(6 * actual + 40); // a bound, not a refusal of everything
    }
    expect(derivativeSizeBound(tree, 'x9')).toBe(1); // derivative 0
  });

  it.each(models)('gives the same bound for %s with sizes and symbols shared between variables', (text) => {
    const tree = parse(text);
    const cache = { sizes: new Map(), symbols: symbolsBelow(tree) };
    for (const v of ['x1', 'x0', 'x9']) expect(derivativeSizeBound(tree, v, cache)).toBe(derivativeSizeBound(tree, v));
  });

  it('lists the symbols below each node, function names excepted', () => {
    const tree = parse('sin(x0 * x1) / (1 + x2 ^ 2)');
    const symbols = symbolsBelow(tree);
    expect([...(symbols.get(tree) ?? [])].sort()).toEqual(['x0', 'x1', 'x2']);
    const [numerator, denominator] = (tree as unknown as { args: Parameters<typeof symbols.get>[0][] }).args;
    expect([...(symbols.get(numerator) ?? [])].sort()).toEqual(['x0', 'x1']);
    expect([...(symbols.get(denominator) ?? [])]).toEqual(['x2']);
  });

  it('never builds the O(n²) derivative of a long product of one input', () => {
    const n = 200; // y = x^200 written as a product: bound ≈ 2.5 n² nodes
    const m = compile(`y = x${' * x'.repeat(n - 1)}`);
    expect(m.symbolicDerivatives.fallback).toBe('none');
    expect(m.symbolicDerivatives.oversized).toEqual([0]);
    expect(m.partials[0]).toBeNull();
    const r = computeBudget(budget(`y = x${' * x'.repeat(n - 1)}`, { x: N(1.001, 1e-6) }), { monteCarlo: false });
    expect(r.gum.contributions[0].sensitivityMethod).toBe('numeric');
    expect(r.gum.contributions[0].sensitivity / (n * 1.001 ** (n - 1)) - 1).toBeCloseTo(0, 6); // d/dx xⁿ = n xⁿ⁻¹, to a central difference's rounding
  });
});
