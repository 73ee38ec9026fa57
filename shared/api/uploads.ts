/** `POST /api/uploads/observations`: one column of numbers read from a CSV file. Types only. */

export interface RowError {
  /** 1-based line number in the file. */
  row: number;
  message: string;
}

export interface ObservationsResult {
  values: number[];
  column: { index: number; name: string | null };
  columns: (string | null)[];
  header: boolean;
  rows: number;
  errors: RowError[];
}
