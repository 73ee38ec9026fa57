import { significantFigure } from '../presentation/figures';
import { BudgetError } from '../budget/budget-error';
import type { Contribution, GumResult } from '../budget/result';
import { budgetWarning, inputWarning, inputsWarning, type BudgetWarning } from '../budget/warnings';
import type { CompiledModel } from '../model/compile-model';
import { coverageFactorFor } from '../statistics/student-t';
import { combinedVariance } from './combined-uncertainty';
import { firstOrderRefusal } from './first-order-refusal';
import { NORMAL_KURTOSIS, secondOrderTerms } from './second-order';
import { centralDifference, sensitivityCoefficients } from './sensitivity';
import { effectiveDegreesOfFreedom } from './welch-satterthwaite';

/** An input quantity as the law of propagation sees it. */
export interface GumInput {
  symbol: string;
  unit?: string;
  kind: string;
  estimate: number;
  standardUncertainty: number;
  /** ν_i; Infinity for ∞. */
  dof: number;
  /** Kurtosis β₂ of the shape the input is drawn from (higher-order terms); absent: normal, 3. */
  kurtosis?: number;
}

const SECOND_ORDER_WARNING_RATIO = 1.05;

/**
 * Most inputs with u > 0 for which the higher-order terms are evaluated: they
 * differentiate each of the N first derivatives in each input (up to 2N²
 * evaluations). Above it they are skipped with a note; the Monte Carlo method
 * covers non-linearity at any size.
 */
export const SECOND_ORDER_MAX_INPUTS = 100;

/**
 * The law of propagation of uncertainty (JCGM 100:2008 clause 5 and G):
 * y = f(x), c_i by 5.1.3, u_c by 5.1.2 / 5.2.2, the higher-order terms of the
 * 5.1.2 note (uncorrelated inputs, with each input's kurtosis:
 * `secondOrderTerms`), ν_eff by G.4.1 with correlated inputs grouped
 * (`effectiveDegreesOfFreedom`), k = t_p(ν_eff) at the real ν_eff (G.4.1 note,
 * G.3), U = k·u_c (6.2.1) and the interval y ± U.
 * Refuses a budget in which no input the model uses has an uncertainty.
 * Marks the result `unreportable` when the higher-order terms show that the
 * first-order u_c fails (`firstOrderRefusal`).
 */
export function propagateGum(
  model: CompiledModel,
  inputs: readonly GumInput[],
  correlation: readonly (readonly number[])[] | null,
  coverageProbability: number,
): { result: GumResult; warnings: BudgetWarning[] } {
  const warnings: BudgetWarning[] = [];
  const x = inputs.map((q) => q.estimate);
  const u = inputs.map((q) => q.standardUncertainty);
  if (!inputs.some((q) => q.standardUncertainty > 0 && model.usedSymbols.has(q.symbol))) {
    throw new BudgetError(
      'invalid_field',
      'inputs: no input of the model has an uncertainty (every one is a constant or has u = 0), so there is nothing to propagate; give at least one input a distribution with u > 0',
      'inputs',
    );
  }
  const lineValues = model.lineValues(x);
  const estimate = lineValues[lineValues.length - 1];

  const { coefficients: c, methods, steps, disagreements } = sensitivityCoefficients(model, x, u);
  for (const s of disagreements) {
    warnings.push(
      inputWarning(
        'derivatives-disagree',
        `The symbolic and numerical derivatives for "${s}" disagree: the model may not be smooth at the estimates; check the Monte Carlo result.`,
        s,
        inputs.findIndex((q) => q.symbol === s),
      ),
    );
  }
  methods.forEach((m, i) => {
    if (m === 'numeric' && u[i] > 0 && steps[i] > u[i]) {
      warnings.push(
        inputWarning(
          'numerical-step-exceeds-u',
          `The numerical derivative for "${inputs[i].symbol}" needs a step (${significantFigure(steps[i], 2).text}) wider than u(x) to resolve the model value in floating point: where the model is not smooth within that step, c is an average slope; check the Monte Carlo result.`,
          inputs[i].symbol,
          i,
        ),
      );
    }
  });
  const variance = combinedVariance(c, u, correlation);
  if (!Number.isFinite(variance)) {
    // c_i·u_i beyond the double range: no u_c, ν_eff or k exists, and the Monte Carlo values would overflow as well.
    throw new BudgetError(
      'not_finite',
      'model: the combined variance Σ(c_i·u_i)² exceeds the range of double precision (about 1e308) at these estimates; state the quantities in units that keep their figures smaller',
      'model',
    );
  }
  const standardUncertainty = Math.sqrt(Math.max(variance, 0));
  const contributionValues = c.map((ci, i) => Math.abs(ci * u[i]));
  const sumSquares = contributionValues.reduce((s, v) => s + v * v, 0);

  let standardUncertaintySecondOrder: number | null = null;
  let secondOrderOmitted: string[] | undefined;
  const uncertainInputs = u.filter((ui) => ui > 0).length;
  if (correlation) {
    if (standardUncertainty === 0) {
      warnings.push(
        budgetWarning('first-order-zero-correlated', 'u_c is 0 at first order; the higher-order terms are not evaluated with correlated inputs: check the Monte Carlo result before reporting.'),
      );
    }
  } else if (uncertainInputs > SECOND_ORDER_MAX_INPUTS) {
    warnings.push(
      budgetWarning(
        'second-order-not-evaluated',
        `The higher-order terms (JCGM 100:2008 5.1.2 note) are not evaluated above ${SECOND_ORDER_MAX_INPUTS} inputs with an uncertainty (this budget has ${uncertainInputs}); the Monte Carlo result shows any non-linearity.`,
      ),
    );
  } else {
    const partials = model.partials.map((p, i) => {
      if (p && methods[i] === 'symbolic') return p;
      return (at: ArrayLike<number>) => centralDifference(model.value, at, i, steps[i]);
    });
    const reads = partials.map((_, i) => (model.partials[i] && methods[i] === 'symbolic' ? model.partialReads[i] : null));
    const terms = secondOrderTerms(
      partials,
      reads,
      x,
      u,
      inputs.map((q) => q.kurtosis ?? NORMAL_KURTOSIS),
    );
    standardUncertaintySecondOrder = Number.isFinite(terms.variance) ? Math.sqrt(Math.max(variance + terms.variance, 0)) : null;
    if (terms.omitted.length) {
      secondOrderOmitted = terms.omitted.map((i) => inputs[i].symbol);
      warnings.push(
        inputsWarning(
          'second-order-omitted',
          `The higher-order terms leave out ${secondOrderOmitted.map((s) => `"${s}"`).join(', ')}: a t-distribution with ν ≤ 4 has no fourth moment.`,
          secondOrderOmitted,
        ),
      );
    }
    if (standardUncertaintySecondOrder !== null && standardUncertainty > 0 && standardUncertaintySecondOrder > SECOND_ORDER_WARNING_RATIO * standardUncertainty) {
      const pct = String(Math.round((standardUncertaintySecondOrder / standardUncertainty - 1) * 100));
      warnings.push(
        budgetWarning(
          'second-order-significant',
          `Second-order terms (JCGM 100:2008 5.1.2 note) raise the combined standard uncertainty by ${pct} %: the model is markedly non-linear at these estimates; prefer the Monte Carlo result.`,
        ),
      );
    }
  }

  const unreportable = firstOrderRefusal(standardUncertainty, standardUncertaintySecondOrder);
  if (unreportable) warnings.push(budgetWarning('not-reportable', `NOT REPORTABLE: ${unreportable.message}`));

  const effectiveDof = effectiveDegreesOfFreedom(
    c,
    u,
    inputs.map((q) => q.dof),
    correlation,
  );
  // The schema admits no ν below 1 (JCGM 100:2008 G.4.2) and ν_eff ≥ the smallest ν of its terms.
  if (effectiveDof < 1 - 1e-9) throw new RangeError(`ν_eff = ${effectiveDof} is below 1: no coverage factor is defined`);
  const coverageFactor = coverageFactorFor(coverageProbability, standardUncertainty === 0 ? Infinity : effectiveDof);
  const expandedUncertainty = coverageFactor * standardUncertainty;

  const contributions: Contribution[] = inputs.map((q, i) => ({
    symbol: q.symbol,
    unit: q.unit,
    kind: q.kind,
    estimate: q.estimate,
    standardUncertainty: q.standardUncertainty,
    dof: Number.isFinite(q.dof) ? q.dof : null,
    sensitivity: c[i],
    contribution: contributionValues[i],
    varianceShare: sumSquares > 0 ? (contributionValues[i] * contributionValues[i]) / sumSquares : 0,
    sensitivityMethod: methods[i],
  }));

  return {
    result: {
      estimate,
      standardUncertainty,
      effectiveDof: Number.isFinite(effectiveDof) ? effectiveDof : null,
      coverageProbability,
      coverageFactor,
      expandedUncertainty,
      interval: [estimate - expandedUncertainty, estimate + expandedUncertainty],
      standardUncertaintySecondOrder,
      ...(secondOrderOmitted ? { secondOrderOmitted } : {}),
      ...(unreportable ? { unreportable } : {}),
      contributions,
      intermediates: model.lines.slice(0, -1).map((l, i) => ({ symbol: l.symbol, value: lineValues[i], unit: model.lineUnits[i] })),
    },
    warnings,
  };
}
