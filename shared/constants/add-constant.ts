import type { BudgetDocument } from '../budget/schema';
import type { PhysicalConstant } from './physical-constants';

/**
 * Adds a physical constant to a budget: as a constant when it is exact (or
 * `asInput` is false), otherwise as an input with a normal distribution of its
 * standard uncertainty (JCGM 101:2008 6.4.7: a value with u and no more
 * information is assigned a Gaussian). Returns a new document.
 */
export function addPhysicalConstant(doc: BudgetDocument, constant: PhysicalConstant, asInput = constant.standardUncertainty > 0): BudgetDocument {
  const description = `${constant.name} (${constant.source})`;
  if (asInput && constant.standardUncertainty > 0) {
    return {
      ...doc,
      inputs: [...doc.inputs, { symbol: constant.symbol, unit: constant.unit, description, distribution: { kind: 'normal', value: constant.value, u: constant.standardUncertainty } }],
    };
  }
  return { ...doc, constants: [...(doc.constants ?? []), { symbol: constant.symbol, value: constant.value, unit: constant.unit, description }] };
}
