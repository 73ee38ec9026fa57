import type { MathJsInstance, MathNode } from 'mathjs';
import { createUnitMath } from './math';
import type { ModelLine } from './parse-model';
import { toMathUnit, withBudgetUnits } from './units';

interface UnitQuantity {
  symbol: string;
  unit?: string;
}

/**
 * The unit a model yields from the units given, without conversion (used when
 * the measurand has no unit): the model is evaluated once on unit quantities
 * of size 1 (`V · mA` stays `V mA`) with the budget units of `units.ts`.
 * Returns undefined when that cannot be told (the caller then writes SI base
 * units); the caller checks that the text has the dimension the model yields.
 */
let evaluation: MathJsInstance | undefined;
/** The budget units in an instance that also evaluates expressions, made on first use. */
function evaluationMath(): MathJsInstance {
  evaluation ??= withBudgetUnits(createUnitMath());
  return evaluation;
}

export function resultUnitText(lines: readonly ModelLine[], inputs: readonly UnitQuantity[], constants: readonly UnitQuantity[]): string | undefined {
  const scope = new Map<string, unknown>();
  try {
    for (const q of [...inputs, ...constants]) {
      const t = (q.unit ?? '').trim();
      scope.set(q.symbol, t === '' || t === '1' ? 1 : toMathUnit(t, evaluationMath()));
    }
    let last: unknown;
    for (const line of lines) {
      last = evaluationMath().evaluate((line.expression as MathNode).toString(), scope);
      scope.set(line.symbol, last);
    }
    if (typeof last === 'number') return '1';
    const u = last as { formatUnits?: () => string };
    return typeof u?.formatUnits === 'function' ? u.formatUnits() || '1' : undefined;
  } catch {
    return undefined;
  }
}
