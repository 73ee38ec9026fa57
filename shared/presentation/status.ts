/*
 * The status of a budget version in one word or phrase, the same on screen and on paper.
 */

import type { VersionStatus } from '../policy/version-status';

export { versionStatus, type VersionStatus } from '../policy/version-status';

export const STATUS_WORDS: Record<VersionStatus, string> = {
  draft: 'Draft',
  returned: 'Draft (returned by the reviewer)',
  in_review: 'In review',
  approved: 'Approved',
  superseded: 'Superseded draft',
};

/** Whether a version in this status carries the "not approved" mark on screen, in print and in the PDF. */
export function isUnapproved(status: VersionStatus): boolean {
  return status !== 'approved';
}

/** The words printed across every page of an unapproved version. */
export const DRAFT_MARK = 'DRAFT — not approved';

/** The laboratory named on reports whose budget file names none (the demo lab). */
const DEFAULT_LAB = 'Kestrel Fen Metrology Laboratory';

/** The laboratory a report names: the budget file's `lab` when it gives one. */
export function labOf(document: object, fallback = DEFAULT_LAB): string {
  const lab = (document as { lab?: unknown }).lab;
  return typeof lab === 'string' && lab.trim() ? lab.trim() : fallback;
}
