import type { MathNode } from 'mathjs';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyNode = MathNode & Record<string, any>;

/**
 * JavaScript for each function a model or its derivatives may contain.
 * Derivatives bring in sec, csc, cot, sinh, cosh, sign and two-argument log.
 */
const FUNCTION_CODE: ReadonlyMap<string, (args: string[]) => string> = new Map<string, (args: string[]) => string>([
  ['sqrt', (a) => `Math.sqrt(${a[0]})`],
  ['exp', (a) => `Math.exp(${a[0]})`],
  ['log', (a) => (a.length === 2 ? `(Math.log(${a[0]}) / Math.log(${a[1]}))` : `Math.log(${a[0]})`)],
  ['log10', (a) => `Math.log10(${a[0]})`],
  ['sin', (a) => `Math.sin(${a[0]})`],
  ['cos', (a) => `Math.cos(${a[0]})`],
  ['tan', (a) => `Math.tan(${a[0]})`],
  ['asin', (a) => `Math.asin(${a[0]})`],
  ['acos', (a) => `Math.acos(${a[0]})`],
  ['atan', (a) => `Math.atan(${a[0]})`],
  ['atan2', (a) => `Math.atan2(${a[0]}, ${a[1]})`],
  ['abs', (a) => `Math.abs(${a[0]})`],
  ['min', (a) => `Math.min(${a.join(', ')})`],
  ['max', (a) => `Math.max(${a.join(', ')})`],
  ['sec', (a) => `(1 / Math.cos(${a[0]}))`],
  ['csc', (a) => `(1 / Math.sin(${a[0]}))`],
  ['cot', (a) => `(1 / Math.tan(${a[0]}))`],
  ['sinh', (a) => `Math.sinh(${a[0]})`],
  ['cosh', (a) => `Math.cosh(${a[0]})`],
  ['tanh', (a) => `Math.tanh(${a[0]})`],
  ['sign', (a) => `Math.sign(${a[0]})`],
  ['square', (a) => `((${a[0]}) * (${a[0]}))`],
]);

const BINARY: ReadonlyMap<string, string> = new Map([
  ['add', '+'],
  ['subtract', '-'],
  ['multiply', '*'],
  ['divide', '/'],
]);

export class UnsupportedInCode extends Error {}

/** Code that needs no parentheses: a number literal, a name or an input read x[i]. */
const ATOM = /^[\w.]+(\[\d+\])?$/;

/**
 * a + 0, 0 + a, a − 0, a·1, 1·a and a/1 are a for every a, finite or not (up
 * to the sign of a zero), so they are left out of the code. Symbolic
 * derivatives are full of them (0 for every term without the variable) and
 * run several times faster without. Products with 0 are kept: 0·∞ is NaN.
 */
function exactIdentity(fn: string, a: string, b: string): string | null {
  if (fn === 'add') return a === '0' ? b : b === '0' ? a : null;
  if (fn === 'subtract') return b === '0' ? a : null;
  if (fn === 'multiply') return a === '1' ? b : b === '1' ? a : null;
  if (fn === 'divide') return b === '1' ? a : null;
  return null;
}

/**
 * Translates an expression tree into a JavaScript expression. `symbol` maps a
 * model symbol to the JavaScript that reads it. Throws UnsupportedInCode for
 * a construct with no translation (the caller then falls back to numbers).
 */
export function toJavaScript(node: MathNode, symbol: (name: string) => string): string {
  const n = node as AnyNode;
  switch (n.type) {
    case 'ConstantNode': {
      const v = n.value as number;
      if (typeof v !== 'number') throw new UnsupportedInCode(`constant ${String(v)}`);
      return v < 0 || Object.is(v, -0) ? `(${v})` : String(v);
    }
    case 'SymbolNode':
      if (n.name === 'pi') return 'Math.PI';
      if (n.name === 'e') return 'Math.E';
      return symbol(n.name);
    case 'ParenthesisNode': {
      const inner = toJavaScript(n.content, symbol);
      return ATOM.test(inner) ? inner : `(${inner})`;
    }
    case 'OperatorNode': {
      const args = (n.args as MathNode[]).map((a) => toJavaScript(a, symbol));
      const binary = BINARY.get(n.fn as string);
      if (binary !== undefined && args.length === 2) {
        const identity = exactIdentity(n.fn as string, args[0], args[1]);
        if (identity !== null) return identity;
        return `(${args[0]} ${binary} ${args[1]})`;
      }
      if (n.fn === 'unaryMinus') return `(-${args[0]})`;
      if (n.fn === 'unaryPlus') return args[0];
      if (n.fn === 'pow') return `Math.pow(${args[0]}, ${args[1]})`;
      throw new UnsupportedInCode(`operator ${n.op}`);
    }
    case 'FunctionNode': {
      const name = (n.fn as AnyNode).name as string;
      const code = FUNCTION_CODE.get(name);
      if (!code) throw new UnsupportedInCode(`function ${name}`);
      return code((n.args as MathNode[]).map((a) => toJavaScript(a, symbol)));
    }
  }
  throw new UnsupportedInCode(n.type);
}
