import { BudgetError } from '../budget/budget-error';
import type { BudgetResult, GumResult, MonteCarloResult, ReportedResult, ReportingChoice, ValidationResult } from '../budget/result';
import type { ReportingSpec } from '../budget/schema';
import { coverageProbabilityFor } from '../statistics/student-t';

/** The budget file's `reporting` with its defaults: k = t_p(ν_eff), GUM figures reported (flagged) when not validated. */
export function reportingChoice(spec: ReportingSpec | undefined): ReportingChoice {
  const basis = spec?.basis ?? 't-effective-dof';
  return {
    basis,
    ...(basis === 'k-fixed' ? { k: spec?.k } : {}),
    whenNotValidated: spec?.whenNotValidated ?? 'report-gum',
  };
}

/**
 * Why the GUM figures cannot be reported, or null when they can. Detected
 * here: a non-finite y, u_c or U; and the GUM propagation's own flag
 * `unreportable` (first-order u_c = 0 while the higher-order terms are not, or
 * higher-order terms that dominate: JCGM 100:2008 5.1.2 note).
 */
export function gumUnusableReason(gum: GumResult): string | null {
  if (!Number.isFinite(gum.estimate) || !Number.isFinite(gum.standardUncertainty) || !Number.isFinite(gum.expandedUncertainty)) {
    return 'the GUM figures are not finite numbers';
  }
  if (gum.unreportable) return gum.unreportable.message;
  return null;
}

/** The GUM figures with U = k·u_c for the lab's k (EA-4/02 M:2022 5), or as propagated (k = t_p(ν_eff)). */
function gumFigures(gum: GumResult, choice: ReportingChoice): Omit<ReportedResult, 'replacedGum' | 'unvalidated'> {
  if (choice.basis === 'k-fixed' && choice.k !== undefined) {
    const k = choice.k;
    const U = k * gum.standardUncertainty;
    return {
      basis: 'k-fixed',
      estimate: gum.estimate,
      standardUncertainty: gum.standardUncertainty,
      // The probability this k actually gives under the GUM's t-distribution with ν_eff.
      coverageProbability: coverageProbabilityFor(k, gum.effectiveDof ?? Infinity),
      coverageFactor: k,
      expandedUncertainty: U,
      interval: [gum.estimate - U, gum.estimate + U],
    };
  }
  return {
    basis: 't-effective-dof',
    estimate: gum.estimate,
    standardUncertainty: gum.standardUncertainty,
    coverageProbability: gum.coverageProbability,
    coverageFactor: gum.coverageFactor,
    expandedUncertainty: gum.expandedUncertainty,
    interval: gum.interval,
  };
}

/**
 * The probabilistically symmetric Monte Carlo interval as the reported result
 * (JCGM 101:2008 7.7; 8.3: where the GUM result is not validated, the Monte
 * Carlo results are used instead). Estimate and u are the run's average and standard
 * deviation (7.6); where the output has no variance (an input drawn from t with
 * ν ≤ 2) they are estimates of nothing, so the estimate is the model value at
 * the input estimates, y = f(x), and u is null. U is the larger distance from
 * the estimate to an endpoint, so y ± U contains the interval.
 */
function monteCarloFigures(gum: GumResult, mc: MonteCarloResult): Omit<ReportedResult, 'replacedGum' | 'unvalidated'> {
  const momentsExist = !mc.undefinedMoments;
  const estimate = momentsExist ? mc.estimate : gum.estimate;
  const [low, high] = mc.interval;
  return {
    basis: 'monte-carlo',
    estimate,
    standardUncertainty: momentsExist ? mc.standardUncertainty : null,
    coverageProbability: gum.coverageProbability,
    coverageFactor: null,
    expandedUncertainty: Math.max(estimate - low, high - estimate),
    interval: [low, high],
    trials: mc.trials,
  };
}

/**
 * The figures that reach the certificate (`BudgetResult.reported`), the only
 * way a result is turned into U, an interval or a statement:
 * - validated, or no Monte Carlo run: the GUM figures, U = k·u_c with
 *   k = t_p(ν_eff) (JCGM 100:2008 G.4, basis `t-effective-dof`) or the lab's
 *   fixed k (basis `k-fixed`, whose p is then 2F_ν_eff(k) − 1);
 * - any verdict but `validated` (JCGM 101:2008 clause 8): with `report-monte-carlo`
 *   the Monte Carlo interval replaces them (`replacedGum`); with `report-gum`
 *   they are reported with `unvalidated` and the verdict and its reason, which
 *   the statement states;
 * - GUM figures the engine knows to be unusable (see gumUnusableReason): the
 *   Monte Carlo interval whatever the choice (`replacedGum`, with the reason),
 *   or, without a Monte Carlo run, a BudgetError `unreportable` that says to
 *   run the Monte Carlo method.
 * No Monte Carlo run means no comparison was made: `unvalidated` stays false
 * and the statement claims no validation.
 */
export function reportedResult(gum: GumResult, monteCarlo: MonteCarloResult | null, validation: ValidationResult | null, choice: ReportingChoice): ReportedResult {
  const unusable = gumUnusableReason(gum);
  if (unusable) {
    if (!monteCarlo) {
      throw new BudgetError(
        'unreportable',
        `no expanded uncertainty can be reported: ${unusable.replace(/\.$/, '')}. Run the Monte Carlo method (JCGM 101:2008), whose coverage interval holds there`,
        'monteCarlo',
      );
    }
    return {
      ...monteCarloFigures(gum, monteCarlo),
      replacedGum: true,
      unvalidated: false,
      // The GUM figures cannot be compared with anything: they do not hold here.
      validationVerdict: 'not-possible',
      validationReason: unusable,
    };
  }
  const verdict = validation ? (validation.verdict ?? (validation.passed ? 'validated' : 'not-validated')) : null;
  if (verdict === null || verdict === 'validated') {
    return { ...gumFigures(gum, choice), replacedGum: false, unvalidated: false };
  }
  const because = { validationVerdict: verdict, ...(validation?.reason ? { validationReason: validation.reason } : {}) };
  if (choice.whenNotValidated === 'report-monte-carlo' && monteCarlo) {
    return { ...monteCarloFigures(gum, monteCarlo), replacedGum: true, unvalidated: false, ...because };
  }
  return { ...gumFigures(gum, choice), replacedGum: false, unvalidated: true, ...because };
}

/**
 * What a stored result reports: its `reported`, or for results stored before
 * the reporting choice existed, the default choice applied to its GUM and
 * Monte Carlo figures (the verdict read from `passed`).
 */
export function reportedOf(result: BudgetResult): ReportedResult | null {
  if (result.reported !== undefined) return result.reported;
  if (!result.monteCarlo && gumUnusableReason(result.gum)) return null;
  return reportedResult(result.gum, result.monteCarlo, result.validation, reportingChoice(undefined));
}
