import { unit as mathUnit, type MathNode } from 'mathjs';
import type { ModelLine } from './parse-model';

interface UnitQuantity {
  symbol: string;
  unit?: string;
}

function asMathUnit(text: string | undefined): unknown {
  const t = (text ?? '').trim();
  if (t === '' || t === '1') return 1;
  try {
    return mathUnit(1, t.replace(/[µμ]/g, 'u').replace(/\bdegC\b|°C/g, 'K'));
  } catch {
    return 1;
  }
}

/**
 * The unit a model yields from the units given, without conversion (used when
 * the measurand has no unit): the model is evaluated once on unit quantities
 * of size 1 (`V · mA` stays `V mA`). Returns undefined when that cannot be
 * told, and the caller falls back to SI base units.
 */
export function resultUnitText(lines: readonly ModelLine[], inputs: readonly UnitQuantity[], constants: readonly UnitQuantity[]): string | undefined {
  const scope = new Map<string, unknown>();
  for (const q of [...inputs, ...constants]) scope.set(q.symbol, asMathUnit(q.unit));
  try {
    let last: unknown;
    for (const line of lines) {
      last = (line.expression as MathNode).compile().evaluate(scope);
      scope.set(line.symbol, last);
    }
    if (typeof last === 'number') return '1';
    const u = last as { formatUnits?: () => string };
    return typeof u?.formatUnits === 'function' ? u.formatUnits() || '1' : undefined;
  } catch {
    return undefined;
  }
}
