import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import jstatPkg from 'jstat';
import { UniformGenerator } from '../../shared/random/uniform-generator';
import { fillNormal, fillStandardNormal, zigguratTables } from '../../shared/random/ziggurat-normal';
import { expectStandardNormalMoments } from './moments';

const { jStat } = jstatPkg as unknown as { jStat: typeof import('jstat').jStat };
const Phi = (x: number) => jStat.normal.cdf(x, 0, 1); // reference: jstat normal cdf
const N = 1_000_000;

function draws(seed: string, n: number): Float64Array {
  const z = new Float64Array(n);
  fillStandardNormal(new UniformGenerator(seed), z, n);
  return z;
}

/** |observed − expected| within 5 binomial standard errors (common practice). */
function expectProportion(count: number, n: number, P: number): void {
  expect(Math.abs(count - n * P)).toBeLessThan(5 * Math.sqrt(n * P * (1 - P)));
}

describe('ziggurat tables', () => {
  const { X, F, area } = zigguratTables;

  it('has the layer area v = 4.92867323399e-3 of the 256-layer ziggurat (Marsaglia & Tsang 2000, from memory)', () => {
    expect(Math.abs(area / 4.92867323399e-3 - 1)).toBeLessThan(1e-11);
    expect(X[1]).toBe(3.6541528853610088); // R (Marsaglia & Tsang 2000, from memory)
  });

  it('gives every one of the 256 regions the same area v (the construction of Marsaglia & Tsang 2000)', () => {
    // Base strip: rectangle [0, X₀]×[0, f(R)] stands for the rectangle to R plus the tail.
    expect(Math.abs((X[0] * F[1]) / area - 1)).toBeLessThan(1e-14);
    for (let i = 1; i < 256; i++) {
      expect(Math.abs((X[i] * (F[i + 1] - F[i])) / area - 1)).toBeLessThan(1e-12);
    }
    expect(X[256]).toBe(0);
    expect(F[256]).toBe(1);
  });

  it('builds f(X[i]) = exp(−X[i]²/2) to within a few ulps of Math.exp', () => {
    for (let i = 1; i < 256; i++) expect(Math.abs(F[i] / Math.exp(-0.5 * X[i] * X[i]) - 1)).toBeLessThan(1e-14);
  });
});

describe('fillStandardNormal (ziggurat)', () => {
  it('has mean 0, variance 1 and kurtosis 3 at 10⁶ draws (JCGM 101:2008 6.4.7)', () => {
    const z = draws('zig-moments', N);
    expectStandardNormalMoments(z);
  });

  it('matches the normal tail probabilities P(|z| > 2), P(|z| > 3), P(|z| > R), P(z > 4) at 10⁷ draws (reference: jstat cdf)', () => {
    const n = 10_000_000;
    const z = draws('zig-tails', n);
    const R = zigguratTables.X[1];
    let beyond2 = 0;
    let beyond3 = 0;
    let beyondR = 0;
    let above4 = 0;
    let negative = 0;
    for (let i = 0; i < n; i++) {
      const a = Math.abs(z[i]);
      if (a > 2) beyond2++;
      if (a > 3) beyond3++;
      if (a > R) beyondR++; // the draws of the exact tail method
      if (z[i] > 4) above4++;
      if (z[i] < 0) negative++;
    }
    expectProportion(beyond2, n, 2 * Phi(-2));
    expectProportion(beyond3, n, 2 * Phi(-3));
    expectProportion(beyondR, n, 2 * Phi(-R));
    expectProportion(above4, n, Phi(-4));
    expectProportion(negative, n, 0.5);
  });

  it('passes a Kolmogorov–Smirnov test against the normal cdf at 2·10⁵ draws (critical value 1.95/√n for α = 0.001, common practice)', () => {
    const n = 200_000;
    const z = draws('zig-ks', n).sort();
    let D = 0;
    for (let i = 0; i < n; i++) {
      const P = Phi(z[i]);
      D = Math.max(D, (i + 1) / n - P, P - i / n);
    }
    expect(D).toBeLessThan(1.95 / Math.sqrt(n));
  });

  it('matches the normal distribution function across the wedges, with 10⁶ draws (reference: jstat cdf)', () => {
    // Points inside many layers, near the top cap and in the tail.
    const z = draws('zig-cdf', N);
    for (const x of [-3.8, -2.5, -1.3, -0.6745, -0.1, 0, 0.05, 0.3, 1, 1.96, 2.9]) {
      let below = 0;
      for (let i = 0; i < N; i++) if (z[i] <= x) below++;
      expectProportion(below, N, Phi(x));
    }
  });

  it('is reproducible: same seed same numbers, another seed other numbers', () => {
    expect(Array.from(draws('zig-rep', 20_000))).toEqual(Array.from(draws('zig-rep', 20_000)));
    const other = draws('zig-rep-2', 20_000);
    const first = draws('zig-rep', 20_000);
    let same = 0;
    for (let i = 0; i < 20_000; i++) if (other[i] === first[i]) same++;
    expect(same).toBe(0);
  });

  it('keeps fixed outputs for a fixed seed (values recorded from this implementation: guards the stream against silent changes)', () => {
    const z = draws('dubito', 4);
    expect(Array.from(z)).toEqual(RECORDED);
  });

  it('keeps a long stream bit for bit, wedge tests and tail draws included (digest recorded from this implementation)', () => {
    // ≈ 4·10⁶ draws cross ≈ 6·10⁴ wedge tests and ≈ 10³ tail draws, so a change in how the wedge is decided shows here.
    const digest = createHash('sha256');
    for (const seed of ['a', 'b', 'mass', 7]) {
      const rng = new UniformGenerator(seed);
      for (const n of [1, 5, 4095, 4096, 4097, 8192, 1_000_000]) {
        const out = new Float64Array(n);
        fillNormal(rng, out, n, 1.5, 0.25);
        digest.update(new Uint8Array(out.buffer));
      }
    }
    expect(digest.digest('hex')).toBe('363ad788ce54d6b07a210cc14705ab6a42e4f16e63e2d69c8f1741fdcf3a6333');
  });

  it('fills an odd count exactly and leaves the rest of the buffer alone', () => {
    const z = new Float64Array(8).fill(99);
    fillStandardNormal(new UniformGenerator(1), z, 7);
    expect(z[7]).toBe(99);
    for (let i = 0; i < 7; i++) expect(Math.abs(z[i])).toBeLessThan(10);
  });

  it('fillNormal gives exactly mean + σ·z of the standard draws', () => {
    const z = draws('affine', 1000);
    const y = new Float64Array(1000);
    fillNormal(new UniformGenerator('affine'), y, 1000, 1.234, 0.02);
    for (let i = 0; i < 1000; i++) expect(y[i]).toBe(1.234 + 0.02 * z[i]);
  });
});

const RECORDED = [1.2640884789328897, 0.9282510129478163, 0.966132988813465, -0.25328840058446916];
