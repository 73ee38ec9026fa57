import { describe, expect, it } from 'vitest';
import { choleskyFactor } from '../../shared/statistics/cholesky';

function multiplyByTranspose(L: number[][]): number[][] {
  const n = L.length;
  return Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => L[i].reduce((s, lik, k) => s + lik * L[j][k], 0)));
}

function factorOf(matrix: number[][]): number[][] {
  const result = choleskyFactor(matrix);
  if (!('factor' in result)) throw new Error(`unexpected failure at ${result.failedAt}`);
  return result.factor;
}

describe('choleskyFactor (JCGM 101:2008 6.4.8)', () => {
  it('factors a known 3×3 matrix exactly', () => {
    // Hand computation: [[4,12,−16],[12,37,−43],[−16,−43,98]] = L·Lᵀ with L = [[2,0,0],[6,1,0],[−8,5,3]] (textbook example, from memory).
    const L = factorOf([
      [4, 12, -16],
      [12, 37, -43],
      [-16, -43, 98],
    ]);
    expect(L).toEqual([
      [2, 0, 0],
      [6, 1, 0],
      [-8, 5, 3],
    ]);
  });

  it('reproduces a correlation matrix and is lower triangular', () => {
    const R = [
      [1, 0.8, 0.3],
      [0.8, 1, 0.5],
      [0.3, 0.5, 1],
    ];
    const L = factorOf(R);
    expect(L[0][1]).toBe(0);
    expect(L[0][2]).toBe(0);
    expect(L[1][2]).toBe(0);
    const back = multiplyByTranspose(L);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(back[i][j]).toBeCloseTo(R[i][j], 14);
  });

  it('accepts a singular positive semi-definite matrix (r = 1) with a zero column', () => {
    const R = [
      [1, 1, 0.5],
      [1, 1, 0.5],
      [0.5, 0.5, 1],
    ];
    const L = factorOf(R);
    expect(L[1][1]).toBe(0);
    expect(L[2][1]).toBe(0);
    const back = multiplyByTranspose(L);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(back[i][j]).toBeCloseTo(R[i][j], 14);
  });

  it('accepts r = −1 and the zero matrix', () => {
    expect(
      'factor' in
        choleskyFactor([
          [1, -1],
          [-1, 1],
        ]),
    ).toBe(true);
    expect(
      'factor' in
        choleskyFactor([
          [0, 0],
          [0, 0],
        ]),
    ).toBe(true);
  });

  it('reports where a matrix is not positive semi-definite', () => {
    // r12 = r13 = 0.9 with r23 = −0.9: determinant 1 − 3·0.81 − 2·0.729 < 0.
    expect(
      choleskyFactor([
        [1, 0.9, 0.9],
        [0.9, 1, -0.9],
        [0.9, -0.9, 1],
      ]),
    ).toEqual({ failedAt: 2 });
    // Zero pivot with a non-zero entry below it: not semi-definite.
    expect(
      choleskyFactor([
        [1, 1, 0],
        [1, 1, 0.5],
        [0, 0.5, 1],
      ]),
    ).toEqual({ failedAt: 1 });
    expect(choleskyFactor([[-1]])).toEqual({ failedAt: 0 });
  });
});
