import { describe, expect, it } from 'vitest';
import type { Comment } from '../../shared/api/reviews';
import { openThreadCount, threadCounts, threadOrder } from '../../src/features/reviews/thread-order';

let nextTime = 1_700_000_000_000;
function comment(id: number, over: Partial<Comment> = {}): Comment {
  return {
    id,
    budgetId: 1,
    versionNumber: 1,
    symbol: null,
    parentId: null,
    authorId: 2,
    authorName: 'R. Teal',
    body: `comment ${id}`,
    resolved: false,
    resolvedBy: null,
    resolvedByName: null,
    resolvedAt: null,
    createdAt: nextTime++,
    ...over,
  };
}

const ids = (list: Comment[]) => list.map((c) => c.id);

describe('threadOrder: comments in reading order', () => {
  it('puts each reply right after its first comment, replies in their own order', () => {
    // server order: oldest first, replies interleaved with later threads
    const list = [comment(1), comment(2), comment(3, { parentId: 1 }), comment(4, { parentId: 2 }), comment(5, { parentId: 1 })];
    expect(ids(threadOrder(list))).toEqual([1, 3, 5, 2, 4]);
  });

  it('keeps first comments in the order given', () => {
    expect(ids(threadOrder([comment(7), comment(3), comment(5)]))).toEqual([7, 3, 5]);
  });

  it('shows a reply whose first comment is not in the list on its own, at its place, never dropping it', () => {
    const list = [comment(10), comment(11, { parentId: 99 }), comment(12, { parentId: 10 })];
    const ordered = threadOrder(list);
    expect(ids(ordered)).toEqual([10, 12, 11]);
    expect(ordered).toHaveLength(list.length);
  });

  it('gives nothing for no comments and does not change the list it is given', () => {
    expect(threadOrder([])).toEqual([]);
    const list = [comment(1), comment(2, { parentId: 1 })];
    const copy = [...list];
    threadOrder(list);
    expect(list).toEqual(copy);
  });
});

describe('threadCounts and openThreadCount: the overview of the review column', () => {
  const list = [
    comment(1, { symbol: 'δL' }),
    comment(2, { symbol: 'δL', parentId: 1 }),
    comment(3, { symbol: 'L_s', resolved: true }),
    comment(4, { symbol: 'L_s', parentId: 3, resolved: true }),
    comment(5),
    comment(6, { symbol: 'θ', resolved: true }),
    comment(7, { symbol: 'θ', parentId: 6, resolved: false }),
  ];

  it('counts every comment per quantity with the ones not resolved, in the order quantities were first commented on', () => {
    expect([...threadCounts(list)]).toEqual([
      ['δL', { total: 2, open: 2 }],
      ['L_s', { total: 2, open: 0 }],
      ['θ', { total: 2, open: 1 }],
    ]);
  });

  it('counts open threads by their first comment, the whole-budget thread included', () => {
    // threads 1 (δL) and 5 (the budget) are open; 3 and 6 are resolved
    expect(openThreadCount(list)).toBe(2);
  });
});
