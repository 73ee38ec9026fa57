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
  sequenceLength: number;
  sequences: number;
  spread: { estimate: number; standardUncertainty: number; low: number; high: number };
  tolerance: number;
  stabilized: boolean;
}

export interface MonteCarloResult {
  trials: number;
  seed: string;
  adaptive: boolean;
  /** Present for adaptive runs only (JCGM 101:2008 7.9). */
  stability?: AdaptiveStability;
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
  tolerance: number;
  dLow: number;
  dHigh: number;
  /** True only for the verdict `validated`. */
  passed: boolean;
  verdict?: ValidationVerdict;
  /** Why the verdict is `inconclusive` or `not-possible`, in words. */
  reason?: string;
}

/**
 * How the lab reports U (budget file `reporting`; EA-4/02, ILAC P14):
 * - `t-effective-dof`: k = t_p(ν_eff) (JCGM 100:2008 G.4), the default;
 * - `k-fixed`: k given by the lab (conventionally 2) whatever ν_eff;
 * - `monte-carlo`: the Monte Carlo coverage interval (JCGM 101:2008 7.7).
 */
export type ReportingBasis = 't-effective-dof' | 'k-fixed' | 'monte-carlo';

/** The figures that go to the certificate, and how they were obtained. */
export interface ReportedResult {
  basis: ReportingBasis;
  estimate: number;
  standardUncertainty: number;
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
}

export interface BudgetResult {
  engineVersion: string;
  measurand: { symbol: string; unit?: string };
  gum: GumResult;
  monteCarlo: MonteCarloResult | null;
  validation: ValidationResult | null;
  /** What is reported; absent in results stored before the reporting choice existed (read as the GUM figures). */
  reported?: ReportedResult;
  warnings: string[];
}
