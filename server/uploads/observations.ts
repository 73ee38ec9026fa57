import { LIMITS } from '../../shared/budget/limits';
import type { ObservationsResult, RowError } from '../../shared/api/uploads';
import { readObservationLayout, readObservationNumber } from '../../shared/observations/parse-observations';
import { AppError, PayloadTooLargeError, ValidationError } from '../http/errors';

/**
 * Reads one column of numbers from CSV text. A first row that is not numeric
 * in the chosen column is taken as the header. `column` is a header name or a 1-based index; it may
 * be left out when the file has a single column. At most LIMITS.observations data rows are read:
 * the parser stops one row past the cap (plus a header), so a long file costs no more than that.
 */
export function parseObservations(text: string, column?: string): ObservationsResult {
  if (text.includes('\u0000')) throw new ValidationError('the file is not text', 'file');
  const cap = LIMITS.observations;
  // One row past the cap, plus a header, is enough to refuse a longer file.
  const layout = readObservationLayout(text, cap + 2);
  if (layout.ambiguity) throw new ValidationError(layout.ambiguity, 'file');
  const rows = layout.rows.map((r) => r.cells);
  if (rows.length === 0) throw new ValidationError('the file has no rows', 'file');
  const toNumber = (cell: string) => readObservationNumber(cell, layout.decimalMark);
  let width = 0;
  for (const r of rows) if (r.length > width) width = r.length;
  const first = rows[0];
  const looksLikeHeader = first.some((c) => c.trim() !== '' && toNumber(c) === null);
  let columns = Array.from({ length: width }, (_, i) => (looksLikeHeader ? (first[i]?.trim() ?? null) : null));

  let index: number;
  if (column === undefined || column === '') {
    if (width !== 1) {
      throw new AppError(400, 'choose_column', `the file has ${width} columns; choose one`, 'column', { columns });
    }
    index = 0;
  } else if (/^\d+$/.test(column)) {
    index = Number(column) - 1;
    if (index < 0 || index >= width) throw new ValidationError(`column ${column} does not exist (the file has ${width})`, 'column');
  } else {
    index = columns.findIndex((c) => c === column);
    if (index < 0) throw new AppError(400, 'unknown_column', `no column is headed "${column}"`, 'column', { columns });
  }

  // The first row is a header when the chosen column does not hold a number there.
  const header = looksLikeHeader && toNumber(first[index] ?? '') === null;
  if (!header) columns = columns.map(() => null);
  if (rows.length - (header ? 1 : 0) > cap) {
    throw new PayloadTooLargeError(`the file has more than ${cap.toLocaleString('en-GB')} rows; a column may hold at most ${cap.toLocaleString('en-GB')} observations`);
  }
  const values: number[] = [];
  const errors: RowError[] = [];
  rows.forEach((r, i) => {
    if (header && i === 0) return;
    const cell = r[index];
    const line = layout.rows[i].line;
    if (cell === undefined || cell.trim() === '') {
      errors.push({ row: line, message: 'the cell is empty' });
      return;
    }
    const n = toNumber(cell);
    if (n === null) errors.push({ row: line, message: `"${cell.trim().slice(0, 40)}" is not a number` });
    else values.push(n);
  });
  errors.sort((a, b) => a.row - b.row);
  return { values, column: { index: index + 1, name: columns[index] ?? null }, columns, header, rows: rows.length - (header ? 1 : 0), errors };
}
