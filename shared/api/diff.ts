/** `GET /api/budgets/:id/diff?from=a&to=b`: the structured comparison of two versions. Types only. */

export interface FieldChange {
  field: string;
  from: unknown;
  to: unknown;
}

export interface Delta {
  from: number | null;
  to: number | null;
  delta: number | null;
}

export interface KeyedDiff<T = Record<string, unknown>> {
  added: T[];
  removed: T[];
  changed: { key: string; changes: FieldChange[] }[];
}

export interface BudgetDiff {
  from: number;
  to: number;
  model: { changed: boolean; from: string; to: string };
  measurand: FieldChange[];
  inputs: KeyedDiff;
  constants: KeyedDiff;
  correlations: KeyedDiff;
  /** Other top-level fields (title, coverageProbability, monteCarlo, unknown fields). */
  other: FieldChange[];
  result: {
    estimate: Delta;
    standardUncertainty: Delta;
    expandedUncertainty: Delta;
    coverageFactor: Delta;
    effectiveDof: Delta;
    monteCarlo: { estimate: Delta; standardUncertainty: Delta; intervalLow: Delta; intervalHigh: Delta } | null;
    contributions: { symbol: string; contribution: Delta; varianceShare: Delta; sensitivity: Delta; standardUncertainty: Delta }[];
  };
}
