import { significantFigure } from '../presentation/figures';
import type { GumUnreportable } from '../budget/result';

/**
 * Whether the first-order u_c fails against the higher-order terms (JCGM 100:2008
 * 5.1.2 note: the terms must be small for eq. 10 to hold): u_c = 0 while the
 * terms are not, or the terms exceed the first-order variance itself
 * (u_c,2 > √2·u_c). Undefined when the terms were not evaluated.
 */
export function firstOrderRefusal(firstOrder: number, withHigherOrder: number | null): GumUnreportable | undefined {
  if (withHigherOrder === null || !(withHigherOrder > 0)) return undefined;
  const both = `the higher-order terms give u_c = ${significantFigure(withHigherOrder, 3).text}`;
  if (firstOrder === 0) {
    return {
      reason: 'first-order-vanishes',
      message: `The first-order law of propagation gives u_c = 0 but ${both}: every sensitivity coefficient vanishes at the estimates, so y ± U from u_c would be false. Do not report it; use the Monte Carlo result.`,
    };
  }
  if (withHigherOrder > Math.SQRT2 * firstOrder) {
    return {
      reason: 'higher-order-dominates',
      message: `The first-order law of propagation gives u_c = ${significantFigure(firstOrder, 3).text} but ${both}: the higher-order terms exceed the first-order variance, so the linearization does not hold over the inputs' spread. Do not report U from u_c; use the Monte Carlo result.`,
    };
  }
  return undefined;
}
