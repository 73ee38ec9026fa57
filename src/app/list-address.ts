/*
 * Reading a list's address without React, so that code which fetches a list ahead of its page
 * (src/app/app.tsx) reads it as the page does.
 */

/** The two directions of a sorted list, as the address and the server's sort query write them. */
export const SORT_ORDERS = ['asc', 'desc'] as const;

/** The page a list's address asks for, from 1; a page past the last is the list's to correct (`useKeepPageInRange`). */
export function pageOf(params: URLSearchParams): number {
  return Math.max(1, Number(params.get('page') ?? '1') || 1);
}

/** The parameter when it is one of `choices` (a sort column, an order), else `fallback`: an old or edited link still shows a list. */
export function paramOneOf<T extends string>(params: URLSearchParams, key: string, choices: readonly T[], fallback: T): T {
  const v = params.get(key);
  return v !== null && (choices as readonly string[]).includes(v) ? (v as T) : fallback;
}
