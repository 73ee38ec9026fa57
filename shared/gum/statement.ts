import type { GumResult } from '../budget/result';
import { formatAtExponent, roundUncertainty } from './rounding';

/**
 * The result as a certificate states it: y = (value ± U) unit, with U rounded
 * to two significant digits and y to the same place (JCGM 100:2008 7.2.6,
 * 7.2.3), followed by the sentence on k, ν_eff and p (JCGM 100:2008 7.2.3;
 * wording of EA-4/02 M:2022 5.2).
 */
export function certificateStatement(symbol: string, unit: string | undefined, gum: GumResult): string {
  const r = roundUncertainty(gum.expandedUncertainty);
  const y = formatAtExponent(gum.estimate, r.exponent);
  const U = formatAtExponent(gum.expandedUncertainty, r.exponent);
  const u = unit && unit !== '1' ? ` ${unit}` : '';
  const pct = `${+(gum.coverageProbability * 100).toFixed(2)} %`;
  const k = gum.coverageFactor.toFixed(2);
  // Beyond a few hundred degrees of freedom t_p differs from the normal quantile only in the third digit of k.
  const dof =
    gum.effectiveDof === null
      ? 'a normal distribution'
      : gum.effectiveDof >= 1000
        ? 'a t-distribution with more than 1000 effective degrees of freedom'
        : `a t-distribution with ν_eff = ${Math.floor(gum.effectiveDof)} effective degrees of freedom`;
  return (
    `${symbol} = (${y} ± ${U})${u}. The reported expanded uncertainty is the combined standard uncertainty ` +
    `multiplied by the coverage factor k = ${k}, which for ${dof} corresponds to a coverage probability of approximately ${pct}.`
  );
}
