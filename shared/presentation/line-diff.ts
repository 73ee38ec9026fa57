/*
 * The lines of two texts side by side (a model before and after), each row
 * marked as the same, changed, added or removed.
 */

export type LineChange = 'same' | 'changed' | 'added' | 'removed';

/** One row of the side-by-side view: the older line on the left, the newer on the right, null where a side has none. */
export interface DiffRow {
  change: LineChange;
  left: string | null;
  right: string | null;
}

/**
 * Above this many cells of the common-subsequence table (older lines × newer
 * lines, after the common head and tail are set aside) the middle is shown as
 * removed then added instead: 4·10⁶ cells are 16 MB, a model of the largest
 * allowed length could ask for gigabytes.
 */
export const LINE_DIFF_MAX_CELLS = 4_000_000;

const linesOf = (text: string): string[] => (text === '' ? [] : text.split('\n'));

/**
 * Line-by-line difference of two texts.
 *
 * Algorithm: the lines both texts begin and end with are kept as `same`; the
 * rest is aligned on a longest common subsequence of whole lines (dynamic
 * programming, L[i][j] = length of the LCS of a[i..] and b[j..]). Walking the
 * table from the top: equal lines are `same`; where pairing the next line of
 * each side loses no common line, the two stand side by side as `changed`;
 * otherwise the newer line is `added` when that keeps the LCS (added before
 * removed), else the older line is `removed`.
 *
 * Holds for: lines compared exactly (no trimming of spaces), `\n` as the line
 * end; an empty text has no lines. A line moved elsewhere is one removed and
 * one added row (the LCS keeps the longer run of unmoved lines in place).
 * Time and memory are proportional to the product of the line counts of the
 * differing middles; above LINE_DIFF_MAX_CELLS the middle is shown as all its
 * older lines removed, then all its newer lines added — still a true account
 * of both texts, only not the shortest one.
 */
export function lineDiff(older: string, newer: string): DiffRow[] {
  const a = linesOf(older);
  const b = linesOf(newer);
  let head = 0;
  while (head < a.length && head < b.length && a[head] === b[head]) head++;
  let tail = 0;
  while (tail < a.length - head && tail < b.length - head && a[a.length - 1 - tail] === b[b.length - 1 - tail]) tail++;

  const rows: DiffRow[] = [];
  for (let k = 0; k < head; k++) rows.push({ change: 'same', left: a[k], right: b[k] });
  rows.push(...middleDiff(a.slice(head, a.length - tail), b.slice(head, b.length - tail)));
  for (let k = tail; k > 0; k--) rows.push({ change: 'same', left: a[a.length - k], right: b[b.length - k] });
  return rows;
}

function middleDiff(x: string[], y: string[]): DiffRow[] {
  const n = x.length;
  const m = y.length;
  if ((n + 1) * (m + 1) > LINE_DIFF_MAX_CELLS) {
    return [...x.map((left): DiffRow => ({ change: 'removed', left, right: null })), ...y.map((right): DiffRow => ({ change: 'added', left: null, right }))];
  }
  const w = m + 1;
  const L = new Int32Array((n + 1) * w);
  const at = (i: number, j: number) => L[i * w + j];
  for (let i = n - 1; i >= 0; i--) {
    for (let j = m - 1; j >= 0; j--) L[i * w + j] = x[i] === y[j] ? at(i + 1, j + 1) + 1 : Math.max(at(i + 1, j), at(i, j + 1));
  }
  const rows: DiffRow[] = [];
  let i = 0;
  let j = 0;
  while (i < n || j < m) {
    if (i < n && j < m && x[i] === y[j]) {
      rows.push({ change: 'same', left: x[i++], right: y[j++] });
    } else if (i < n && j < m && at(i + 1, j) === at(i, j + 1) && at(i + 1, j + 1) === at(i, j)) {
      // a line replaced by another: side by side
      rows.push({ change: 'changed', left: x[i++], right: y[j++] });
    } else if (j < m && (i >= n || at(i, j + 1) >= at(i + 1, j))) {
      rows.push({ change: 'added', left: null, right: y[j++] });
    } else {
      rows.push({ change: 'removed', left: x[i++], right: null });
    }
  }
  return rows;
}
