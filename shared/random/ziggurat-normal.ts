import type { UniformGenerator } from './uniform-generator';

/*
 * Ziggurat sampler for N(0, 1) (Marsaglia & Tsang 2000), 256 layers, with the
 * exact tail method, so the draws follow the normal distribution exactly (up
 * to floating-point resolution), as JCGM 101:2008 6.4.7 asks of a normal
 * generator.
 *
 * Under f(x) = exp(−x²/2) on x ≥ 0 lie 256 regions of equal area v: a base
 * strip (the rectangle [0, R]×[0, f(R)] plus the tail x > R) and 255
 * rectangles [0, X[i]]×[f(X[i]), f(X[i+1])]. A draw picks a region and a
 * point x = u·X[i] in it; it is accepted at once when x < X[i+1] (about
 * 99 % of draws), otherwise it goes through the wedge test or the tail.
 *
 * The tables are built at module load with +, −, ×, ÷ and √ only (exp and log
 * below are series in those operations), which IEEE 754 rounds the same way
 * on every machine, so a seed gives the same numbers everywhere. The wedge
 * test and the tail use the same functions (the wedge test lets Math.exp
 * settle the cases far enough from the line that both must agree:
 * isBelowExp).
 */

const LAYERS = 256;
/** Right edge of the base strip for 256 layers (Marsaglia & Tsang 2000, from memory). */
const R = 3.6541528853610088;

const LN2_HI = 6.9314718036912381649e-1; // ln 2 with trailing zero bits: k·LN2_HI is exact for |k| < 2²⁰
const LN2_LO = 1.90821492927058770002e-10;
const LOG2E = 1.4426950408889634;
const SQRT2 = 1.4142135623730951;

/** 2^k by exact doublings or halvings. */
function powerOfTwo(k: number): number {
  let s = 1;
  for (; k > 0; k--) s *= 2;
  for (; k < 0; k++) s *= 0.5;
  return s;
}

/** e^x for −745 < x < 709: x = k·ln 2 + r, |r| ≤ ½ ln 2, Taylor series of e^r to r¹³ (remainder < 10⁻¹⁷). */
function exp(x: number): number {
  const k = Math.round(x * LOG2E);
  const r = x - k * LN2_HI - k * LN2_LO;
  let p = 1;
  for (let j = 13; j >= 1; j--) p = 1 + (p * r) / j;
  return p * powerOfTwo(k);
}

/** ln x for x > 0: x = m·2^e with m ∈ [√½, √2], ln m = 2·atanh(s), s = (m − 1)/(m + 1), series to s²³ (|s| ≤ 0.172). */
function log(x: number): number {
  let e = 0;
  while (x > SQRT2) {
    x *= 0.5;
    e++;
  }
  while (x < SQRT2 / 2) {
    x *= 2;
    e--;
  }
  const s = (x - 1) / (x + 1);
  const s2 = s * s;
  let p = 0;
  for (let j = 23; j >= 3; j -= 2) p = (p + 1 / j) * s2;
  return e * LN2_HI + (e * LN2_LO + 2 * s * (1 + p));
}

/** ∫_R^∞ exp(−x²/2) dx = exp(−R²/2)·m(R), the Mills ratio m by its continued fraction 1/(R + 1/(R + 2/(R + …))). */
function tailArea(r: number): number {
  let t = r;
  for (let k = 400; k >= 1; k--) t = r + k / t;
  return exp((-r * r) / 2) / t;
}

/** X[0..256]: X[0] = v/f(R), X[1] = R, X[i+1] = f⁻¹(f(X[i]) + v/X[i]), X[256] = 0. F[i] = f(X[i]), F[256] = 1. */
function buildTables(): { X: Float64Array; F: Float64Array; area: number } {
  const fR = exp((-R * R) / 2);
  const area = R * fR + tailArea(R);
  const X = new Float64Array(LAYERS + 1);
  const F = new Float64Array(LAYERS + 1);
  X[0] = area / fR;
  F[0] = 0; // unused: the base strip has no wedge
  X[1] = R;
  F[1] = fR;
  for (let i = 1; i < LAYERS - 1; i++) {
    const y = F[i] + area / X[i];
    X[i + 1] = Math.sqrt(-2 * log(y));
    F[i + 1] = y;
  }
  X[LAYERS] = 0;
  F[LAYERS] = 1;
  return { X, F, area };
}

const { X, F, area: LAYER_AREA } = buildTables();

/**
 * The layer tables, for tests: edges X[0..256], f(X[i]) in F, and the common
 * area v of the 256 regions. The top rectangle's area X[255]·(1 − f(X[255]))
 * equals v when R is right.
 */
export const zigguratTables: { readonly X: Float64Array; readonly F: Float64Array; readonly area: number } = { X, F, area: LAYER_AREA };

/** 2⁻²³: the unit of the 23-bit fraction each attempt takes from its word. */
const TWO_POW_MINUS_23 = 1 / 8388608;
/**
 * X[i]·2⁻²³: scaling by a power of two is exact, so (m + ½)·(X[i]·2⁻²³) rounds the
 * same real number as ((m + ½)·2⁻²³)·X[i], with one multiplication fewer.
 */
const X_PER_UNIT = X.map((x) => x * TWO_POW_MINUS_23);
/** Attempts per round of the fill loop; the rare path of a round runs after it. */
const ROUND = 4096;
/** Output index and the word a of each attempt of a round that the rare path finishes (at most one per attempt). */
const PENDING = new Int32Array(ROUND);
const PENDING_A = new Int32Array(ROUND);

/** x = u·X[i] of the attempt from word a: layer i = a mod 2⁸, u = (⌊a/2⁹⌋ + ½)·2⁻²³ (bits 9–31), before the sign. */
function attemptValue(a: number): number {
  return ((a >>> 9) + 0.5) * X_PER_UNIT[a & 255];
}

/**
 * A draw from the tail z > R (Marsaglia 1964): x = −ln(r₁)/R, y = −ln(r₂),
 * repeated until 2y > x²; then z = R + x. Exact for the normal tail.
 */
function tailDraw(rng: UniformGenerator): number {
  for (;;) {
    const x = -log(rng.next()) / R;
    const y = -log(rng.next());
    if (2 * y > x * x) return R + x;
  }
}

/**
 * Finishes an attempt that fell outside its inner rectangle: for the base
 * strip a tail draw replaces x; otherwise a uniform r gives
 * y = f(X[i]) + r·(f(X[i+1]) − f(X[i])), and x stands when y < f(x).
 * Returns NaN when the wedge rejects x.
 */
function finishAttempt(rng: UniformGenerator, layer: number, x: number): number {
  if (layer === 0) return tailDraw(rng);
  return isBelowExp(F[layer] + rng.next() * (F[layer + 1] - F[layer]), -0.5 * x * x) ? x : NaN;
}

/**
 * Relative margin within which the platform's Math.exp and exp() above may
 * disagree: both err by a few units in the last place (2.2·10⁻¹⁶ each), so
 * 10⁻¹² leaves a factor of a thousand. Checked at module load.
 */
const EXP_MARGIN = 1e-12;

/** Whether Math.exp agrees with exp() within a tenth of the margin on the wedge's range (−x²/2 for 0 < x < R). */
const PLATFORM_EXP_AGREES = (() => {
  for (let i = 0; i <= 256; i++) {
    const t = (-0.5 * R * R * i) / 256;
    const e = exp(t);
    if (!(Math.abs(Math.exp(t) - e) <= (EXP_MARGIN / 10) * e)) return false;
  }
  return true;
})();

/**
 * y < exp(t), decided as exp() decides it on every machine. Math.exp (a few
 * nanoseconds) settles it whenever y lies outside exp(t)·(1 ± 10⁻¹²), where
 * both functions must give the same answer; only inside that band (almost
 * never) is the series evaluated. Without the check passing, always the series.
 */
function isBelowExp(y: number, t: number): boolean {
  if (PLATFORM_EXP_AGREES) {
    const quick = Math.exp(t);
    if (y < quick * (1 - EXP_MARGIN)) return true;
    if (y > quick * (1 + EXP_MARGIN)) return false;
  }
  return y < exp(t);
}

/** A complete signed N(0, 1) draw, attempt after attempt (replaces an attempt the wedge rejected). */
function freshDraw(rng: UniformGenerator): number {
  for (;;) {
    const a = rng.nextWord();
    const layer = a & 255;
    let x = attemptValue(a);
    if (x >= X[layer + 1]) x = finishAttempt(rng, layer, x);
    if (x === x) return x * (1 - ((a >>> 7) & 2));
  }
}

/**
 * Fills out[0..n) with mean + σ·z, z independent N(0, 1) draws
 * (JCGM 101:2008 6.4.7), by the 256-layer ziggurat with the exact tail.
 *
 * Each attempt takes one 32-bit output a of xoshiro128** and splits its bits,
 * so that layer, sign and position are independent (Doornik 2005, "An
 * improved ziggurat method", warns against reusing the layer bits in the
 * value): layer i = a mod 2⁸ (bits 0–7), the sign from bit 8, and
 * u = (⌊a/2⁹⌋ + ½)·2⁻²³ from bits 9–31, the midpoints of 2²³ equal cells of
 * (0, 1); x = u·X[i] is accepted when x < X[i+1]. The 2⁻²³·X[i] grid
 * (≤ 4.4·10⁻⁷ in units of σ) changes the mean by nothing (midpoints) and the
 * variance by about h²/12 ≈ 10⁻¹⁴, far below the Monte Carlo noise of
 * 1/√M ≥ 3·10⁻⁴ at M ≤ 10⁷ trials, which is the statistical quality
 * JCGM 101:2008 C.3 asks of a generator; the wedge test and the tail keep
 * 53-bit uniforms. The other attempts (about 1 %) are finished after
 * each round of 4096 attempts: the wedge test or the tail draw, and a fresh
 * draw for an attempt the wedge rejects. Output t is thus still the first
 * accepted attempt of its own independent sequence of attempts.
 */
export function fillNormal(rng: UniformGenerator, out: Float64Array, n: number, mean: number, standardDeviation: number): void {
  // Tables and constants in locals: module-level bindings cost a context load (and a hole check) per use.
  const pending = PENDING;
  const pendingA = PENDING_A;
  const edges = X;
  const edgesPerUnit = X_PER_UNIT;
  const state = rng.state;
  let i = 0;
  while (i < n) {
    const end = Math.min(n, i + ROUND);
    let waiting = 0;
    // xoshiro128** run inline (as UniformGenerator.fillRaw), state in locals: no buffer of raw words.
    let s0 = state[0];
    let s1 = state[1];
    let s2 = state[2];
    let s3 = state[3];
    // The hot loop makes no calls, so nothing of the rare path weighs on it.
    for (; i < end; i++) {
      const t = s1 << 9;
      let a = Math.imul(s1, 5);
      a = Math.imul((a << 7) | (a >>> 25), 9);
      s2 ^= s0;
      s3 ^= s1;
      s1 ^= s2;
      s0 ^= s3;
      s2 ^= t;
      s3 = (s3 << 11) | (s3 >>> 21);
      const layer = a & 255;
      const x = ((a >>> 9) + 0.5) * edgesPerUnit[layer];
      // Sign from bit 8 as a factor ±1: a branch on a random bit would be mispredicted half the time.
      if (x < edges[layer + 1]) out[i] = mean + standardDeviation * (x * (1 - ((a >>> 7) & 2)));
      else {
        pending[waiting] = i;
        pendingA[waiting++] = a;
      }
    }
    state[0] = s0;
    state[1] = s1;
    state[2] = s2;
    state[3] = s3;
    if (waiting > 0) finishPending(rng, out, waiting, mean, standardDeviation);
  }
}

/** Finishes the waiting attempts of the last round, in order: output PENDING[k] came from the word PENDING_A[k]. */
function finishPending(rng: UniformGenerator, out: Float64Array, waiting: number, mean: number, standardDeviation: number): void {
  for (let k = 0; k < waiting; k++) {
    const a = PENDING_A[k];
    const x = attemptValue(a);
    const layer = a & 255;
    const finished = finishAttempt(rng, layer, x);
    const z = finished === finished ? finished * (1 - ((a >>> 7) & 2)) : freshDraw(rng);
    out[PENDING[k]] = mean + standardDeviation * z;
  }
}

/** Fills out[0..n) (n defaults to out.length) with independent N(0, 1) draws (JCGM 101:2008 6.4.7); see fillNormal. */
export function fillStandardNormal(rng: UniformGenerator, out: Float64Array, n: number = out.length): void {
  fillNormal(rng, out, n, 0, 1);
}
