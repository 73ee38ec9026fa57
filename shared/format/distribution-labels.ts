import type { DistributionKind } from '../budget/schema';

/*
 * The names of the distribution kinds: long ones for choosing a kind, short ones
 * for the columns of a budget table.
 */

/** The long name of each kind, as offered when a kind is chosen. */
export const KIND_LABELS: Record<DistributionKind, string> = {
  normal: 'Normal (Gaussian)',
  rectangular: 'Rectangular (uniform)',
  triangular: 'Triangular',
  arcsine: 'Arcsine (U-shaped)',
  trapezoidal: 'Trapezoidal',
  'curvilinear-trapezoidal': 'Curvilinear trapezoidal',
  'student-t': 'Student t (scaled, shifted)',
  observations: 'Repeated observations (Type A)',
  constant: 'Exact value (no uncertainty)',
};

/** The short name of each kind, for lists and table columns. */
export const KIND_SHORT: Record<DistributionKind, string> = {
  normal: 'normal',
  rectangular: 'rectangular',
  triangular: 'triangular',
  arcsine: 'arcsine',
  trapezoidal: 'trapezoidal',
  'curvilinear-trapezoidal': 'curv. trapezoidal',
  'student-t': 'scaled t',
  observations: 'Type A, n obs.',
  constant: 'exact',
};

/** The short name of a kind in a budget row; with the number of observations for Type A: "Type A, n = 10". Unknown kinds pass through. */
export function budgetKindLabel(kind: string, observationCount?: number): string {
  if (kind === 'observations' && observationCount !== undefined) return `Type A, n = ${observationCount}`;
  return (KIND_SHORT as Record<string, string>)[kind] ?? kind;
}
