/**
 * Combined variance u_c²(y) = Σ c_i² u²(x_i) + 2 Σ_{i<j} c_i c_j u(x_i) u(x_j) r(x_i, x_j)
 * (JCGM 100:2008 5.1.2 eq. 10 for uncorrelated inputs, 5.2.2 eq. 16 with correlations).
 * `correlation` is the full matrix r, or null when all inputs are uncorrelated.
 */
export function combinedVariance(c: readonly number[], u: readonly number[], correlation: readonly (readonly number[])[] | null): number {
  let v = 0;
  for (let i = 0; i < c.length; i++) v += (c[i] * u[i]) ** 2;
  if (correlation) {
    for (let i = 0; i < c.length; i++) {
      for (let j = i + 1; j < c.length; j++) {
        const r = correlation[i][j];
        if (r !== 0) v += 2 * c[i] * c[j] * u[i] * u[j] * r;
      }
    }
  }
  return v;
}
