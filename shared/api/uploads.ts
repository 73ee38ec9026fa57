/** Payloads of the upload routes: observations from CSV files, evidence attachments. Types only. */

export interface RowError {
  /** 1-based line number in the file. */
  row: number;
  message: string;
}

/** `POST /api/uploads/observations`: one column of numbers read from a CSV file. */
export interface ObservationsResult {
  values: number[];
  column: { index: number; name: string | null };
  columns: (string | null)[];
  header: boolean;
  rows: number;
  errors: RowError[];
}

/** Evidence kept with a budget: `GET|POST /api/budgets/:id/attachments`. */
export interface Attachment {
  id: number;
  budgetId: number;
  /** The version it was added to; it belongs to that version and every later one. */
  versionNumber: number;
  /** The input quantity it supports, or null for the whole budget. */
  symbol: string | null;
  fileName: string;
  size: number;
  /** SHA-256 (hex) of the file as stored. */
  sha256: string;
  mediaType: string;
  uploadedBy: number;
  uploaderName: string;
  createdAt: number;
}

/** `POST /api/budgets/:id/attachments` (201): the attachment, and whether it started a new draft version. */
export interface AddedAttachment extends Attachment {
  /** True when the current version was approved: the evidence went to a new draft version instead. */
  newVersion: boolean;
}
