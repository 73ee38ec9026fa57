import { groupDigits } from '../../shared/format/digit-groups';
import { DIGIT_GROUP_SEPARATOR } from '../../shared/format/signs';
import { superscript } from '../../shared/format/superscript';

/*
 * The tiny markup of the printed report, `^{…}` raises and `_{…}` lowers, and
 * the dates of the record. Figures and units come typeset from the result
 * model (shared/presentation) in this markup.
 */

export { groupDigits };
export const THIN = DIGIT_GROUP_SEPARATOR;

/** Markup to plain text with Unicode superscripts, for places that cannot raise text. */
export function plainText(markup: string): string {
  return markup
    .replace(/\^\{([^}]*)\}/g, (_m, e: string) => superscript(e))
    .replace(/_\{([^}]*)\}/g, '$1')
    .replace(new RegExp(THIN, 'g'), ' ');
}

/** A moment in UTC, unambiguous on paper: 2026-03-14 09:42 UTC. */
export function formatMoment(ms: number): string {
  return `${new Date(ms).toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

export function formatDate(ms: number): string {
  return new Date(ms).toISOString().slice(0, 10);
}
