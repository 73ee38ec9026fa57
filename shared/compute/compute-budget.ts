import { BudgetError } from '../budget/budget-error';
import { DEFAULTS, LIMITS } from '../budget/limits';
import type { BudgetResult, MonteCarloResult, ValidationResult } from '../budget/result';
import type { BudgetDocument } from '../budget/schema';
import { gumTreatment, inputKurtosis, samplerFor } from '../distributions/registry';
import { propagateGum, type GumInput } from '../gum/propagate';
import { compileCached } from './model-cache';
import {
  MonteCarloNonFiniteValue,
  runAdaptiveMonteCarlo,
  runMonteCarlo,
  type MonteCarloPlan,
  type MonteCarloRun,
  type PhaseTimer,
} from '../montecarlo/run-monte-carlo';
import { validateGumInterval } from '../montecarlo/validation';
import { RESERVED_SYMBOLS } from '../model/sandbox';
import { correlationMatrix } from './correlation-matrix';
import { ENGINE_VERSION } from './engine-version';

export interface ComputeOptions {
  /** Run the Monte Carlo method (default true). */
  monteCarlo?: boolean;
  /** Overrides the budget's `monteCarlo.trials`. */
  trials?: number | 'adaptive';
  /** Overrides the budget's `monteCarlo.seed`. */
  seed?: string;
  /** Upper bound on trials (the server caps saves); adaptive runs stop there too. */
  trialsCap?: number;
  onProgress?(done: number, total: number): void;
  shouldStop?(): boolean;
  /** Measures the Monte Carlo phases (benchmarks); absent, no clock is read. */
  timer?: PhaseTimer;
}

function assertUniqueSymbols(doc: BudgetDocument): void {
  const seen = new Map<string, string>();
  const check = (symbol: string, field: string) => {
    if ((RESERVED_SYMBOLS as readonly string[]).includes(symbol)) {
      throw new BudgetError('duplicate_symbol', `${field}: "${symbol}" is reserved (the mathematical constant)`, field);
    }
    const previous = seen.get(symbol);
    if (previous) throw new BudgetError('duplicate_symbol', `${field}: the symbol "${symbol}" is already used by ${previous}`, field);
    seen.set(symbol, field);
  };
  doc.inputs.forEach((q, i) => check(q.symbol, `inputs[${i}].symbol`));
  (doc.constants ?? []).forEach((c, i) => check(c.symbol, `constants[${i}].symbol`));
  if (seen.has(doc.measurand.symbol)) {
    throw new BudgetError('duplicate_symbol', `measurand.symbol: "${doc.measurand.symbol}" is already used by ${seen.get(doc.measurand.symbol)}`, 'measurand.symbol');
  }
}

/**
 * The fewest trials for which a 100p % coverage interval is meaningful:
 * J = ⌈100/(1 − p)⌉, the smallest sequence length of JCGM 101:2008 7.9.2.
 */
export function minimumTrials(p: number): number {
  return Math.ceil(100 / (1 - p) - 1e-9);
}

/** Runs the Monte Carlo method, turning a non-finite model value into a refusal that names it. */
function runMethod(run: () => MonteCarloRun): MonteCarloRun {
  try {
    return run();
  } catch (e) {
    if (e instanceof MonteCarloNonFiniteValue) {
      throw new BudgetError('not_finite', `monteCarlo: ${e.message}`, 'monteCarlo');
    }
    throw e;
  }
}

/**
 * Computes a validated budget: the GUM law of propagation (JCGM 100:2008),
 * then, unless switched off, the Monte Carlo method (JCGM 101:2008 clause 7,
 * fixed trials or the adaptive procedure of 7.9) and the validation of the
 * GUM interval against it (JCGM 101:2008 clause 8).
 */
export function computeBudget(doc: BudgetDocument, options: ComputeOptions = {}): BudgetResult {
  assertUniqueSymbols(doc);
  const constants = doc.constants ?? [];
  const model = compileCached({
    model: doc.model,
    measurand: doc.measurand,
    inputs: doc.inputs.map((q) => ({ symbol: q.symbol, unit: q.unit })),
    constants: constants.map((c) => ({ symbol: c.symbol, unit: c.unit, value: c.value })),
  });
  const warnings: string[] = [];
  for (const q of doc.inputs) {
    if (!model.usedSymbols.has(q.symbol)) warnings.push(`The input "${q.symbol}" does not appear in the model.`);
  }

  const treatments = doc.inputs.map((q) => gumTreatment(q.distribution));
  const inputs: GumInput[] = doc.inputs.map((q, i) => ({
    symbol: q.symbol,
    unit: q.unit,
    kind: q.distribution.kind,
    ...treatments[i],
    kurtosis: inputKurtosis(q.distribution),
  }));
  const estimates = inputs.map((q) => q.estimate);
  const lineValues = model.lineValues(estimates);
  lineValues.forEach((v, i) => {
    if (!Number.isFinite(v)) {
      const line = model.lines[i];
      throw new BudgetError('not_finite', `model line ${line.line}: "${line.symbol}" is not a finite number at the estimates (${v})`, 'model', {
        line: line.line,
        token: line.symbol,
      });
    }
  });

  const correlation = correlationMatrix(doc.inputs, doc.correlations);
  const p = doc.coverageProbability ?? DEFAULTS.coverageProbability;
  const gum = propagateGum(model, inputs, correlation, p);
  warnings.push(...gum.warnings);

  let monteCarlo: MonteCarloResult | null = null;
  let validation: ValidationResult | null = null;
  if (options.monteCarlo !== false) {
    const requested = options.trials ?? doc.monteCarlo?.trials ?? DEFAULTS.trials;
    const seed = String(options.seed ?? doc.monteCarlo?.seed ?? DEFAULTS.seed);
    const cap = Math.min(options.trialsCap ?? LIMITS.trials, LIMITS.trials);
    const significantDigits = doc.monteCarlo?.significantDigits ?? DEFAULTS.significantDigits;
    const correlatedIndices = correlation ? inputs.map((_, i) => i).filter((i) => correlation[i].some((r, j) => j !== i && r !== 0)) : [];
    const plan: MonteCarloPlan = {
      samplers: doc.inputs.map((q, i) => (correlatedIndices.includes(i) ? null : samplerFor(q.distribution))),
      correlated: correlation && correlatedIndices.length
        ? {
            indices: correlatedIndices,
            means: correlatedIndices.map((i) => inputs[i].estimate),
            standardUncertainties: correlatedIndices.map((i) => inputs[i].standardUncertainty),
            correlation: correlatedIndices.map((i) => correlatedIndices.map((j) => correlation[i][j])),
          }
        : undefined,
      evaluateBlock: model.evaluateBlock,
    };
    const common = { seed, coverageProbability: p, onProgress: options.onProgress, shouldStop: options.shouldStop, timer: options.timer };
    const adaptive = requested === 'adaptive';
    const minimum = minimumTrials(p);
    if (!adaptive && requested < minimum) {
      throw new BudgetError(
        'limit',
        `monteCarlo.trials: at least ${minimum} trials are needed for a ${+(p * 100).toFixed(4)} % coverage interval (100/(1 − p), JCGM 101:2008 7.9.2)`,
        'monteCarlo.trials',
      );
    }
    if (!adaptive && requested > cap) warnings.push(`Monte Carlo trials capped at ${cap} (requested ${requested}).`);
    const run = runMethod(() =>
      adaptive
        ? runAdaptiveMonteCarlo(plan, { ...common, significantDigits, maxTrials: cap })
        : runMonteCarlo(plan, { ...common, trials: Math.min(requested, cap) }),
    );
    if (run.adaptive && !run.adaptive.stabilized) {
      warnings.push(`The adaptive Monte Carlo procedure did not stabilise within ${cap} trials; the results are less reliable than requested.`);
    }
    monteCarlo = {
      trials: run.trials,
      seed,
      adaptive,
      estimate: run.estimate,
      standardUncertainty: run.standardUncertainty,
      interval: run.interval,
      shortestInterval: run.shortestInterval,
      histogram: run.histogram,
    };
    if (run.standardUncertainty > 0) {
      validation = validateGumInterval(
        { y: gum.result.estimate, U: gum.result.expandedUncertainty },
        run.interval,
        run.standardUncertainty,
        significantDigits,
      );
    } else {
      // Every trial gave one value: no δ exists (JCGM 101:2008 8.2 needs u > 0), so the intervals must coincide exactly.
      const dLow = Math.abs(gum.result.interval[0] - run.interval[0]);
      const dHigh = Math.abs(gum.result.interval[1] - run.interval[1]);
      const same = dLow === 0 && dHigh === 0;
      validation = { significantDigits, tolerance: 0, dLow, dHigh, passed: same, verdict: same ? 'validated' : 'not-validated', reason: 'every Monte Carlo trial gave the same value: u = 0' };
      warnings.push('Every Monte Carlo trial gave the same value: the measurand does not vary with the inputs, u = 0.');
    }
  }

  return {
    engineVersion: ENGINE_VERSION,
    measurand: { symbol: doc.measurand.symbol, unit: model.measurandUnit },
    gum: gum.result,
    monteCarlo,
    validation,
    warnings,
  };
}
