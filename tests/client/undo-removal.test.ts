import { describe, expect, it } from 'vitest';
import { restoreAt } from '../../src/features/editor/undo-removal';

describe('restoreAt: Undo puts a removed item back at its place', () => {
  const a = { s: 'a' };
  const b = { s: 'b' };
  const c = { s: 'c' };
  it('restores the middle item between its neighbours', () => {
    expect(restoreAt([a, c], b, 1)).toEqual([a, b, c]);
  });
  it('keeps edits made since the removal', () => {
    const a2 = { s: 'a edited' };
    expect(restoreAt([a2, c], b, 1)).toEqual([a2, b, c]);
  });
  it('appends when the list has become shorter than its old place', () => {
    expect(restoreAt([a], c, 2)).toEqual([a, c]);
  });
  it('does not restore twice', () => {
    expect(restoreAt([a, b, c], b, 1)).toEqual([a, b, c]);
  });
});
