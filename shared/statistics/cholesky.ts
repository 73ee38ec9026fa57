/** Relative size, against the largest diagonal element, below which a pivot counts as zero. */
const ZERO_PIVOT_TOLERANCE = 1e-12;

/**
 * Cholesky factor of a symmetric positive semi-definite matrix V: lower
 * triangular L with V = L·Lᵀ (JCGM 101:2008 6.4.8, used to draw correlated
 * Gaussians; GUM 5.2 correlation matrix). Column by column:
 * L_jj = √(V_jj − Σ_{k<j} L_jk²), L_ij = (V_ij − Σ_{k<j} L_ik·L_jk)/L_jj.
 *
 * A pivot within the tolerance of zero (singular but semi-definite, e.g. r = ±1)
 * gives a zero column, provided the rest of that column is zero too. Otherwise
 * the matrix is not positive semi-definite and `failedAt` is the 0-based row
 * and column index j where that shows.
 */
export function choleskyFactor(matrix: number[][]): { factor: number[][] } | { failedAt: number } {
  const n = matrix.length;
  let scale = 0;
  for (let i = 0; i < n; i++) {
    if (matrix[i].length !== n) throw new RangeError('the matrix must be square');
    scale = Math.max(scale, Math.abs(matrix[i][i]));
  }
  const tolerance = ZERO_PIVOT_TOLERANCE * Math.max(scale, Number.MIN_VALUE) * Math.max(n, 1);
  const L: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let j = 0; j < n; j++) {
    let pivot = matrix[j][j];
    for (let k = 0; k < j; k++) pivot -= L[j][k] * L[j][k];
    if (pivot < -tolerance) return { failedAt: j };
    if (pivot <= tolerance) {
      // Zero pivot: semi-definite only if every residual below it vanishes as well.
      for (let i = j + 1; i < n; i++) {
        let residual = matrix[i][j];
        for (let k = 0; k < j; k++) residual -= L[i][k] * L[j][k];
        if (Math.abs(residual) > Math.sqrt(tolerance * scale) + tolerance) return { failedAt: j };
      }
      continue;
    }
    const root = Math.sqrt(pivot);
    L[j][j] = root;
    for (let i = j + 1; i < n; i++) {
      let residual = matrix[i][j];
      for (let k = 0; k < j; k++) residual -= L[i][k] * L[j][k];
      L[i][j] = residual / root;
    }
  }
  return { factor: L };
}
