import type { Contribution, GumResult } from '../budget/result';
import type { CompiledModel } from '../model/compile-model';
import { coverageFactorFor } from '../statistics/student-t';
import { combinedVariance } from './combined-uncertainty';
import { secondOrderVarianceTerms } from './second-order';
import { centralDifference, differenceStep, sensitivityCoefficients } from './sensitivity';
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
}

const SECOND_ORDER_WARNING_RATIO = 1.05;

/**
 * The law of propagation of uncertainty (JCGM 100:2008 clause 5 and G):
 * y = f(x), c_i by 5.1.3, u_c by 5.1.2 / 5.2.2, the higher-order terms of the
 * 5.1.2 note (uncorrelated inputs only), ν_eff by G.4.1, k = t_p(ν_eff) by
 * G.4.1 / G.3 (ν truncated), U = k·u_c (6.2.1) and the interval y ± U.
 */
export function propagateGum(
  model: CompiledModel,
  inputs: readonly GumInput[],
  correlation: readonly (readonly number[])[] | null,
  coverageProbability: number,
): { result: GumResult; warnings: string[] } {
  const warnings: string[] = [];
  const x = inputs.map((q) => q.estimate);
  const u = inputs.map((q) => q.standardUncertainty);
  const lineValues = model.lineValues(x);
  const estimate = lineValues[lineValues.length - 1];

  const { coefficients: c, methods, disagreements } = sensitivityCoefficients(model, x, u);
  for (const s of disagreements) {
    warnings.push(`The symbolic and numerical derivatives for "${s}" disagree: the model may not be smooth at the estimates; check the Monte Carlo result.`);
  }
  const variance = combinedVariance(c, u, correlation);
  const standardUncertainty = Math.sqrt(Math.max(variance, 0));
  const contributionValues = c.map((ci, i) => Math.abs(ci * u[i]));
  const sumSquares = contributionValues.reduce((s, v) => s + v * v, 0);

  let standardUncertaintySecondOrder: number | null = null;
  if (!correlation) {
    const partials = model.partials.map((p, i) => {
      if (p && methods[i] === 'symbolic') return p;
      return (at: ArrayLike<number>) => centralDifference(model.value, at, i, differenceStep(at[i], u[i]));
    });
    const reads = partials.map((_, i) => (model.partials[i] && methods[i] === 'symbolic' ? model.partialReads[i] : null));
    const extra = secondOrderVarianceTerms(partials, reads, x, u);
    standardUncertaintySecondOrder = Number.isFinite(extra) ? Math.sqrt(Math.max(variance + extra, 0)) : null;
    if (standardUncertaintySecondOrder !== null && standardUncertainty > 0 && standardUncertaintySecondOrder > SECOND_ORDER_WARNING_RATIO * standardUncertainty) {
      const pct = ((standardUncertaintySecondOrder / standardUncertainty - 1) * 100).toFixed(0);
      warnings.push(
        `Second-order terms (JCGM 100:2008 5.1.2 note) raise the combined standard uncertainty by ${pct} %: the model is markedly non-linear at these estimates; prefer the Monte Carlo result.`,
      );
    }
  }

  const effectiveDof = effectiveDegreesOfFreedom(
    standardUncertainty,
    contributionValues,
    inputs.map((q) => q.dof),
  );
  if (correlation && Number.isFinite(effectiveDof)) {
    warnings.push('The Welch–Satterthwaite formula assumes uncorrelated inputs; with correlated inputs ν_eff is only indicative.');
  }
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
      contributions,
      intermediates: model.lines.slice(0, -1).map((l, i) => ({ symbol: l.symbol, value: lineValues[i], unit: model.lineUnits[i] })),
    },
    warnings,
  };
}
