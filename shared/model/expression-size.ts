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
