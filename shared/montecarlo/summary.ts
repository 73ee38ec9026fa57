/**
 * Estimate and standard uncertainty from M model values:
 * ỹ = (1/M)·Σ y_r and u²(ỹ) = (1/(M − 1))·Σ (y_r − ỹ)² (JCGM 101:2008 7.6, eqs. 12–13),
 * with the smallest and largest value, which the histogram and the interval
 * search need: values[start..end) taken as one block of a MomentAccumulator.
 */
export function meanAndStandardDeviation(values: Float64Array, start = 0, end = values.length): { mean: number; standardDeviation: number; min: number; max: number } {
  if (end <= start) throw new RangeError('needs at least one model value');
  const acc = new MomentAccumulator();
  acc.add(values, start, end);
  return acc.result();
}

/** s = √(S/(M − 1)) from the sum S of squared deviations (0 for M = 1). */
function standardDeviationOf(M: number, sumOfSquares: number): number {
  return M < 2 ? 0 : Math.sqrt(Math.max(sumOfSquares, 0) / (M - 1));
}

/** Σ (y_r − K), Σ (y_r − K)², min and max of values[start..end) in one pass (see MomentAccumulator). */
function shiftedSums(values: Float64Array, start: number, end: number, K: number): { sum: number; sumOfSquares: number; min: number; max: number } {
  let d0 = 0;
  let d1 = 0;
  let q0 = 0;
  let q1 = 0;
  let min = Infinity;
  let max = -Infinity;
  let r = start;
  // The odd values first: every call then runs both loops' code before the long loop, so the optimizer has seen it all.
  for (const first4 = start + ((end - start) & 3); r < first4; r++) {
    const y = values[r];
    const dy = y - K;
    d0 += dy;
    q0 += dy * dy;
    min = y < min ? y : min;
    max = y > max ? y : max;
  }
  for (; r < end; r += 4) {
    const a = values[r];
    const b = values[r + 1];
    const c = values[r + 2];
    const d = values[r + 3];
    const da = a - K;
    const db = b - K;
    const dc = c - K;
    const dd = d - K;
    d0 += da + db;
    d1 += dc + dd;
    q0 += da * da + db * db;
    q1 += dc * dc + dd * dd;
    const lo = a < b ? a : b;
    const lo2 = c < d ? c : d;
    const hi = a > b ? a : b;
    const hi2 = c > d ? c : d;
    if (lo < min) min = lo;
    if (lo2 < min) min = lo2;
    if (hi > max) max = hi;
    if (hi2 > max) max = hi2;
  }
  return { sum: d0 + d1, sumOfSquares: q0 + q1, min, max };
}

/**
 * ỹ and u(ỹ) of JCGM 101:2008 7.6 (eqs. 12–13) gathered block by block, in
 * one pass over each block while it is still in cache, as sums about a fixed
 * shift K (the first value added): with d_r = y_r − K,
 * ỹ = K + Σd/M and Σ (y_r − ỹ)² = Σd² − (Σd)²/M. K is one of the values, so
 * d_r is exact for values close to it and a large common offset costs no
 * digits of the spread; K lies a few u(ỹ) from ỹ, so the subtraction cancels
 * little.
 */
export class MomentAccumulator {
  private count = 0;
  private shift = 0;
  private sum = 0;
  private sumOfSquares = 0;
  private min = Infinity;
  private max = -Infinity;

  /** Adds values[start..end) (end > start) and returns their mean (NaN or ±∞ when one of them is not finite). */
  add(values: Float64Array, start: number, end: number): number {
    if (this.count === 0) this.shift = values[start];
    const block = shiftedSums(values, start, end, this.shift);
    return this.addSums(end - start, block.sum, block.sumOfSquares, block.min, block.max);
  }

  /** Whether the shift K is fixed (some values were added), so that a block's sums about it can be gathered elsewhere. */
  get hasShift(): boolean {
    return this.count > 0;
  }

  /** The shift K about which `addSums` expects the sums. */
  get shiftValue(): number {
    return this.shift;
  }

  /**
   * Adds a block of n > 0 values given by Σ(y − K), Σ(y − K)², min and max
   * about this accumulator's shift K (gathered while the values were made, see
   * BlockSums); returns the block's mean (NaN or ±∞ when a value is not finite).
   */
  addSums(n: number, sum: number, sumOfSquares: number, min: number, max: number): number {
    this.count += n;
    this.sum += sum;
    this.sumOfSquares += sumOfSquares;
    if (min < this.min) this.min = min;
    if (max > this.max) this.max = max;
    return this.shift + sum / n;
  }

  /**
   * Adds everything another accumulator has gathered, moving its sums to this
   * shift: with e = K_o − K, Σ(y − K) = Σ(y − K_o) + n·e and
   * Σ(y − K)² = Σ(y − K_o)² + 2e·Σ(y − K_o) + n·e².
   */
  merge(other: MomentAccumulator): void {
    const n = other.count;
    if (n === 0) return;
    if (this.count === 0) this.shift = other.shift;
    const e = other.shift - this.shift;
    this.count += n;
    this.sum += other.sum + n * e;
    this.sumOfSquares += other.sumOfSquares + 2 * e * other.sum + n * e * e;
    if (other.min < this.min) this.min = other.min;
    if (other.max > this.max) this.max = other.max;
  }

  /** ỹ, u(ỹ), min and max of all values added (eqs. 12–13). */
  result(): { mean: number; standardDeviation: number; min: number; max: number } {
    const M = this.count;
    if (M < 1) throw new RangeError('needs at least one model value');
    const mean = this.shift + this.sum / M;
    return { mean, standardDeviation: standardDeviationOf(M, this.sumOfSquares - (this.sum * this.sum) / M), min: this.min, max: this.max };
  }
}

/**
 * The exchange buffer of a kernel that gathers a block's moment sums while it
 * evaluates (CompiledModel.evaluateBlock): [0] the shift K (in), then (out)
 * [1] Σ(y − K), [2] Σ(y − K)², [3] min and [4] max of the block's values.
 */
export function blockSums(): Float64Array {
  return new Float64Array(5);
}
