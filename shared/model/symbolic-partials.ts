import type { MathNode } from 'mathjs';
import { ConstantNode, OperatorNode, ParenthesisNode, SymbolNode, derivative } from './math';
import { SYMBOLIC_LIMITS } from '../budget/limits';
import { UnsupportedInCode, toJavaScript } from './codegen';
import { derivativeSizeBound, inlinedSizes, symbolsBelow, type DerivativeBoundCache, type SymbolsBelow } from './expression-size';
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

/** Prefix of the names that stand for subtrees without the variable while it is differentiated. */
const HELD = '\u0000held';

/**
 * The tree with every largest subtree that does not contain `variable` (other
 * than a single constant or name) replaced by a name of its own, listed in
 * `held`. mathjs `derivative` treats any subtree without the variable as a
 * constant and only ever copies it, and its special cases look at constant
 * leaves alone, so the derivative of this tree is the derivative of `tree`
 * with those names in place of the subtrees: same rules, but the work is that
 * of the part that contains the variable (in a sum of many terms, one term).
 */
function holdConstantParts(tree: MathNode, variable: string, symbols: SymbolsBelow, held: MathNode[]): MathNode {
  const hold = (node: MathNode): MathNode => {
    if (symbols.get(node)?.has(variable)) return node.map((child) => hold(child));
    if (node.type === 'ConstantNode' || node.type === 'SymbolNode') return node;
    held.push(node);
    return new SymbolNode(`${HELD}${held.length - 1}`);
  };
  return hold(tree);
}

/** JavaScript and the input indices it reads, of one held subtree; shared by the partials of all inputs. */
type HeldCode = { code: string; reads: number[] };

function compilePartial(tree: MathNode, i: number, scale: number, cache: DerivativeBoundCache, heldCode: Map<MathNode, HeldCode>): { partial: ScalarFunction; reads: number[] } | 'oversized' | null {
  try {
    if (derivativeSizeBound(tree, `x${i}`, cache) > SYMBOLIC_LIMITS.derivativeNodes) return 'oversized';
    const held: MathNode[] = [];
    const d = derivative(holdConstantParts(tree, `x${i}`, cache.symbols, held), `x${i}`, { simplify: false });
    const reads = new Set<number>();
    const input = (name: string, into: Set<number>): string => {
      const m = /^x(\d+)$/.exec(name);
      if (!m) throw new UnsupportedInCode(name);
      into.add(Number(m[1]));
      return `x[${m[1]}]`;
    };
    const code = toJavaScript(d, (name) => {
      if (!name.startsWith(HELD)) return input(name, reads);
      const subtree = held[Number(name.slice(HELD.length))];
      let known = heldCode.get(subtree);
      if (!known) {
        const own = new Set<number>();
        known = { code: toJavaScript(subtree, (n) => input(n, own)), reads: [...own] };
        heldCode.set(subtree, known);
      }
      for (const r of known.reads) reads.add(r);
      return known.code;
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
  const fallback: SymbolicFallback = inlinedNodes > SYMBOLIC_LIMITS.symbolicModelNodes ? 'model-size' : usedCount * inlinedNodes > SYMBOLIC_LIMITS.symbolicWork ? 'work' : 'none';
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
  const heldCode = new Map<MathNode, HeldCode>();
  const cache: DerivativeBoundCache = { sizes: new Map(), symbols: symbolsBelow(tree) };
  const compiled = inputSymbols.map((s, i) => {
    if (unused(s)) return { partial: () => 0, reads: [] };
    const p = compilePartial(tree, i, scale, cache, heldCode);
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
