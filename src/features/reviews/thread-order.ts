import type { Comment } from '../../../shared/api/reviews';

/**
 * A thread's comments in reading order: each first comment, in the order
 * given (the server's, oldest first), followed by its replies in that order.
 * A reply whose first comment is not in the list (another thread's, or one no
 * longer listed) stands on its own at its place, so no comment is ever hidden.
 */
export function threadOrder(list: readonly Comment[]): Comment[] {
  const ids = new Set(list.map((c) => c.id));
  const replies = new Map<number, Comment[]>();
  for (const c of list) if (c.parentId !== null && ids.has(c.parentId)) replies.set(c.parentId, [...(replies.get(c.parentId) ?? []), c]);
  return list.filter((c) => c.parentId === null || !ids.has(c.parentId)).flatMap((c) => [c, ...(replies.get(c.id) ?? [])]);
}

/** How many comments a quantity's thread holds and how many of them are not resolved. */
export interface ThreadCount {
  total: number;
  open: number;
}

/** The comment count of each quantity's thread, in the order the quantities are first commented on; comments on the whole budget are left out. */
export function threadCounts(list: readonly Comment[]): Map<string, ThreadCount> {
  const bySymbol = new Map<string, ThreadCount>();
  for (const c of list) {
    if (!c.symbol) continue;
    const s = bySymbol.get(c.symbol) ?? { total: 0, open: 0 };
    s.total++;
    if (!c.resolved) s.open++;
    bySymbol.set(c.symbol, s);
  }
  return bySymbol;
}

/** Threads not resolved: a thread resolves as a whole, so its first comment says. */
export function openThreadCount(list: readonly Comment[]): number {
  return list.filter((c) => !c.resolved && c.parentId === null).length;
}
