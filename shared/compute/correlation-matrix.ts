import { BudgetError } from '../budget/budget-error';
import type { Correlation, InputQuantity } from '../budget/schema';
import { choleskyFactor } from '../statistics/cholesky';

/**
 * Builds the correlation matrix r(x_i, x_j) of the inputs from the listed pairs
 * (JCGM 100:2008 5.2.2) and checks that it is positive semi-definite, as any
 * correlation matrix must be (JCGM 101:2008 6.4.8.1). Returns null when no pair
 * has r ≠ 0. Only `normal` inputs may be correlated: the Monte Carlo method
 * draws them jointly from a multivariate Gaussian.
 */
export function correlationMatrix(inputs: readonly InputQuantity[], correlations: readonly Correlation[] | undefined): number[][] | null {
  if (!correlations || correlations.length === 0) return null;
  const index = new Map(inputs.map((q, i) => [q.symbol, i]));
  const n = inputs.length;
  const r: number[][] = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
  const seen = new Set<string>();
  let any = false;
  correlations.forEach((c, k) => {
    const field = `correlations[${k}]`;
    const [a, b] = c.between;
    for (const s of [a, b]) {
      if (!index.has(s)) throw new BudgetError('correlation', `${field}.between: "${s}" is not an input quantity`, `${field}.between`);
    }
    if (a === b) throw new BudgetError('correlation', `${field}.between: an input cannot be correlated with itself ("${a}")`, `${field}.between`);
    const key = [a, b].sort().join('\u0000');
    if (seen.has(key)) throw new BudgetError('correlation', `${field}: r(${a}, ${b}) is given twice`, field);
    seen.add(key);
    if (c.r === 0) return;
    for (const s of [a, b]) {
      const kind = inputs[index.get(s) as number].distribution.kind;
      if (kind !== 'normal') {
        throw new BudgetError('correlation', `${field}.between: "${s}" has a ${kind} distribution; only inputs with a normal distribution can be correlated`, `${field}.between`);
      }
    }
    const i = index.get(a) as number;
    const j = index.get(b) as number;
    r[i][j] = r[j][i] = c.r;
    any = true;
  });
  if (!any) return null;
  assertPositiveSemiDefinite(
    r,
    inputs.map((q) => q.symbol),
  );
  return r;
}

function det3(r: number[][], i: number, j: number, k: number): number {
  const a = r[i][j];
  const b = r[i][k];
  const c = r[j][k];
  return 1 + 2 * a * b * c - a * a - b * b - c * c;
}

/** Throws a BudgetError naming the correlations that conflict when r is not positive semi-definite. */
function assertPositiveSemiDefinite(r: number[][], symbols: readonly string[]): void {
  const check = choleskyFactor(r);
  if ('factor' in check) return;
  const k = check.failedAt;
  // Name a conflicting triple when one 3×3 principal minor is negative.
  for (let i = 0; i < k; i++) {
    for (let j = i + 1; j < k; j++) {
      if (det3(r, i, j, k) < -1e-12) {
        const [a, b, c] = [symbols[i], symbols[j], symbols[k]];
        throw new BudgetError(
          'correlation',
          `correlations: the correlation matrix is not positive semi-definite: r(${a}, ${c}) = ${r[i][k]} conflicts with r(${a}, ${b}) = ${r[i][j]} and r(${b}, ${c}) = ${r[j][k]}`,
          'correlations',
        );
      }
    }
  }
  throw new BudgetError('correlation', `correlations: the correlation matrix is not positive semi-definite; the coefficients involving "${symbols[k]}" cannot all hold together`, 'correlations');
}
