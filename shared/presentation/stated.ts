import type { InputQuantity } from '../budget/schema';
import { statedValueOf } from '../budget/stated-value';
import { plainFigure, type Figure } from './figures';

/*
 * How an input's uncertainty was stated (a certificate's U and k, a limit ±a,
 * a resolution, n readings) and the divisor that turns it into a standard
 * uncertainty, as the budget table shows them: the one rule is
 * `statedValueOf` (shared/budget/stated-value.ts); these only make figures of it.
 */

/** The value of an input's uncertainty as stated: "U = 12 mK, k = 2", "± 0.008 °C", "4 readings, s = 1.29 g". */
export function statedAs(q: InputQuantity): Figure {
  return plainFigure(statedValueOf(q).text);
}

/**
 * The divisor between the stated value and u(x_i) (GUM 4.3.3, 4.3.7, 4.3.9, 4.2.3, F.2.2.1):
 * "2", "√3", "2√3", "√n"…; "—" where none applies (a constant).
 */
export function divisor(q: InputQuantity): Figure {
  const s = statedValueOf(q);
  return s.divisorText === null ? plainFigure('—') : plainFigure(s.divisorText, s.divisor);
}
