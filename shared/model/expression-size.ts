import type { MathNode } from 'mathjs';
import type { ModelLine } from './parse-model';

/** Nodes of one expression tree as written (each line's own size, no inlining). */
export function nodeCount(node: MathNode): number {
  let count = 0;
  node.traverse(() => {
    count++;
  });
  return count;
}

/**
 * The number of nodes each line's tree would have with every earlier line
 * inlined (a reference to line j costs size(j) + 1 for its parentheses, an
 * input 4 for x_i·k_i in parentheses), computed from the line sizes without
 * building any tree: size(i) = own nodes − references + Σ (size(ref) + 1).
 * Chains such as `a2 = a1 * a1` double at each line, so the count is a float
 * that may reach Infinity, never a tree that exhausts memory.
 */
export function inlinedSizes(lines: readonly ModelLine[], inputSymbols: ReadonlySet<string>): Map<string, number> {
  const sizes = new Map<string, number>();
  for (const line of lines) {
    let size = 0;
    line.expression.traverse((node, path) => {
      if (node.type === 'SymbolNode' && path !== 'fn') {
        const name = (node as MathNode & { name: string }).name;
        const earlier = sizes.get(name);
        if (earlier !== undefined) size += earlier + 1;
        else size += inputSymbols.has(name) ? 4 : 1;
      } else {
        size += 1;
      }
    });
    sizes.set(line.symbol, size);
  }
  return sizes;
}

/**
 * The depth of an expression tree (a leaf has depth 1), walked with an
 * explicit stack so that a deep tree cannot exhaust the call stack here.
 */
export function treeDepth(node: MathNode): number {
  let deepest = 0;
  const stack: [MathNode, number][] = [[node, 1]];
  while (stack.length > 0) {
    const [n, depth] = stack.pop() as [MathNode, number];
    if (depth > deepest) deepest = depth;
    n.forEach((child) => stack.push([child, depth + 1]));
  }
  return deepest;
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyNode = MathNode & Record<string, any>;

/** For every node of a tree, the names of the symbols below it (function names excepted); shared subtrees are visited once. */
export type SymbolsBelow = Map<MathNode, ReadonlySet<string>>;

const NO_SYMBOLS: ReadonlySet<string> = new Set();

function collectSymbolsBelow(node: MathNode, into: SymbolsBelow): ReadonlySet<string> {
  const known = into.get(node);
  if (known) return known;
  const n = node as AnyNode;
  let names: ReadonlySet<string>;
  if (n.type === 'SymbolNode') names = new Set([n.name as string]);
  else {
    const children: MathNode[] = [];
    node.forEach((child, path) => {
      if (path !== 'fn') children.push(child);
    });
    const parts = children.map((c) => collectSymbolsBelow(c, into));
    const nonEmpty = parts.filter((p) => p.size > 0);
    // One child with symbols (the usual case): share its set rather than copy it.
    names = nonEmpty.length === 0 ? NO_SYMBOLS : nonEmpty.length === 1 ? nonEmpty[0] : new Set(nonEmpty.flatMap((p) => [...p]));
  }
  into.set(node, names);
  return names;
}

/** The symbols below every node of `tree` (see SymbolsBelow), in one walk. */
export function symbolsBelow(tree: MathNode): SymbolsBelow {
  const into: SymbolsBelow = new Map();
  collectSymbolsBelow(tree, into);
  return into;
}

/** Caches that `derivativeSizeBound` may share between the variables of one tree. */
export interface DerivativeBoundCache {
  /** Nodes of each subtree (a call counts its name). */
  sizes: Map<MathNode, number>;
  /** The symbols below each node. */
  symbols: SymbolsBelow;
}

function subtreeSize(node: MathNode, sizes: Map<MathNode, number>): number {
  let s = sizes.get(node);
  if (s === undefined) {
    let total = node.type === 'FunctionNode' ? 2 : 1; // a call and its name
    node.forEach((child) => {
      total += subtreeSize(child, sizes);
    });
    s = total;
    sizes.set(node, s);
  }
  return s;
}

/** Derivative-size bound of one node (see derivativeSizeBound); nodes without the variable are not entered. */
function boundOf(node: MathNode, variable: string, cache: DerivativeBoundCache, bounds: Map<MathNode, number>): number {
  const known = bounds.get(node);
  if (known !== undefined) return known;
  const n = node as AnyNode;
  let bound = 1;
  if (n.type !== 'SymbolNode') {
    const args: MathNode[] = n.type === 'ParenthesisNode' ? [n.content] : n.type === 'OperatorNode' || n.type === 'FunctionNode' ? n.args : [];
    const has = (i: number) => cache.symbols.get(args[i])?.has(variable) ?? false;
    const d = (i: number) => (has(i) ? boundOf(args[i], variable, cache, bounds) : 1);
    const s = (i: number) => subtreeSize(args[i], cache.sizes);
    if (n.type === 'ParenthesisNode') bound = 1 + d(0);
    else if (n.type === 'OperatorNode' && (n.fn === 'add' || n.fn === 'subtract' || n.fn === 'unaryMinus' || n.fn === 'unaryPlus')) {
      bound = 1;
      for (let i = 0; i < args.length; i++) bound += d(i);
    } else if (n.type === 'OperatorNode' && n.fn === 'multiply') {
      // product rule over both factors; a constant factor is kept once
      bound = 3 + d(0) + d(1) + s(0) + s(1);
    } else if (n.type === 'OperatorNode' && n.fn === 'divide') {
      bound = 6 + d(0) + d(1) + s(0) + 2 * s(1);
    } else if (n.type === 'OperatorNode' && n.fn === 'pow') {
      bound = 12 + d(0) + d(1) + 3 * s(0) + 2 * s(1);
    } else {
      bound = 12;
      for (let i = 0; i < args.length; i++) bound += d(i) + 3 * s(i);
    }
  }
  bounds.set(node, bound);
  return bound;
}

/**
 * An upper bound on the nodes of mathjs's `derivative(tree, variable)` with
 * simplify off, from its rules: a subtree without the variable becomes 0;
 * d(a ± b) = da ± db; c·f → c·df; the product rule copies the other factor,
 * the quotient rule the numerator once and the denominator twice, the power
 * and function rules their arguments up to three times. Computed in one walk
 * over the part of the tree that holds the variable (shared subtrees once) so
 * an oversized derivative is never built: a chain of n products has an O(n²)
 * derivative. `cache` shares subtree sizes and symbols between the variables
 * of one tree.
 */
export function derivativeSizeBound(tree: MathNode, variable: string, cache?: DerivativeBoundCache): number {
  const shared = cache ?? { sizes: new Map(), symbols: symbolsBelow(tree) };
  if (!(shared.symbols.get(tree)?.has(variable) ?? false)) return 1;
  return boundOf(tree, variable, shared, new Map());
}
