import type { BudgetWarning } from './warnings';

/** The result object of a computed budget (what `dubito compute` prints). */
export interface Contribution {
  symbol: string;
  unit?: string;
  kind: string;
  estimate: number;
  standardUncertainty: number;
  /** ν_i; null when infinite. */
  dof: number | null;
  /** c_i = ∂f/∂x_i at the estimates, in measurand unit per input unit. */
  sensitivity: number;
  /** |c_i|·u(x_i) in the measurand's unit. */
  contribution: number;
  /** (c_i u_i)² / Σ_j (c_j u_j)². */
  varianceShare: number;
  /** How c_i was obtained. */
  sensitivityMethod: 'symbolic' | 'numeric';
}

export interface GumResult {
  estimate: number;
  standardUncertainty: number;
  effectiveDof: number | null;
  coverageProbability: number;
  coverageFactor: number;
  expandedUncertainty: number;
  interval: [number, number];
  standardUncertaintySecondOrder: number | null;
  /** Inputs the higher-order terms leave out (t with ν ≤ 4: no fourth moment); absent when none. */
  secondOrderOmitted?: string[];
  /** Set when u_c, k and U of the first-order law must not be reported (see `GumUnreportable`). */
  unreportable?: GumUnreportable;
  contributions: Contribution[];
  /** Intermediate quantities of the model at the estimates, in coherent SI units. */
  intermediates: { symbol: string; value: number; unit: string }[];
}

/**
 * Why the GUM figures must not go to U, an interval or a statement:
 * - `first-order-vanishes`: u_c = 0 at first order while the higher-order terms
 *   of JCGM 100:2008 5.1.2 are not (e.g. a product of two zero-mean inputs);
 *   the linearization fails and y ± 0 would be false;
 * - `higher-order-dominates`: the higher-order terms exceed the first-order
 *   variance (u_c with them > √2·u_c), so the first-order u_c is off by more than 40 %.
 * In both, report the Monte Carlo result.
 */
export interface GumUnreportable {
  reason: 'first-order-vanishes' | 'higher-order-dominates';
  message: string;
}

export interface HistogramBins {
  /** Lower edge of the first bin and the bin width, in the measurand's unit. */
  start: number;
  width: number;
  counts: number[];
}

/**
 * How stable an adaptive run's figures are (JCGM 101:2008 7.9.4): M per
 * sequence, h sequences, the standard deviations s of the sequence averages
 * and the tolerance δ they were judged against (stable when every 2s ≤ δ).
 */
export interface AdaptiveStability {
  /** Trials M per sequence (7.9.4 a). */
  sequenceLength: number;
  /** Number h of sequences run. */
  sequences: number;
  /** Standard deviations s of the averages of y, u(y), y_low, y_high over the h sequences (7.9.4 e). */
  spread: { estimate: number; standardUncertainty: number; low: number; high: number };
  /** δ from u(y) of all h·M values (7.9.4 f). */
  tolerance: number;
  /** True when every 2s ≤ δ; false when the cap on trials stopped the run first. */
  stabilized: boolean;
}

/**
 * Set when an input is drawn from a scaled and shifted t-distribution with
 * ν ≤ 2 (JCGM 101:2008 6.4.9): the output then has no variance (ν ≤ 2) and,
 * for ν ≤ 1, no expectation. `estimate` and `standardUncertainty` of the run
 * are the sample's average and standard deviation only, estimates of nothing;
 * the coverage intervals (quantiles) remain defined.
 */
export interface UndefinedMoments {
  /** The smallest ν among the inputs drawn from a t-distribution. */
  smallestDof: number;
  /** The inputs concerned. */
  symbols: string[];
  /** In words, for the result and the statement. */
  reason: string;
}

export interface MonteCarloResult {
  trials: number;
  seed: string;
  adaptive: boolean;
  /** Present for adaptive runs only (JCGM 101:2008 7.9). */
  stability?: AdaptiveStability;
  /** Present when the output has no variance (see `UndefinedMoments`); then `standardUncertainty` must not be shown as u. */
  undefinedMoments?: UndefinedMoments;
  estimate: number;
  standardUncertainty: number;
  interval: [number, number];
  shortestInterval: [number, number];
  histogram: HistogramBins;
}

/**
 * The verdict of the JCGM 101:2008 clause 8 comparison:
 * - `validated` / `not-validated`: d_low and d_high against δ, and the verdict
 *   would not change with another seed at this number of trials;
 * - `inconclusive`: the Monte Carlo figures' own numerical accuracy is of the size of δ;
 * - `not-possible`: the comparison is undefined (e.g. an input with ν ≤ 2 has no variance),
 *   `reason` says why.
 */
export type ValidationVerdict = 'validated' | 'not-validated' | 'inconclusive' | 'not-possible';

export interface ValidationResult {
  significantDigits: number;
  /** δ of the Monte Carlo u (JCGM 101:2008 8.2); null for `not-possible`, where that u does not exist. */
  tolerance: number | null;
  dLow: number;
  dHigh: number;
  /** True only for the verdict `validated`. */
  passed: boolean;
  /** Always set by the engine; absent only in results stored before verdicts existed (read `passed`). */
  verdict?: ValidationVerdict;
  /** Why the verdict is `not-validated`, `inconclusive` or `not-possible`, in words. */
  reason?: string;
  /**
   * Numerical standard uncertainties of the Monte Carlo endpoints y_low, y_high
   * (how much they would move with another seed at this number of trials),
   * from order-statistic binomial bounds on all the values, for adaptive runs too.
   */
  endpointUncertainty?: [number, number];
}

/**
 * How the lab reports U (budget file `reporting`; EA-4/02, ILAC P14):
 * - `t-effective-dof`: k = t_p(ν_eff) (JCGM 100:2008 G.4), the default;
 * - `k-fixed`: k given by the lab (conventionally 2) whatever ν_eff;
 * - `monte-carlo`: the Monte Carlo coverage interval (JCGM 101:2008 7.7).
 */
export type ReportingBasis = 't-effective-dof' | 'k-fixed' | 'monte-carlo';

/** The lab's choice in the budget file (`reporting`), with its defaults applied. */
export interface ReportingChoice {
  /** How U is formed from u_c when the GUM figures are reported. */
  basis: 't-effective-dof' | 'k-fixed';
  /** k for the basis `k-fixed`. */
  k?: number;
  /** What is reported when the GUM result is not validated (any verdict but `validated`). */
  whenNotValidated: 'report-gum' | 'report-monte-carlo';
}

/** The figures that go to the certificate, and how they were obtained. */
export interface ReportedResult {
  basis: ReportingBasis;
  estimate: number;
  /** u; null when the Monte Carlo interval is reported and the output has no variance (`monteCarlo.undefinedMoments`). */
  standardUncertainty: number | null;
  /**
   * p of the interval: the budget's p, except for `k-fixed`, where it is the
   * probability that k gives for a t-distribution with ν_eff (a normal one for ν_eff = ∞).
   */
  coverageProbability: number;
  /** k; null when the interval is the Monte Carlo one. */
  coverageFactor: number | null;
  /** U; for the Monte Carlo basis the larger half-width of the interval about the estimate. */
  expandedUncertainty: number;
  interval: [number, number];
  /** The Monte Carlo basis replaced the GUM figures because clause 8 did not validate them. */
  replacedGum: boolean;
  /** GUM figures reported although the Monte Carlo method did not validate them (or could not). */
  unvalidated: boolean;
  /** For `replacedGum` or `unvalidated`: the verdict and its reason, for the statement. */
  validationVerdict?: ValidationVerdict;
  validationReason?: string;
  /** Trials of the Monte Carlo run whose interval is reported (basis `monte-carlo`). */
  trials?: number;
}

export interface BudgetResult {
  engineVersion: string;
  measurand: { symbol: string; unit?: string };
  gum: GumResult;
  monteCarlo: MonteCarloResult | null;
  validation: ValidationResult | null;
  /**
   * What is reported. Absent in results stored before the reporting choice existed (read as the
   * GUM figures); null when nothing can be reported: the GUM figures are unusable
   * (`gum.unreportable`) and no Monte Carlo run was made to replace them.
   */
  reported?: ReportedResult | null;
  /** Each with its code (`WarningCode`); results stored before codes are read by `readResult` (`stored-result.ts`). */
  warnings: BudgetWarning[];
}
