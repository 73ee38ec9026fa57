import type { BudgetResult, ReportedResult, ValidationVerdict } from '../budget/result';
import { reportedOf } from '../compute/reported-result';
import { coverageFactor, dof, probability } from '../presentation/figures';
import { formatAtExponent, roundResult, roundUncertainty } from './rounding';

/** "95 %" or "95.45 %": the budget's p as given, up to two decimals. */
function percent(p: number): string {
  return probability(p).text;
}

/** The distribution k refers to (JCGM 100:2008 G.3–G.4): normal for ν_eff = ∞, else t with ⌊ν_eff⌋. */
function distributionOf(effectiveDof: number | null): string {
  // Beyond a few hundred degrees of freedom t_p differs from the normal quantile only in the third digit of k.
  return effectiveDof === null
    ? 'a normal distribution'
    : effectiveDof > 1000
      ? 'a t-distribution with more than 1000 effective degrees of freedom'
      : `a t-distribution with ν_eff = ${dof(effectiveDof).text} effective degrees of freedom`;
}

/** Why the GUM result stands without the Monte Carlo validation, in one sentence. */
/** A reason set inside a sentence: its own first capital and final stop removed. */
function clause(reason: string): string {
  const r = reason.trim().replace(/\.+$/, '');
  return /^[A-Z][a-z]/.test(r) ? r[0].toLowerCase() + r.slice(1) : r;
}

function withoutValidation(verdict: ValidationVerdict | undefined, reason: string | undefined): string {
  switch (verdict) {
    case 'inconclusive':
      return ' This result is reported although the Monte Carlo method of JCGM 101:2008 did not validate it: the comparison ' + '(clause 8) was inconclusive at the number of trials used.';
    case 'not-possible':
      return ` This result is reported although the Monte Carlo method of JCGM 101:2008 could not validate it: ${reason ? clause(reason) : 'the comparison of clause 8 was not possible'}.`;
    default:
      return (
        ' This result is reported although the Monte Carlo method of JCGM 101:2008 did not validate it: the GUM coverage ' +
        'interval differs from the Monte Carlo one by more than the numerical tolerance (clause 8).'
      );
  }
}

/** Why the Monte Carlo interval replaced the GUM result, ending the sentence. */
function replacedBecause(reported: ReportedResult): string {
  switch (reported.validationVerdict) {
    case 'inconclusive':
      return 'whose validation by the Monte Carlo method was inconclusive (JCGM 101:2008 clause 8).';
    case 'not-possible':
      return `which could not be validated: ${reported.validationReason ? clause(reported.validationReason) : 'the comparison of JCGM 101:2008 clause 8 was not possible'}.`;
    default:
      return 'which the Monte Carlo method did not validate (JCGM 101:2008 clause 8).';
  }
}

/**
 * The result as a certificate states it, from the reported figures only
 * (`BudgetResult.reported`, see reportedResult):
 * - GUM basis: "y = (value ± U) unit", U rounded to two significant digits and
 *   y to the same place (JCGM 100:2008 7.2.6, 7.2.3), then the sentence on k,
 *   ν_eff and p (JCGM 100:2008 7.2.3; wording of EA-4/02 M:2022 5.2). For a
 *   fixed k, p is the one k gives for t with ν_eff, to the whole percent
 *   ("approximately 95 %" for k = 2 and ν_eff = ∞);
 * - `unvalidated`: one more sentence saying that the Monte Carlo method did
 *   not validate the result, or could not, and why;
 * - Monte Carlo basis: y with the probabilistically symmetric coverage interval
 *   (JCGM 101:2008 7.7), endpoints rounded to the place of U's second
 *   significant digit; with `replacedGum`, that it replaces the GUM result and why.
 */
export function certificateStatement(measurand: { symbol: string; unit?: string }, reported: ReportedResult, effectiveDof: number | null): string {
  const { symbol } = measurand;
  const unit = measurand.unit && measurand.unit !== '1' ? ` ${measurand.unit}` : '';
  // GUM 7.2.6: U to two significant digits and y to the same place; U = 0 keeps y's own digits.
  const rounded = roundResult(reported.estimate, reported.expandedUncertainty);
  const at = (x: number) => formatAtExponent(x, rounded.exponent);
  const y = rounded.estimate;

  if (reported.basis === 'monte-carlo') {
    const [low, high] = reported.interval;
    const trials = reported.trials !== undefined ? ` with ${reported.trials} trials` : '';
    const su = reported.standardUncertainty;
    const u = su !== null ? ` The standard uncertainty is ${formatAtExponent(su, roundUncertainty(su).exponent)}${unit}.` : '';
    const replaced = reported.replacedGum ? ` This interval replaces the result of the law of propagation of uncertainty (JCGM 100:2008), ${replacedBecause(reported)}` : '';
    return (
      `${symbol} = ${y}${unit}, with the coverage interval [${at(low)}, ${at(high)}]${unit} for a coverage probability of ${percent(reported.coverageProbability)}: ` +
      `the probabilistically symmetric interval obtained by the Monte Carlo method of JCGM 101:2008${trials}.${u}${replaced}`
    );
  }

  const U = rounded.uncertainty;
  const k = coverageFactor(reported.coverageFactor ?? NaN).text;
  const pct = reported.basis === 'k-fixed' ? `${Math.round(reported.coverageProbability * 100)} %` : percent(reported.coverageProbability);
  const statement =
    `${symbol} = (${y} ± ${U})${unit}. The reported expanded uncertainty is the combined standard uncertainty ` +
    `multiplied by the coverage factor k = ${k}, which for ${distributionOf(effectiveDof)} corresponds to a coverage probability of approximately ${pct}.`;
  return reported.unvalidated ? statement + withoutValidation(reported.validationVerdict, reported.validationReason) : statement;
}

/**
 * The statement for the certificate of a computed result, or, where nothing can be
 * reported (`reported` null: the GUM figures do not hold and no Monte Carlo run
 * replaced them), the refusal in words with what to do.
 */
export function resultStatement(measurand: { symbol: string; unit?: string }, result: BudgetResult): string {
  const reported = reportedOf(result);
  if (!reported) {
    const why = result.gum.unreportable?.message.replace(/\.$/, '') ?? 'the GUM figures do not hold for this model';
    return `No expanded uncertainty can be stated for ${measurand.symbol}: ${why}. Run the Monte Carlo method (JCGM 101:2008), whose coverage interval holds there.`;
  }
  return certificateStatement(measurand, reported, result.gum.effectiveDof);
}
