/**
 * Reading observations (repeated indications, GUM 4.2) from text pasted out of
 * a spreadsheet or uploaded as a CSV file. One reader for the editor and the
 * server, so a column of numbers means the same figures wherever it enters.
 *
 * A comma can be a decimal mark (50,02), a digit-group separator (1,234.5) or a
 * column separator (50.02,50.03). The reader tries each reading of the whole
 * text, keeps the one that reads the most cells, prefers one value per line
 * when a comma-separated reading does no better (so one comma in a number and
 * no other separator is a decimal comma: 1,234 is 1.234), and refuses to
 * choose when two readings read equally well but give different numbers
 * (50.02 on one line, 50,03 on the next): it says so instead of guessing.
 */

import Papa from 'papaparse';

export type DecimalMark = '.' | ',';
/** How the cells of a line are separated; null when each line holds one value. */
type CellSeparator = '\t' | ';' | ',' | null;

interface ObservationRow {
  /** 1-based line number in the text. */
  line: number;
  cells: string[];
}

export interface ObservationLayout {
  separator: CellSeparator;
  decimalMark: DecimalMark;
  /** Non-blank lines split into cells (quotes removed). */
  rows: ObservationRow[];
  /** Why the text cannot be read without a guess, or null. */
  ambiguity: string | null;
}

export interface IgnoredLine {
  /** 1-based line number in the text. */
  line: number;
  reason: string;
}

export interface ObservationText {
  values: number[];
  /** Every non-blank line that gave no value or not all of its cells, with the reason. */
  ignored: IgnoredLine[];
  separator: CellSeparator;
  decimalMark: DecimalMark;
  ambiguity: string | null;
}

const SPACE = '[ \\u00a0\\u202f\\u2009]';
const SPACES = /[ \u00a0\u202f\u2009]/g;

const numberPattern = (mark: string, group: string) => new RegExp(`^([+-]?)(\\d{1,3}(?:${group}\\d{3})+|\\d+)?(?:${mark}(\\d+(?:${SPACE}\\d+)*)?)?(?:[eE]([+-]?\\d+))?$`);
const NUMBER_PATTERN: Record<DecimalMark, RegExp> = { '.': numberPattern('\\.', `(?:,|${SPACE})`), ',': numberPattern(',', `(?:\\.|${SPACE})`) };

/**
 * The number a cell writes with the given decimal mark, or null. Accepts a sign
 * (including U+2212 minus), digit groups of three separated by a space, a thin
 * space or the other mark (SI Brochure 5.4.4; 1 234,5 or 1,234.5), spaces
 * between digits after the mark, and a decimal exponent (5.002e1). A single
 * group mark without the decimal mark (1,234 read with a decimal point) is not
 * a number here: it is the decimal mark of the other reading.
 */
export function readObservationNumber(cell: string, decimalMark: DecimalMark): number | null {
  const s = unquote(cell.trim()).replace(/\u2212/g, '-');
  const m = NUMBER_PATTERN[decimalMark].exec(s);
  if (!m) return null;
  const [, sign, whole, fraction, exponent] = m;
  if (!whole && !fraction) return null;
  // 1,234 or 5.002 alone is not grouped: its one mark is the decimal mark of the other reading
  const other = decimalMark === '.' ? ',' : '.';
  if (whole && fraction === undefined && !s.includes(decimalMark) && whole.split(other).length === 2) return null;
  const digits = `${sign}${(whole ?? '0').replace(/[^\d]/g, '')}.${(fraction ?? '0').replace(SPACES, '')}${exponent !== undefined ? `e${exponent}` : ''}`;
  const n = Number(digits);
  return Number.isFinite(n) ? n : null;
}

function unquote(s: string): string {
  return s.length >= 2 && s.startsWith('"') && s.endsWith('"') ? s.slice(1, -1).replace(/""/g, '"').trim() : s;
}

const PAPA = { quoteChar: '"', escapeChar: '"', newline: '\n' } as const;

/**
 * The cells of every line at the separator, each trimmed and unquoted: one
 * papaparse run over the lines, quotes as RFC 4180 writes them (`"50,02"` is
 * one cell, `""` inside quotes a quote). A quote left open would join the
 * lines after it into one row: then each line is split alone, so every row
 * keeps its line.
 */
function splitLines(lines: readonly { text: string }[], separator: CellSeparator): string[][] {
  if (separator === null) return lines.map((l) => [l.text.trim()]);
  const config = { ...PAPA, delimiter: separator };
  const all = lines.length ? Papa.parse<string[]>(lines.map((l) => l.text).join('\n'), config).data : [];
  const rows = all.length === lines.length ? all : lines.map((l) => Papa.parse<string[]>(l.text, config).data[0] ?? ['']);
  return rows.map((cells) => cells.map((c) => unquote(c.trim())));
}

interface Reading {
  separator: CellSeparator;
  decimalMark: DecimalMark;
  rows: ObservationRow[];
  numbers: (number | null)[][];
  unread: number;
}

function read(lines: { line: number; text: string }[], cells: string[][], separator: CellSeparator, decimalMark: DecimalMark): Reading {
  const rows = lines.map((l, i) => ({ line: l.line, cells: cells[i] }));
  const numbers = rows.map((r) => r.cells.map((c) => (c === '' ? null : readObservationNumber(c, decimalMark))));
  const unread = numbers.reduce((sum, r, i) => sum + r.filter((n, j) => n === null && rows[i].cells[j] !== '').length, 0);
  return { separator, decimalMark, rows, numbers, unread };
}

const sameNumbers = (a: Reading, b: Reading) => JSON.stringify(a.numbers.map((r) => r.filter((n) => n !== null))) === JSON.stringify(b.numbers.map((r) => r.filter((n) => n !== null)));

/** The first line where two readings give different numbers, for the message that names it. */
function firstDifference(a: Reading, b: Reading): ObservationRow | undefined {
  const i = a.numbers.findIndex((r, k) => JSON.stringify(r.filter((n) => n !== null)) !== JSON.stringify(b.numbers[k].filter((n) => n !== null)));
  return i >= 0 ? a.rows[i] : undefined;
}

/**
 * Splits the text into lines and cells and decides the separator and the
 * decimal mark. A tab, else a semicolon, separates cells when present; a comma
 * separates cells only when every line (but a heading) has as many of them and
 * that reads more cells as numbers than reading it as a decimal mark or a
 * digit-group separator (so `50,02` on its own line is 50.02), or when a
 * heading with as many commas names the columns.
 */
export function readObservationLayout(text: string, maxLines = Infinity): ObservationLayout {
  const lines = nonBlankLines(text.replace(/^\uFEFF/, ''), maxLines);
  const hasTab = lines.some((l) => l.text.includes('\t'));
  const hasSemicolon = lines.some((l) => l.text.includes(';'));
  // commas separate columns only if every line but a first (heading) one has the same number of them
  const commaCells = hasTab || hasSemicolon ? null : splitLines(lines, ',');
  const commas = (i: number) => (commaCells?.[i].length ?? 1) - 1;
  const numberless = [lines[0]?.text ?? '', ...(commaCells?.[0] ?? [])].every((c) => readObservationNumber(c, '.') === null && readObservationNumber(c, ',') === null);
  const headed = lines.length > 1 && numberless;
  const from = headed ? 1 : 0;
  const commaTable = from < lines.length && commas(from) > 0 && lines.every((_, i) => i < from || commas(i) === commas(from));
  const separators: CellSeparator[] = hasTab ? ['\t'] : hasSemicolon ? [';'] : commaTable ? [null, ','] : [null];
  const readings: Reading[] = [];
  for (const separator of separators) {
    const cells = separator === ',' && commaCells ? commaCells : splitLines(lines, separator);
    for (const mark of ['.', ','] as const) {
      // a comma cannot both separate cells and mark decimals
      if (!(separator === ',' && mark === ',')) readings.push(read(lines, cells, separator, mark));
    }
  }
  // A first line no reading finds a number in is a heading: it decides nothing about the marks
  // except that a heading with as many commas as every other line names comma-separated columns.
  const heading = lines.length > 1 && readings.every((r) => r.numbers[0].every((n) => n === null));
  const unread = (r: Reading) => r.unread - (heading ? r.rows[0].cells.filter((c) => c !== '').length : 0);
  const commaHeading = commaTable && headed && commas(0) === commas(from);
  const fewest = Math.min(...readings.map(unread));
  let best = readings.filter((r) => unread(r) === fewest);
  // one value per line wins a tie with comma-separated cells, unless a heading names the columns
  const preferComma = commaHeading && best.some((r) => r.separator === ',');
  if (preferComma) best = best.filter((r) => r.separator === ',');
  else if (best.some((r) => r.separator !== ',')) best = best.filter((r) => r.separator !== ',');
  const first = best[0];
  const rival = best.find((r) => !sameNumbers(r, first));
  if (!rival) return { separator: first.separator, decimalMark: first.decimalMark, rows: first.rows, ambiguity: null };
  const where = firstDifference(first, rival);
  const sample = where ? `line ${where.line} ("${where.cells.join(first.separator ?? '')}")` : 'the text';
  const ambiguity = `the text mixes decimal points and decimal commas (${sample} is read differently by each); use one decimal mark throughout`;
  return { separator: first.separator, decimalMark: first.decimalMark, rows: first.rows, ambiguity };
}

/**
 * The non-blank lines of a text with their 1-based numbers, at most `maxLines`
 * of them: a long file is read no further than the cap (the caller refuses it).
 */
function nonBlankLines(text: string, maxLines: number): { line: number; text: string }[] {
  const lines: { line: number; text: string }[] = [];
  const breaks = /\r\n|\r|\n/g;
  let start = 0;
  let number = 1;
  while (lines.length < maxLines) {
    const m = breaks.exec(text);
    const end = m ? m.index : text.length;
    const t = text.slice(start, end);
    if (t.trim() !== '') lines.push({ line: number, text: t });
    if (!m) break;
    start = m.index + m[0].length;
    number++;
  }
  return lines;
}

/**
 * Every number in pasted text, line by line and cell by cell, with each line it
 * ignored and why (`line 1: "n/a" is not a number`). Blank lines are skipped
 * silently. When the decimal mark cannot be decided the text gives no values.
 */
export function parseObservationText(text: string): ObservationText {
  const layout = readObservationLayout(text);
  const { separator, decimalMark, ambiguity } = layout;
  if (ambiguity) return { values: [], ignored: [], separator, decimalMark, ambiguity };
  const values: number[] = [];
  const ignored: IgnoredLine[] = [];
  layout.rows.forEach((row, i) => {
    const unread = row.cells.filter((c) => c !== '' && readObservationNumber(c, decimalMark) === null);
    for (const c of row.cells) {
      const n = c === '' ? null : readObservationNumber(c, decimalMark);
      if (n !== null) values.push(n);
    }
    if (unread.length === 0) return;
    const heading = i === 0 && unread.length === row.cells.filter((c) => c !== '').length && !/\d/.test(unread.join(''));
    const what = unread.map((c) => `"${c.slice(0, 40)}"`).join(', ');
    const reason = `${what} ${unread.length > 1 ? 'are not numbers' : 'is not a number'}${heading ? ' (read as a heading)' : ''}`;
    ignored.push({ line: row.line, reason });
  });
  return { values, ignored, separator, decimalMark, ambiguity: null };
}

/** `line 3: "n/a" is not a number`: an ignored line as the user reads it. */
export function describeIgnoredLine(l: IgnoredLine): string {
  return `line ${l.line}: ${l.reason}`;
}
