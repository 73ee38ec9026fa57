import type { DistributionKind } from '../budget/schema';
import { KINDS, ruleOf } from '../distributions/registry';

/*
 * The names of the distribution kinds, as each kind's rule gives them: long
 * ones for choosing a kind, short ones for the columns of a budget table.
 */

const byKind = (name: (kind: DistributionKind) => string) => Object.fromEntries(KINDS.map((k) => [k, name(k)])) as Record<DistributionKind, string>;

/** The long name of each kind, as offered when a kind is chosen. */
export const KIND_LABELS: Record<DistributionKind, string> = byKind((k) => ruleOf(k).label);

/** The short name of each kind, for lists and table columns. */
export const KIND_SHORT: Record<DistributionKind, string> = byKind((k) => ruleOf(k).shortLabel);

/** The short name of a kind in a budget row; with the number of observations for Type A: "Type A, n = 10". Unknown kinds pass through. */
export function budgetKindLabel(kind: string, observationCount?: number): string {
  if (kind === 'observations' && observationCount !== undefined) return `Type A, n = ${observationCount}`;
  return (KIND_SHORT as Record<string, string>)[kind] ?? kind;
}
