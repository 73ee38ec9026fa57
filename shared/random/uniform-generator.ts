import seedrandom from 'seedrandom';

const TWO_POW_32 = 4294967296;
const TWO_POW_MINUS_53 = 1 / 9007199254740992;
const TWO_POW_MINUS_32 = 1 / 4294967296;
/** ½ + 2⁻³³: (w + ½)·2⁻³² = w_s·2⁻³² + ½ + 2⁻³³ for w_s = w − 2³¹. */
const MIDPOINT_OFFSET = 0.5 + 1 / 8589934592;

/**
 * Seeded pseudo-random generator of uniform numbers in the OPEN interval (0, 1)
 * (JCGM 101:2008 C.3: uniform generator for the Monte Carlo method).
 *
 * Core: xoshiro128** on four 32-bit words, computed with `Math.imul` and
 * unsigned shifts so that every JavaScript engine gives the same bits. The
 * initial state is the hash of the seed text (seedrandom's ARC4 key schedule),
 * so a seed gives the same numbers on every machine. A number seed is treated
 * as its decimal text (7 and "7" are the same seed).
 *
 * Each uniform uses two 32-bit outputs: r = k·2⁻⁵³ with k a 53-bit integer;
 * k = 0 is drawn again, so r ∈ [2⁻⁵³, 1 − 2⁻⁵³] and log(r) is always finite.
 * `fill32` gives coarser uniforms from one output each, for rectangular-based inputs.
 */
export class UniformGenerator {
  /** The seed text this stream was derived from. */
  readonly seed: string;
  /**
   * The four xoshiro128** state words. A sampler that runs the generator
   * inline (to skip a buffer of raw words) loads them into locals, steps
   * exactly as `fillRaw` does, and stores them back before any other call.
   */
  readonly state = new Int32Array(4);

  constructor(seed: string | number) {
    this.seed = String(seed);
    const hash = seedrandom(this.seed);
    const s = this.state;
    for (let k = 0; k < 4; k++) s[k] = hash.int32();
    // xoshiro's all-zero state is a fixed point; the hash makes it practically impossible, but guard anyway.
    if ((s[0] | s[1] | s[2] | s[3]) === 0) s[0] = 0x9e3779b9 | 0;
  }

  /**
   * An independent stream derived from this stream's seed and a label
   * (the seed text `seed` + NUL + `label` is hashed afresh). It does not
   * depend on how many numbers this stream has produced.
   */
  substream(label: string | number): UniformGenerator {
    return new UniformGenerator(`${this.seed}\u0000${String(label)}`);
  }

  /** One uniform in (0, 1): the next number `fill` would give (two raw outputs, redrawn on 0). */
  next(): number {
    for (;;) {
      const hi = this.nextWord();
      const k = unsigned53(hi, this.nextWord());
      if (k !== 0) return k * TWO_POW_MINUS_53;
    }
  }

  /** One raw 32-bit output (signed), the next word `fillRaw` would give; small enough to be inlined in rare paths. */
  nextWord(): number {
    const state = this.state;
    const s0 = state[0];
    let s1 = state[1];
    let s2 = state[2];
    let s3 = state[3];
    const t = s1 << 9;
    const r = Math.imul(s1, 5);
    const w = Math.imul((r << 7) | (r >>> 25), 9);
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    state[0] = s0 ^ s3;
    state[1] = s1;
    state[2] = s2 ^ t;
    state[3] = (s3 << 11) | (s3 >>> 21);
    return w;
  }

  /**
   * Fills out[0..n) with raw 32-bit outputs of xoshiro128** (as signed
   * integers), for samplers that build their own numbers from bits. Advances
   * the same stream as `fill`: one uniform of `fill` is two raw outputs.
   */
  fillRaw(out: Int32Array, n: number = out.length): void {
    const state = this.state;
    let s0 = state[0];
    let s1 = state[1];
    let s2 = state[2];
    let s3 = state[3];
    // eslint-disable-next-line no-useless-assignment -- declared as integers before the hot loop so they stay small integers
    let t = 0;
    // eslint-disable-next-line no-useless-assignment -- declared as integers before the hot loop so they stay small integers
    let r = 0;
    for (let i = 0; i < n; i++) {
      t = s1 << 9;
      r = Math.imul(s1, 5);
      out[i] = Math.imul((r << 7) | (r >>> 25), 9);
      s2 ^= s0;
      s3 ^= s1;
      s1 ^= s2;
      s0 ^= s3;
      s2 ^= t;
      s3 = (s3 << 11) | (s3 >>> 21);
    }
    state[0] = s0;
    state[1] = s1;
    state[2] = s2;
    state[3] = s3;
  }

  /**
   * Fills out[0..n) with lower + width·u from 32-bit uniforms
   * u = (w + ½)·2⁻³², w one unsigned 32-bit output of xoshiro128**, so
   * u ∈ [2⁻³³, 1 − 2⁻³³], the open interval (0, 1), and E u = ½,
   * Var u = (1 − 2⁻⁶⁴)/12 (the midpoints of 2³² equal cells). For the
   * rectangular-based draws of JCGM 101:2008 6.4.2–6.4.6: C.3 asks for a
   * generator of good statistical quality, not for 53-bit resolution, and a
   * 2⁻³² grid (≈ 2.3·10⁻¹⁰ of the width) lies far below the resolution with
   * which any rectangular input's limits are known. One output per number
   * instead of the two of `fill`: the stream advances by n outputs.
   * Computed from the signed word w_s = w ⊕ 2³¹ = w − 2³¹ (converts to a
   * double in one instruction) as w_s·2⁻³² + (½ + 2⁻³³), which is exact
   * (33 significant bits).
   */
  fill32(out: Float64Array, n: number = out.length, lower = 0, width = 1): void {
    const state = this.state;
    let s0 = state[0];
    let s1 = state[1];
    let s2 = state[2];
    let s3 = state[3];
    for (let i = 0; i < n; i++) {
      const t = s1 << 9;
      let w = Math.imul(s1, 5);
      w = Math.imul((w << 7) | (w >>> 25), 9);
      s2 ^= s0;
      s3 ^= s1;
      s1 ^= s2;
      s0 ^= s3;
      s2 ^= t;
      s3 = (s3 << 11) | (s3 >>> 21);
      out[i] = lower + width * ((w ^ -2147483648) * TWO_POW_MINUS_32 + MIDPOINT_OFFSET);
    }
    state[0] = s0;
    state[1] = s1;
    state[2] = s2;
    state[3] = s3;
  }

  /**
   * Fills out[0..n) (n defaults to out.length) with uniforms r in (0, 1), or
   * with lower + width·r when those are given (0 + 1·r is exactly r), which
   * saves a rectangular sampler a second pass over the block.
   */
  fill(out: Float64Array, n: number = out.length, lower = 0, width = 1): void {
    // State in locals: about three times faster than reading and writing words per draw.
    const state = this.state;
    let s0 = state[0];
    let s1 = state[1];
    let s2 = state[2];
    let s3 = state[3];
    for (let i = 0; i < n; i++) {
      // First 32-bit output (xoshiro128**), top 21 bits kept.
      let t = s1 << 9;
      let hi = Math.imul(s1, 5);
      hi = Math.imul((hi << 7) | (hi >>> 25), 9);
      s2 ^= s0;
      s3 ^= s1;
      s1 ^= s2;
      s0 ^= s3;
      s2 ^= t;
      s3 = (s3 << 11) | (s3 >>> 21);
      // Second 32-bit output, all 32 bits kept.
      t = s1 << 9;
      let lo = Math.imul(s1, 5);
      lo = Math.imul((lo << 7) | (lo >>> 25), 9);
      s2 ^= s0;
      s3 ^= s1;
      s1 ^= s2;
      s0 ^= s3;
      s2 ^= t;
      s3 = (s3 << 11) | (s3 >>> 21);
      const k = unsigned53(hi, lo);
      // k = 0 is drawn again for the same i; a flat loop with this rare step back runs faster than a nested retry loop.
      if (k === 0) {
        i--;
        continue;
      }
      out[i] = lower + width * (k * TWO_POW_MINUS_53);
    }
    state[0] = s0;
    state[1] = s1;
    state[2] = s2;
    state[3] = s3;
  }
}

const SIGN = -2147483648;
/** 2⁵² + 2³¹: moves the signed 53-bit integer of `unsigned53` back to [0, 2⁵³). */
const UNSIGNED_OFFSET = 4503599627370496 + 2147483648;

/**
 * k = ⌊hi/2¹¹⌋·2³² + lo for two 32-bit words read as unsigned, k ∈ [0, 2⁵³).
 * Computed from signed words (hi ⊕ 2³¹ >> 11 is ⌊hi/2¹¹⌋ − 2²⁰, lo ⊕ 2³¹ is
 * lo − 2³¹), because a signed 32-bit integer converts to a double in one
 * instruction and an unsigned one does not; every step is exact.
 */
export function unsigned53(hi: number, lo: number): number {
  return ((hi ^ SIGN) >> 11) * TWO_POW_32 + ((lo ^ SIGN) + UNSIGNED_OFFSET);
}
