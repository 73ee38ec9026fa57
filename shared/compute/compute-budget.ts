import { BudgetError } from '../budget/budget-error';
import { DEFAULTS, LIMITS } from '../budget/limits';
import type { BudgetResult, MonteCarloResult, UndefinedMoments, ValidationResult } from '../budget/result';
import type { BudgetDocument } from '../budget/schema';
import { budgetWarning, inputWarning, inputsWarning, type BudgetWarning } from '../budget/warnings';
import { gumTreatment, inputKurtosis, samplerFor } from '../distributions/registry';
import { inValueUnit } from '../distributions/uncertainty-unit';
import { propagateGum, type GumInput } from '../gum/propagate';
import { compileCached } from './model-cache';
import { MonteCarloNonFiniteValue, runAdaptiveMonteCarlo, runMonteCarlo, type MonteCarloPlan, type MonteCarloRun, type PhaseTimer } from '../montecarlo/run-monte-carlo';
import { validateGumInterval, validationNotPossible } from '../montecarlo/validation';
import type { Sampler } from '../distributions/distribution';
import { gumUnusableReason, reportedResult, reportingChoice } from './reported-result';
import { RESERVED_SYMBOLS } from '../model/sandbox';
import { correlationMatrix } from './correlation-matrix';
import { ENGINE_VERSION } from './engine-version';
import { dof as dofFigure, probability } from '../presentation/figures';

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
 * An input's (x, u) as finite doubles. A distribution whose every field is
 * finite can still give x or u beyond the double range (half-width 1e300:
 * u = a/√3 squares through a² = ∞; the mean of ±1e308 observations); no
 * figure built on it could be trusted, so the input is refused by name.
 */
function finiteTreatment<T extends { estimate: number; standardUncertainty: number }>(t: T, symbol: string, index: number): T {
  for (const [what, v] of [
    ['estimate', t.estimate],
    ['standard uncertainty', t.standardUncertainty],
  ] as const) {
    if (!Number.isFinite(v)) {
      const field = `inputs[${index}].distribution`;
      throw new BudgetError(
        'not_finite',
        `${field}: the ${what} of "${symbol}" is not a finite number (${v}): its figures exceed the range of double precision (about 1e308); state the input in a larger unit`,
        field,
      );
    }
  }
  return t;
}

/**
 * The fewest trials for which a 100p % coverage interval is meaningful:
 * J = ⌈100/(1 − p)⌉, the smallest sequence length of JCGM 101:2008 7.9.2.
 */
export function minimumTrials(p: number): number {
  return Math.ceil(100 / (1 - p) - 1e-9);
}

/**
 * Runs the Monte Carlo method, turning a non-finite model value into a refusal
 * that names it. Finite model values can still have a sum of squares beyond
 * the double range (values of ±1e300: y² overflows), leaving ỹ or u(ỹ) of
 * JCGM 101:2008 7.6 without a value; that is refused too, never compared or reported.
 */
function runMethod(run: () => MonteCarloRun): MonteCarloRun {
  let result: MonteCarloRun;
  try {
    result = run();
  } catch (e) {
    if (e instanceof MonteCarloNonFiniteValue) {
      throw new BudgetError('not_finite', `monteCarlo: ${e.message}`, 'monteCarlo');
    }
    throw e;
  }
  if (!Number.isFinite(result.estimate) || !Number.isFinite(result.standardUncertainty)) {
    throw new BudgetError(
      'not_finite',
      `monteCarlo: the model values are finite but their ${Number.isFinite(result.estimate) ? 'standard deviation' : 'average'} exceeds the range of double precision (about 1e308); state the quantities in units that keep their figures smaller`,
      'monteCarlo',
    );
  }
  return result;
}

/**
 * The inputs drawn from a t-distribution with ν ≤ 2 (JCGM 101:2008 6.4.9):
 * t_ν has a variance only for ν > 2, so the output then has none, and the
 * Monte Carlo u, the δ of clause 8 and any comparison built on them are
 * meaningless. Null when every sampled distribution has a variance.
 */
function undefinedMomentsOf(symbols: string[], samplers: (Sampler | null)[]): UndefinedMoments | null {
  const heavy = samplers.map((s, i) => ({ symbol: symbols[i], dof: s?.tDof })).filter((x): x is { symbol: string; dof: number } => x.dof !== undefined && x.dof <= 2);
  if (heavy.length === 0) return null;
  const smallestDof = Math.min(...heavy.map((x) => x.dof));
  const named = heavy.map((x) => `"${x.symbol}" (ν = ${dofFigure(x.dof).text})`).join(', ');
  return {
    smallestDof,
    symbols: heavy.map((x) => x.symbol),
    reason:
      `the variance of t_ν is undefined for ν ≤ 2 (JCGM 101:2008 6.4.9), and ${named} ${heavy.length > 1 ? 'are' : 'is'} drawn from such a ` +
      't-distribution, so the Monte Carlo standard uncertainty and the tolerance δ do not exist',
  };
}

/** Warnings for the inputs drawn from t with ν ≤ 2 (see undefinedMomentsOf): few observations, or a small stated ν. */
function fewDegreesOfFreedomWarnings(doc: BudgetDocument, samplers: (Sampler | null)[]): BudgetWarning[] {
  const warnings: BudgetWarning[] = [];
  doc.inputs.forEach((q, i) => {
    const dof = samplers[i]?.tDof;
    if (dof === undefined || dof > 2) return;
    const d = q.distribution;
    const n = d.kind === 'observations' ? d.values.length : 0;
    const message =
      (d.kind === 'observations' && n - 1 === dof
        ? `The input "${q.symbol}" has only ${n} observations (ν = ${dof}): `
        : `The input "${q.symbol}" is drawn from a t-distribution with ν = ${dofFigure(dof).text} ≤ 2: `) +
      'a t-distribution with ν ≤ 2 has no variance, so the Monte Carlo method cannot validate the GUM result (JCGM 101:2008 6.4.9). ' +
      (d.kind === 'observations' && n - 1 === dof ? 'Take at least 4 observations, or give a pooled standard deviation with its degrees of freedom.' : 'Check the stated degrees of freedom.');
    warnings.push(inputWarning('dof-undefined-variance', message, q.symbol, i));
  });
  return warnings;
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
  const warnings: BudgetWarning[] = [];
  doc.inputs.forEach((q, i) => {
    if (!model.usedSymbols.has(q.symbol)) warnings.push(inputWarning('input-not-in-model', `The input "${q.symbol}" does not appear in the model.`, q.symbol, i));
  });

  // Uncertainties stated in their own unit are taken into the value's unit once, refused with the field that names them.
  const distributions = doc.inputs.map((q, i) => inValueUnit(q.distribution, q.unit, `inputs[${i}].distribution`));
  const treatments = distributions.map((d, i) => finiteTreatment(gumTreatment(d), doc.inputs[i].symbol, i));
  const inputs: GumInput[] = doc.inputs.map((q, i) => ({
    symbol: q.symbol,
    unit: q.unit,
    kind: q.distribution.kind,
    ...treatments[i],
    kurtosis: inputKurtosis(distributions[i]),
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
  // Correlated inputs are drawn jointly (JCGM 101:2008 6.4.8), the others by their own sampler.
  const correlatedIndices = correlation ? inputs.map((_, i) => i).filter((i) => correlation[i].some((r, j) => j !== i && r !== 0)) : [];
  const samplers = distributions.map((d, i) => (correlatedIndices.includes(i) ? null : samplerFor(d)));
  warnings.push(...fewDegreesOfFreedomWarnings(doc, samplers));

  let monteCarlo: MonteCarloResult | null = null;
  let validation: ValidationResult | null = null;
  if (options.monteCarlo !== false) {
    const requested = options.trials ?? doc.monteCarlo?.trials ?? DEFAULTS.trials;
    const seed = String(options.seed ?? doc.monteCarlo?.seed ?? DEFAULTS.seed);
    const cap = Math.min(options.trialsCap ?? LIMITS.trials, LIMITS.trials);
    const significantDigits = doc.monteCarlo?.significantDigits ?? DEFAULTS.significantDigits;
    const withDof = correlatedIndices.filter((i) => doc.inputs[i].distribution.dof !== undefined).map((i) => doc.inputs[i].symbol);
    if (withDof.length) {
      warnings.push(
        inputsWarning(
          'correlated-drawn-gaussian',
          `The correlated inputs ${withDof.map((s) => `"${s}"`).join(', ')} state degrees of freedom but are drawn jointly from a Gaussian (JCGM 101:2008 6.4.8), not from t; ` +
            'the Monte Carlo interval may be narrower than the GUM one.',
          withDof,
        ),
      );
    }
    const plan: MonteCarloPlan = {
      samplers,
      correlated:
        correlation && correlatedIndices.length
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
    const undefinedMoments = undefinedMomentsOf(
      doc.inputs.map((q) => q.symbol),
      samplers,
    );
    // The adaptive procedure judges stability by u (7.9.4), which does not exist here: run a fixed number instead.
    const adaptive = requested === 'adaptive' && !undefinedMoments;
    if (requested === 'adaptive' && undefinedMoments) {
      warnings.push(
        budgetWarning(
          'adaptive-not-possible',
          `The adaptive Monte Carlo procedure judges stability by the standard uncertainty, which does not exist here; ` +
            `${Math.min(DEFAULTS.trials, cap)} trials were run instead (JCGM 101:2008 7.9.4).`,
        ),
      );
    }
    const trials = requested === 'adaptive' ? DEFAULTS.trials : requested;
    const minimum = minimumTrials(p);
    if (!adaptive && trials < minimum) {
      throw new BudgetError('limit', `monteCarlo.trials: at least ${minimum} trials are needed for a ${probability(p).text} coverage interval (100/(1 − p), JCGM 101:2008 7.9.2)`, 'monteCarlo.trials');
    }
    if (!adaptive && trials > cap) warnings.push(budgetWarning('monte-carlo-trials-capped', `Monte Carlo trials capped at ${cap} (requested ${trials}).`));
    const run = runMethod(() => (adaptive ? runAdaptiveMonteCarlo(plan, { ...common, significantDigits, maxTrials: cap }) : runMonteCarlo(plan, { ...common, trials: Math.min(trials, cap) })));
    if (run.adaptive && !run.adaptive.stabilized) {
      warnings.push(budgetWarning('monte-carlo-not-stable', `The adaptive Monte Carlo procedure did not stabilise within ${cap} trials; the results are less reliable than requested.`));
    }
    monteCarlo = {
      trials: run.trials,
      seed,
      adaptive,
      ...(run.adaptive ? { stability: run.adaptive } : {}),
      ...(undefinedMoments ? { undefinedMoments } : {}),
      estimate: run.estimate,
      standardUncertainty: run.standardUncertainty,
      interval: run.interval,
      shortestInterval: run.shortestInterval,
      histogram: run.histogram,
    };
    const gumInterval = { y: gum.result.estimate, U: gum.result.expandedUncertainty };
    if (undefinedMoments) {
      validation = validationNotPossible(gumInterval, run.interval, significantDigits, undefinedMoments.reason);
    } else if (run.standardUncertainty > 0) {
      validation = validateGumInterval(gumInterval, run.interval, run.standardUncertainty, significantDigits, {
        endpointUncertainty: run.endpointUncertainty,
        trials: run.trials,
      });
    } else {
      // Every trial gave one value: no δ exists (JCGM 101:2008 8.2 needs u > 0), so the intervals must coincide exactly.
      const dLow = Math.abs(gum.result.interval[0] - run.interval[0]);
      const dHigh = Math.abs(gum.result.interval[1] - run.interval[1]);
      const same = dLow === 0 && dHigh === 0;
      validation = {
        significantDigits,
        tolerance: 0,
        dLow,
        dHigh,
        passed: same,
        verdict: same ? 'validated' : 'not-validated',
        reason: 'every Monte Carlo trial gave the same value (u = 0): the intervals are compared exactly',
      };
      warnings.push(budgetWarning('monte-carlo-constant-output', 'Every Monte Carlo trial gave the same value: the measurand does not vary with the inputs, u = 0.'));
    }
  }
  // Without a Monte Carlo run, unusable GUM figures leave nothing to report: the result says so (null)
  // and its warnings say why, so the budget table can still be shown.
  const reported = !monteCarlo && gumUnusableReason(gum.result) ? null : reportedResult(gum.result, monteCarlo, validation, reportingChoice(doc.reporting));

  return {
    engineVersion: ENGINE_VERSION,
    measurand: { symbol: doc.measurand.symbol, unit: model.measurandUnit },
    gum: gum.result,
    monteCarlo,
    validation,
    reported,
    warnings,
  };
}
