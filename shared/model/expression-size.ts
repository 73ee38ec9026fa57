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

/**
 * An upper bound on the nodes of mathjs's `derivative(tree, variable)` with
 * simplify off, from its rules: a subtree without the variable becomes 0;
 * d(a ± b) = da ± db; c·f → c·df; the product rule copies the other factor,
 * the quotient rule the numerator once and the denominator twice, the power
 * and function rules their arguments up to three times. Computed in one walk
 * over the tree (shared subtrees once) so an oversized derivative is never
 * built: a chain of n products has an O(n²) derivative.
 */
export function derivativeSizeBound(tree: MathNode, variable: string): number {
  const sizes = new Map<MathNode, number>();
  const bounds = new Map<MathNode, { d: number; dep: boolean }>();
  const size = (node: MathNode): number => {
    let s = sizes.get(node);
    if (s === undefined) {
      s = node.type === 'FunctionNode' ? 2 : 1; // a call and its name
      node.forEach((child) => {
        s = (s as number) + size(child);
      });
      sizes.set(node, s);
    }
    return s;
  };
  const walk = (node: MathNode): { d: number; dep: boolean } => {
    const known = bounds.get(node);
    if (known) return known;
    const n = node as AnyNode;
    let result: { d: number; dep: boolean };
    if (n.type === 'SymbolNode') {
      result = { d: 1, dep: n.name === variable };
    } else {
      const args: MathNode[] = n.type === 'ParenthesisNode' ? [n.content] : n.type === 'OperatorNode' || n.type === 'FunctionNode' ? n.args : [];
      const parts = args.map(walk);
      const dep = parts.some((p) => p.dep);
      const d = (i: number) => (parts[i].dep ? parts[i].d : 1);
      const s = (i: number) => size(args[i]);
      let bound = 1;
      if (!dep) bound = 1;
      else if (n.type === 'ParenthesisNode') bound = 1 + d(0);
      else if (n.type === 'OperatorNode' && (n.fn === 'add' || n.fn === 'subtract' || n.fn === 'unaryMinus' || n.fn === 'unaryPlus')) {
        bound = 1 + parts.reduce((t, _, i) => t + d(i), 0);
      } else if (n.type === 'OperatorNode' && n.fn === 'multiply') {
        // product rule over both factors; a constant factor is kept once
        bound = 3 + d(0) + d(1) + s(0) + s(1);
      } else if (n.type === 'OperatorNode' && n.fn === 'divide') {
        bound = 6 + d(0) + d(1) + s(0) + 2 * s(1);
      } else if (n.type === 'OperatorNode' && n.fn === 'pow') {
        bound = 12 + d(0) + d(1) + 3 * s(0) + 2 * s(1);
      } else {
        bound = 12 + parts.reduce((t, _, i) => t + d(i) + 3 * s(i), 0);
      }
      result = { d: bound, dep };
    }
    bounds.set(node, result);
    return result;
  };
  const top = walk(tree);
  return top.dep ? top.d : 1;
}
