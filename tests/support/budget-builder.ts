import type { BudgetDocument, Distribution } from '../../shared/budget/schema';

/** A minimal valid budget for tests: Y = model over the given inputs. */
export function budget(model: string, inputs: Record<string, Distribution | [Distribution, string]>, extra: Partial<BudgetDocument> = {}): BudgetDocument {
  const measurandSymbol = /^\s*([A-Za-z_]\w*)\s*=/.exec(model.trim().split('\n').pop() ?? '')?.[1] ?? 'Y';
  return {
    format: 'dubito-budget/1',
    title: 'test budget',
    measurand: { symbol: measurandSymbol },
    model,
    inputs: Object.entries(inputs).map(([symbol, d]) => (Array.isArray(d) ? { symbol, unit: d[1], distribution: d[0] } : { symbol, distribution: d })),
    ...extra,
  } as BudgetDocument;
}

export const N = (value: number, u: number, more: Record<string, unknown> = {}): Distribution => ({ kind: 'normal', value, u, ...more }) as Distribution;
export const R = (value: number, halfWidth: number, more: Record<string, unknown> = {}): Distribution => ({ kind: 'rectangular', value, halfWidth, ...more }) as Distribution;
