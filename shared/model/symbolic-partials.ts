import type { MathNode } from 'mathjs';
import { ConstantNode, OperatorNode, ParenthesisNode, SymbolNode, derivative } from './math';
import { SYMBOLIC_LIMITS } from '../budget/limits';
import { UnsupportedInCode, toJavaScript } from './codegen';
import { derivativeSizeBound, inlinedSizes } from './expression-size';
import type { ModelLine } from './parse-model';

export type ScalarFunction = (x: ArrayLike<number>) => number;

/** Why the partial derivatives are numerical rather than symbolic (none: symbolic where mathjs can form them). */
export type SymbolicFallback = 'none' | 'model-size' | 'work';

export interface SymbolicPartials {
  /** ∂f/∂x_i (in measurand unit per input unit); null where it is left to central differences. */
  partials: (ScalarFunction | null)[];
  /** For each partial, the input indices its code reads; null where there is no symbolic partial. */
  reads: (readonly number[] | null)[];
  /** Nodes of the measurand's tree with every intermediate line inlined. */
  inlinedNodes: number;
  fallback: SymbolicFallback;
  /** Inputs whose derivative tree could exceed SYMBOLIC_LIMITS.derivativeNodes (left to differences, never built). */
  oversizedDerivatives: number[];
}

/**
 * The measurand's expression with inputs replaced by `x_i·k_i`, constants by
 * their SI values and intermediates by their own trees, built from the last
 * line down so that lines the measurand does not use are never inlined.
 */
function inlineMeasurand(lines: readonly ModelLine[], inputIndex: ReadonlyMap<string, number>, factors: readonly number[], constantsSI: ReadonlyMap<string, number>): MathNode {
  const lineOf = new Map(lines.map((l) => [l.symbol, l]));
  const inlined = new Map<string, MathNode>();
  const inline = (line: ModelLine): MathNode => {
    const done = inlined.get(line.symbol);
    if (done) return done;
    const tree = line.expression.transform((node, path) => {
      if (path === 'fn' || node.type !== 'SymbolNode') return node;
      const name = (node as SymbolNode).name;
      const i = inputIndex.get(name);
      if (i !== undefined) return new ParenthesisNode(new OperatorNode('*', 'multiply', [new SymbolNode(`x${i}`), new ConstantNode(factors[i])]));
      const c = constantsSI.get(name);
      if (c !== undefined) return new ConstantNode(c);
      const earlier = lineOf.get(name);
      if (earlier && earlier !== line) return new ParenthesisNode(inline(earlier));
      return node;
    });
    inlined.set(line.symbol, tree);
    return tree;
  };
  return inline(lines[lines.length - 1]);
}

function compilePartial(tree: MathNode, i: number, scale: number): { partial: ScalarFunction; reads: number[] } | 'oversized' | null {
  try {
    if (derivativeSizeBound(tree, `x${i}`) > SYMBOLIC_LIMITS.derivativeNodes) return 'oversized';
    const d = derivative(tree, `x${i}`, { simplify: false });
    const reads = new Set<number>();
    const code = toJavaScript(d, (name) => {
      const m = /^x(\d+)$/.exec(name);
      if (!m) throw new UnsupportedInCode(name);
      reads.add(Number(m[1]));
      return `x[${m[1]}]`;
    });
    const partial = new Function('x', `"use strict"; return (${code}) * ${scale};`) as ScalarFunction;
    return { partial, reads: [...reads].sort((a, b) => a - b) };
  } catch {
    return null;
  }
}

/**
 * Symbolic partial derivatives ∂f/∂x_i of the inlined model (mathjs
 * `derivative`), compiled to JavaScript and scaled to measurand unit per input
 * unit. Inlining repeats an intermediate at every use, so its size can grow
 * exponentially with the number of lines, and a derivative is larger than its
 * tree: the inlined size is counted first without building it, and the
 * partials are left to central differences (JCGM 100:2008 5.1.3 allows
 * numerical sensitivity coefficients) when it exceeds SYMBOLIC_LIMITS.symbolicModelNodes,
 * when used inputs × inlined nodes exceeds SYMBOLIC_LIMITS.symbolicWork, or, per input,
 * when the bound on the derivative's size (`derivativeSizeBound`) exceeds
 * SYMBOLIC_LIMITS.derivativeNodes.
 */
export function symbolicPartials(
  lines: readonly ModelLine[],
  inputSymbols: readonly string[],
  used: ReadonlySet<string>,
  factors: readonly number[],
  constantsSI: ReadonlyMap<string, number>,
  scale: number,
): SymbolicPartials {
  const inputIndex = new Map(inputSymbols.map((s, i) => [s, i]));
  const measurand = lines[lines.length - 1].symbol;
  const inlinedNodes = inlinedSizes(lines, new Set(inputSymbols)).get(measurand) as number;
  const usedCount = inputSymbols.filter((s) => used.has(s)).length;
  const unused = (s: string) => !used.has(s);
  const fallback: SymbolicFallback =
    inlinedNodes > SYMBOLIC_LIMITS.symbolicModelNodes ? 'model-size' : usedCount * inlinedNodes > SYMBOLIC_LIMITS.symbolicWork ? 'work' : 'none';
  if (fallback !== 'none') {
    return {
      partials: inputSymbols.map((s) => (unused(s) ? () => 0 : null)),
      reads: inputSymbols.map((s) => (unused(s) ? [] : null)),
      inlinedNodes,
      fallback,
      oversizedDerivatives: [],
    };
  }
  const tree = inlineMeasurand(lines, inputIndex, factors, constantsSI);
  const oversizedDerivatives: number[] = [];
  const compiled = inputSymbols.map((s, i) => {
    if (unused(s)) return { partial: () => 0, reads: [] };
    const p = compilePartial(tree, i, scale);
    if (p === 'oversized') oversizedDerivatives.push(i);
    return p === 'oversized' ? null : p;
  });
  return {
    partials: compiled.map((p) => p?.partial ?? null),
    reads: compiled.map((p) => p?.reads ?? null),
    inlinedNodes,
    fallback,
    oversizedDerivatives,
  };
}
