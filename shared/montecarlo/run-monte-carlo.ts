import type { AdaptiveStability, MonteCarloResult } from '../budget/result';
import type { Sampler } from '../distributions/distribution';
import { UniformGenerator } from '../random/uniform-generator';
import { correlatedNormalSampler, type CorrelatedSampler } from './correlated-normal';
import { coverageIntervals, probabilisticallySymmetricInterval } from './coverage-interval';
import { DEFAULT_BIN_COUNT, histogramBins, histogramFromBuckets } from './histogram';
import { bucketCountFor, countInBuckets } from './value-buckets';
import { blockSums, MomentAccumulator } from './summary';
import { scratchFloat64 } from './scratch-buffers';
import { numericalTolerance } from './validation';

export interface MonteCarloPlan {
  /** One entry per input column, in order; null for inputs drawn jointly by `correlated`. */
  samplers: (Sampler | null)[];
  correlated?: { indices: number[]; means: number[]; standardUncertainties: number[]; correlation: number[][] };
  /**
   * The model compiled once to JavaScript: reads columns[i][0..n), writes out[offset + t] for t < n.
   * Given `sums` (see blockSums) it may also gather the block's moment sums in the same loop and return true.
   */
  evaluateBlock(columns: Float64Array[], out: Float64Array, offset: number, n: number, sums?: Float64Array): boolean | void;
}

/** The phases of a run that `PhaseTimer` measures. */
export type MonteCarloPhase = 'sample' | 'evaluate' | 'moments' | 'histogram' | 'intervals';

/**
 * Optional measurement of where a run spends its time (for benchmarks). The
 * driver adds elapsed `now()` differences to `elapsed`; without a timer it
 * reads no clock at all.
 */
export interface PhaseTimer {
  /** A clock in milliseconds, e.g. `() => performance.now()`. */
  now(): number;
  /** Milliseconds per phase, summed over blocks; the driver adds to what is there. */
  elapsed: Partial<Record<MonteCarloPhase, number>>;
}

function addElapsed(timer: PhaseTimer, phase: MonteCarloPhase, since: number): number {
  const now = timer.now();
  timer.elapsed[phase] = (timer.elapsed[phase] ?? 0) + (now - since);
  return now;
}

export interface MonteCarloOptions {
  trials: number;
  seed: string;
  coverageProbability: number;
  /** Trials per block (default 2¹³). The numbers drawn depend on seed and block size. */
  blockSize?: number;
  onProgress?(done: number, total: number): void;
  shouldStop?(): boolean;
  /** Histogram bins (default 100). */
  binCount?: number;
  timer?: PhaseTimer;
}

export interface AdaptiveMonteCarloOptions extends Omit<MonteCarloOptions, 'trials'> {
  /** n_dig of JCGM 101:2008 7.9.2 (typically 1 or 2). */
  significantDigits: number;
  /** Upper limit on h·M; the run stops there even if not yet stabilized. */
  maxTrials: number;
}

/** A finished run: the reported figures (JCGM 101:2008 7.6–7.7) plus the model values themselves. */
export interface MonteCarloRun extends Omit<MonteCarloResult, 'adaptive' | 'stability' | 'undefinedMoments'> {
  /**
   * The M model values; the interval search may reorder them. A fixed run's values lie in a
   * buffer that the next run on this thread reuses (see scratch-buffers): read them first.
   */
  values: Float64Array;
  /**
   * Numerical standard uncertainties of the symmetric interval's endpoints from
   * order-statistic binomial bounds on all the values, for fixed and adaptive
   * runs alike: the adaptive procedure's sequence spread (7.9.4 e) often rests on
   * h = 2 or 3 sequences, and a standard deviation of h values is itself uncertain
   * by about 1/√(2(h − 1)) (71 % at h = 2).
   */
  endpointUncertainty: [number, number];
  /** Present for the adaptive procedure only. */
  adaptive?: AdaptiveStability;
}

/** The run was cancelled through `shouldStop`; `done` trials had been completed. */
export class MonteCarloCancelled extends Error {
  constructor(readonly done: number) {
    super(`Monte Carlo run cancelled after ${done} trials`);
    this.name = 'MonteCarloCancelled';
  }
}

/** The model gave a value that is not a finite number; the run stopped at the block that showed it. */
export class MonteCarloNonFiniteValue extends Error {
  constructor(
    /** 1-based number of the first such trial. */
    readonly firstTrial: number,
    /** How many of the `evaluated` trials gave a non-finite value. */
    readonly count: number,
    readonly evaluated: number,
    readonly value: number,
  ) {
    super(
      `the model gave ${value} (not a finite number) at trial ${firstTrial}; ${count} of the first ${evaluated} trials ` +
        'were not finite. Draws reached a region where the model is undefined (e.g. division by zero, log or sqrt of a negative number)',
    );
    this.name = 'MonteCarloNonFiniteValue';
  }
}

/** 2¹³ trials: a block's input columns and values (6 × 64 kB for five inputs) stay in a core's own cache between sampling and evaluation. */
const DEFAULT_BLOCK_SIZE = 1 << 13;

/**
 * Draws trials block by block into fixed column buffers and evaluates the
 * model into `out` (JCGM 101:2008 7.2–7.4). Each input has its own sub-stream
 * of the seed (and the correlated group one more), so adding an input does not
 * change the draws of the others.
 */
class TrialGenerator {
  private readonly columns: Float64Array[];
  private readonly streams: (UniformGenerator | null)[];
  private readonly correlatedSampler: CorrelatedSampler | null = null;
  private readonly correlatedStream: UniformGenerator | null = null;
  private readonly correlatedColumns: Float64Array[] = [];
  /** The inputs with their own sampler (the others are drawn by the correlated group). */
  private readonly singles: number[] = [];
  readonly blockSize: number;
  private readonly sums = blockSums();
  done = 0;

  constructor(
    private readonly plan: MonteCarloPlan,
    seed: string,
    blockSize: number,
    private readonly shouldStop?: () => boolean,
    private readonly timer?: PhaseTimer,
  ) {
    if (!(Number.isInteger(blockSize) && blockSize >= 1)) throw new RangeError(`block size must be a whole number ≥ 1 (got ${blockSize})`);
    this.blockSize = blockSize;
    const root = new UniformGenerator(seed);
    this.columns = plan.samplers.map((_, i) => scratchFloat64(`column:${i}`, blockSize));
    this.streams = plan.samplers.map((s, i) => (s === null ? null : root.substream(`input:${i}`)));
    const group = plan.correlated;
    if (group) {
      for (const i of group.indices) {
        if (!(i >= 0 && i < plan.samplers.length) || plan.samplers[i] !== null) {
          throw new RangeError(`correlated input ${i} must have a null sampler in the plan`);
        }
      }
      this.correlatedSampler = correlatedNormalSampler(group);
      this.correlatedStream = root.substream('correlated');
      this.correlatedColumns = group.indices.map((i) => this.columns[i]);
    }
    plan.samplers.forEach((s, i) => {
      if (s !== null) this.singles.push(i);
    });
    const covered = new Set(group?.indices ?? []);
    plan.samplers.forEach((s, i) => {
      if (s === null && !covered.has(i)) throw new RangeError(`input ${i} has neither a sampler nor a place in the correlated group`);
    });
  }

  /**
   * Fills out[offset..offset + count) with model values and adds each block
   * to `moments` while it is in cache; trial numbers continue across calls.
   */
  run(out: Float64Array, offset: number, count: number, moments: MomentAccumulator, onBlock?: (n: number) => void): void {
    const { plan, columns, streams, timer } = this;
    for (let start = 0; start < count; start += this.blockSize) {
      if (this.shouldStop?.()) throw new MonteCarloCancelled(this.done);
      const n = Math.min(this.blockSize, count - start);
      let since = timer ? timer.now() : 0;
      // Each input has its own stream, so the order of the inputs does not change the numbers.
      for (const i of this.singles) plan.samplers[i]!.fill(streams[i]!, columns[i], n);
      if (this.correlatedSampler) this.correlatedSampler.fill(this.correlatedStream!, this.correlatedColumns, n);
      if (timer) since = addElapsed(timer, 'sample', since);
      const at = offset + start;
      let blockMean: number;
      if (moments.hasShift) {
        // Sums about the fixed shift gathered by the model kernel itself, while each value is in a register.
        const sums = this.sums;
        sums[0] = moments.shiftValue;
        if (plan.evaluateBlock(columns, out, at, n, sums) === true) {
          if (timer) since = addElapsed(timer, 'evaluate', since);
          blockMean = moments.addSums(n, sums[1], sums[2], sums[3], sums[4]);
        } else {
          if (timer) since = addElapsed(timer, 'evaluate', since);
          blockMean = moments.add(out, at, at + n);
        }
      } else {
        // The first block fixes the shift: evaluated, then summed.
        plan.evaluateBlock(columns, out, at, n);
        if (timer) since = addElapsed(timer, 'evaluate', since);
        blockMean = moments.add(out, at, at + n);
      }
      // The block mean is finite unless a value is not (or the sum overflows): only then look for the value.
      if (blockMean - blockMean !== 0) this.checkFinite(out, at, n);
      if (timer) addElapsed(timer, 'moments', since);
      this.done += n;
      onBlock?.(n);
    }
  }

  private checkFinite(out: Float64Array, at: number, n: number): void {
    let first = -1;
    let count = 0;
    for (let t = at; t < at + n; t++) {
      // y − y is 0 for finite y and NaN for ±∞ and NaN: one comparison covers all three.
      if (out[t] - out[t] !== 0) {
        if (first < 0) first = t;
        count++;
      }
    }
    if (count > 0) throw new MonteCarloNonFiniteValue(this.done + (first - at) + 1, count, this.done + n, out[first]);
  }
}

function checkTrials(trials: number): void {
  if (!(Number.isInteger(trials) && trials >= 1)) throw new RangeError(`trials must be a whole number ≥ 1 (got ${trials})`);
}

/** Summary of M model values: estimate and u (7.6, from `moments`), both intervals (7.7), histogram. Reorders `values`. */
function summarize(values: Float64Array, moments: MomentAccumulator, p: number, binCount?: number, timer?: PhaseTimer) {
  const { mean, standardDeviation, min, max } = moments.result();
  let since = timer ? timer.now() : 0;
  const range = { min, max };
  // One counting pass serves the histogram and the interval search.
  const bins = binCount ?? DEFAULT_BIN_COUNT;
  const buckets = Number.isInteger(bins) && bins >= 1 && max > min ? countInBuckets(values, bucketCountFor(bins), min, max) : null;
  const histogram = buckets ? histogramFromBuckets(buckets, bins) : histogramBins(values, bins, range);
  if (timer) since = addElapsed(timer, 'histogram', since);
  const { symmetric, shortest, symmetricUncertainty } = coverageIntervals(values, p, range, buckets);
  if (timer) addElapsed(timer, 'intervals', since);
  return {
    estimate: mean,
    standardUncertainty: standardDeviation,
    interval: symmetric,
    shortestInterval: shortest,
    histogram,
    endpointUncertainty: symmetricUncertainty,
  };
}

/**
 * The Monte Carlo method with a fixed number M of trials (JCGM 101:2008 7):
 * draw M vectors of inputs (7.3), evaluate the model (7.4), and summarize:
 * ỹ and u(ỹ) by eqs. 12–13 (7.6), the probabilistically symmetric and shortest
 * coverage intervals (7.7). Same plan, seed, trials and block size give the
 * same numbers. Memory: the M model values plus one block per input.
 * Throws MonteCarloCancelled (via shouldStop) or MonteCarloNonFiniteValue.
 */
export function runMonteCarlo(plan: MonteCarloPlan, options: MonteCarloOptions): MonteCarloRun {
  const { trials: M, seed, coverageProbability: p } = options;
  checkTrials(M);
  const generator = new TrialGenerator(plan, seed, Math.min(options.blockSize ?? DEFAULT_BLOCK_SIZE, M), options.shouldStop, options.timer);
  // Kept for the next run: 8 MB written fresh at 10⁶ trials costs as much in page faults as evaluating the model.
  const values = scratchFloat64('values', M);
  const moments = new MomentAccumulator();
  generator.run(values, 0, M, moments, () => options.onProgress?.(generator.done, M));
  return { trials: M, seed, ...summarize(values, moments, p, options.binCount, options.timer), values };
}

/** Standard deviation of the average of h values: s = √(Σ(x_r − x̄)² / (h(h − 1))) (JCGM 101:2008 7.9.4 e). */
function standardDeviationOfAverage(xs: number[]): number {
  const h = xs.length;
  const mean = xs.reduce((a, b) => a + b, 0) / h;
  const ss = xs.reduce((a, x) => a + (x - mean) * (x - mean), 0);
  return Math.sqrt(ss / (h * (h - 1)));
}

/**
 * Adaptive Monte Carlo procedure (JCGM 101:2008 7.9.4): sequences of
 * M = max(⌈100/(1 − p)⌉, 10⁴) trials; after h ≥ 2 sequences, the standard
 * deviations s of the averages of ỹ, u(ỹ), y_low and y_high are compared with
 * δ (8.2) of u(ỹ) from all h·M values; the run stops when all 2s ≤ δ, and
 * the results come from all h·M values (7.9.4 h). At most maxTrials are used
 * (rounded down to whole sequences, at least one); `adaptive.stabilized` says
 * whether the criterion was met.
 */
export function runAdaptiveMonteCarlo(plan: MonteCarloPlan, options: AdaptiveMonteCarloOptions): MonteCarloRun {
  const { seed, coverageProbability: p, significantDigits, maxTrials } = options;
  if (!(p > 0 && p < 1)) throw new RangeError(`coverage probability must lie strictly between 0 and 1 (got ${p})`);
  checkTrials(maxTrials);
  // The small offset keeps binary rounding of 1 − p (e.g. 0.999) from adding one trial.
  const M = Math.min(Math.max(Math.ceil(100 / (1 - p) - 1e-9), 10_000), maxTrials);
  const maxSequences = Math.max(1, Math.floor(maxTrials / M));
  const generator = new TrialGenerator(plan, seed, Math.min(options.blockSize ?? DEFAULT_BLOCK_SIZE, M), options.shouldStop, options.timer);

  let values = new Float64Array(Math.min(maxSequences, 4) * M);
  const estimates: number[] = [];
  const uncertainties: number[] = [];
  const lows: number[] = [];
  const highs: number[] = [];
  let tolerance = NaN;
  let spread = { estimate: NaN, standardUncertainty: NaN, low: NaN, high: NaN };
  let stabilized = false;
  let h = 0;
  const allMoments = new MomentAccumulator();
  while (h < maxSequences) {
    const offset = h * M;
    if (offset + M > values.length) {
      // Grow by doubling, within the cap, so the copies cost O(total).
      const grown = new Float64Array(Math.min(maxSequences, 2 * (values.length / M)) * M);
      grown.set(values);
      values = grown;
    }
    const sequenceMoments = new MomentAccumulator();
    generator.run(values, offset, M, sequenceMoments, () => options.onProgress?.(generator.done, maxSequences * M));
    allMoments.merge(sequenceMoments);
    h++;
    const sequence = values.subarray(offset, offset + M);
    const { mean, standardDeviation } = sequenceMoments.result();
    const [low, high] = probabilisticallySymmetricInterval(sequence, p);
    estimates.push(mean);
    uncertainties.push(standardDeviation);
    lows.push(low);
    highs.push(high);
    if (h < 2) continue;
    spread = {
      estimate: standardDeviationOfAverage(estimates),
      standardUncertainty: standardDeviationOfAverage(uncertainties),
      low: standardDeviationOfAverage(lows),
      high: standardDeviationOfAverage(highs),
    };
    const all = allMoments.result();
    if (!(all.standardDeviation > 0)) {
      // u = 0: the model does not vary, every sequence agrees exactly.
      tolerance = 0;
      stabilized = true;
      break;
    }
    tolerance = numericalTolerance(all.standardDeviation, significantDigits);
    const worst = Math.max(spread.estimate, spread.standardUncertainty, spread.low, spread.high);
    if (2 * worst <= tolerance) {
      stabilized = true;
      break;
    }
  }
  const used = values.subarray(0, h * M);
  if (Number.isNaN(tolerance)) {
    // A single sequence (maxTrials < 2M): report δ of its u all the same.
    const { standardDeviation } = allMoments.result();
    tolerance = standardDeviation > 0 ? numericalTolerance(standardDeviation, significantDigits) : 0;
  }
  return {
    trials: h * M,
    seed,
    ...summarize(used, allMoments, p, options.binCount, options.timer),
    values: used,
    adaptive: { sequenceLength: M, sequences: h, tolerance, spread, stabilized },
  };
}
