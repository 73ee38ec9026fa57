import type { MathNode } from 'mathjs';
import type { ModelLine } from './parse-model';
import { toMathUnit, unitMath } from './units';

interface UnitQuantity {
  symbol: string;
  unit?: string;
}

/**
 * The unit a model yields from the units given, without conversion (used when
 * the measurand has no unit): the model is evaluated once on unit quantities
 * of size 1 (`V · mA` stays `V mA`) with the budget unit system of `units.ts`.
 * Returns undefined when that cannot be told (the caller then writes SI base
 * units); the caller checks that the text has the dimension the model yields.
 */
export function resultUnitText(lines: readonly ModelLine[], inputs: readonly UnitQuantity[], constants: readonly UnitQuantity[]): string | undefined {
  const scope = new Map<string, unknown>();
  try {
    for (const q of [...inputs, ...constants]) {
      const t = (q.unit ?? '').trim();
      scope.set(q.symbol, t === '' || t === '1' ? 1 : toMathUnit(t));
    }
    let last: unknown;
    for (const line of lines) {
      last = unitMath().evaluate((line.expression as MathNode).toString(), scope);
      scope.set(line.symbol, last);
    }
    if (typeof last === 'number') return '1';
    const u = last as { formatUnits?: () => string };
    return typeof u?.formatUnits === 'function' ? u.formatUnits() || '1' : undefined;
  } catch {
    return undefined;
  }
}
