import { describe, expect, it } from 'vitest';
import { LINE_DIFF_MAX_CELLS, lineDiff, type DiffRow } from '../../shared/presentation/line-diff';

/** The rows as `mark text` strings, so an expectation reads like the screen. */
const view = (rows: DiffRow[]) => rows.map((r) => (r.change === 'same' ? `= ${r.left}` : r.change === 'added' ? `+ ${r.right}` : r.change === 'removed' ? `- ${r.left}` : `~ ${r.left} -> ${r.right}`));

describe('lineDiff: the model lines of two versions side by side', () => {
  it('marks every line of identical texts unchanged, each on both sides', () => {
    const rows = lineDiff('a = b\ny = a + c', 'a = b\ny = a + c');
    expect(rows).toEqual([
      { change: 'same', left: 'a = b', right: 'a = b' },
      { change: 'same', left: 'y = a + c', right: 'y = a + c' },
    ]);
  });

  it('shows an added line on the right only, at its place', () => {
    expect(view(lineDiff('a = 1\ny = a', 'a = 1\nb = 2\ny = a'))).toEqual(['= a = 1', '+ b = 2', '= y = a']);
    expect(lineDiff('a = 1\ny = a', 'a = 1\nb = 2\ny = a')[1]).toEqual({ change: 'added', left: null, right: 'b = 2' });
  });

  it('shows a removed line on the left only, at its place', () => {
    expect(view(lineDiff('a = 1\nb = 2\ny = a', 'a = 1\ny = a'))).toEqual(['= a = 1', '- b = 2', '= y = a']);
    expect(lineDiff('a = 1\nb = 2\ny = a', 'a = 1\ny = a')[1]).toEqual({ change: 'removed', left: 'b = 2', right: null });
  });

  it('pairs a line replaced by another as changed, side by side', () => {
    expect(view(lineDiff('a = 1\ny = a + b', 'a = 1\ny = a - b'))).toEqual(['= a = 1', '~ y = a + b -> y = a - b']);
  });

  it('shows a moved line as removed where it was and added where it went, the other lines unchanged', () => {
    const rows = lineDiff('p = 1\nq = 2\nr = 3\ny = p + q + r', 'q = 2\nr = 3\np = 1\ny = p + q + r');
    expect(view(rows)).toEqual(['- p = 1', '= q = 2', '= r = 3', '+ p = 1', '= y = p + q + r']);
  });

  it('treats an empty text as having no lines', () => {
    expect(lineDiff('', '')).toEqual([]);
    expect(view(lineDiff('', 'a = 1\ny = a'))).toEqual(['+ a = 1', '+ y = a']);
    expect(view(lineDiff('a = 1\ny = a', ''))).toEqual(['- a = 1', '- y = a']);
  });

  it('compares lines exactly: a changed space is a change', () => {
    expect(view(lineDiff('y = a+b', 'y = a + b'))).toEqual(['~ y = a+b -> y = a + b']);
  });

  it('keeps every line of both texts in order, each once, whatever the edit', () => {
    const older = 'a = 1\nb = 2\nc = 3\nd = 4\ny = a + b + c + d';
    const newer = 'b = 2\na = 1\nc = 30\ne = 5\ny = a + b + c + e';
    const rows = lineDiff(older, newer);
    expect(rows.flatMap((r) => (r.left === null ? [] : [r.left])).join('\n')).toBe(older);
    expect(rows.flatMap((r) => (r.right === null ? [] : [r.right])).join('\n')).toBe(newer);
  });

  it('beyond the size of its table shows the differing middle removed then added, keeping the common head and tail', () => {
    const side = Math.ceil(Math.sqrt(LINE_DIFF_MAX_CELLS)) + 1;
    const older = ['head', ...Array.from({ length: side }, (_, i) => `a${i}`), 'tail'].join('\n');
    const newer = ['head', ...Array.from({ length: side }, (_, i) => `b${i}`), 'tail'].join('\n');
    const rows = lineDiff(older, newer);
    expect(rows).toHaveLength(2 * side + 2);
    expect(rows[0]).toEqual({ change: 'same', left: 'head', right: 'head' });
    expect(rows[1]).toEqual({ change: 'removed', left: 'a0', right: null });
    expect(rows[side + 1]).toEqual({ change: 'added', left: null, right: 'b0' });
    expect(rows[rows.length - 1]).toEqual({ change: 'same', left: 'tail', right: 'tail' });
  });
});
