import { z } from 'zod';

/**
 * The ids a route takes from its path (and the same ids in a query or body), one schema per kind:
 * a positive whole number, coerced from the text of the path, refused with what it should be.
 */
function positiveId(what: string) {
  const message = `must be ${what}`;
  return z.coerce.number({ error: message }).int({ message }).positive({ message });
}

export const budgetId = positiveId('a budget id');
export const versionNumber = positiveId('a version number');
const commentId = positiveId('a comment id');
const attachmentId = positiveId('an attachment id');
export const userId = positiveId('a user id');

/** `/api/budgets/:id…` */
export const budgetParams = z.strictObject({ id: budgetId });
/** `/api/budgets/:id/versions/:n…` */
export const versionParams = z.strictObject({ id: budgetId, n: versionNumber });
/** `/api/budgets/:id/comments/:cid` */
export const commentParams = z.strictObject({ id: budgetId, cid: commentId });
/** `/api/budgets/:id/attachments/:aid` */
export const attachmentParams = z.strictObject({ id: budgetId, aid: attachmentId });
/** `/api/users/:id` */
export const userParams = z.strictObject({ id: userId });

/** A quantity of a budget named by its symbol (an input, a constant or the measurand). */
export const quantitySymbol = z.string().regex(/^[A-Za-z_][A-Za-z0-9_]*$/, { message: 'must be a symbol name' });

/** `limit` and `offset` of a listing query: at most `maxLimit` rows a page, `defaultLimit` unless asked. */
export function pageQuery(maxLimit: number, defaultLimit: number) {
  return {
    limit: z.coerce.number().int().min(1).max(maxLimit).default(defaultLimit),
    offset: z.coerce.number().int().min(0).default(0),
  };
}

/**
 * `sort` and `order` of a listing query: one of the columns the repository orders by, so a page
 * holds the rows it would hold in the whole sorted list.
 */
export function sortQuery<C extends string>(columns: readonly [C, ...C[]], defaultColumn: C, defaultOrder: 'asc' | 'desc') {
  return {
    sort: z.enum(columns, { error: `must be one of ${columns.join(', ')}` }).default(defaultColumn),
    order: sortOrder(defaultOrder),
  };
}

/** `order` alone, for a list that sorts by one column only. */
export function sortOrder(defaultOrder: 'asc' | 'desc') {
  return z.enum(['asc', 'desc'], { error: 'must be asc or desc' }).default(defaultOrder);
}
