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
  contributions: Contribution[];
  /** Intermediate quantities of the model at the estimates, in coherent SI units. */
  intermediates: { symbol: string; value: number; unit: string }[];
}

export interface HistogramBins {
  /** Lower edge of the first bin and the bin width, in the measurand's unit. */
  start: number;
  width: number;
  counts: number[];
}

export interface MonteCarloResult {
  trials: number;
  seed: string;
  adaptive: boolean;
  estimate: number;
  standardUncertainty: number;
  interval: [number, number];
  shortestInterval: [number, number];
  histogram: HistogramBins;
}

export interface ValidationResult {
  significantDigits: number;
  tolerance: number;
  dLow: number;
  dHigh: number;
  passed: boolean;
}

export interface BudgetResult {
  engineVersion: string;
  measurand: { symbol: string; unit?: string };
  gum: GumResult;
  monteCarlo: MonteCarloResult | null;
  validation: ValidationResult | null;
  warnings: string[];
}
