import type { ErrorRequestHandler, RequestHandler } from 'express';
import multer from 'multer';
import { BudgetError } from '../../shared/budget/budget-error';
import { problemOf, type BudgetProblem } from '../../shared/budget/problems';
import { AppError, MalformedUploadError, NotFoundError, RetryLaterError, StorageFullError, StorageReadOnlyError, UnavailableError } from './errors';

/**
 * Every error answer. A budget the engine refuses (422) answers its `BudgetProblem`:
 * `code`, `field` ('' for the budget as a whole), `location` in the model where there is one, `message`.
 */
interface ErrorBody {
  error: { code: string; message: string; field?: string; [k: string]: unknown } | BudgetProblem;
}

function body(code: string, message: string, field?: string, extra?: Record<string, unknown>): ErrorBody {
  return { error: { code, message, ...(field ? { field } : {}), ...(extra ?? {}) } };
}

/** Unknown API paths answer JSON, not HTML. */
export const apiNotFound: RequestHandler = (_req, _res, next) => next(new NotFoundError('no such API route'));

const FULL = new Set(['SQLITE_FULL', 'ENOSPC', 'EDQUOT']);
const READ_ONLY = new Set(['SQLITE_READONLY', 'SQLITE_READONLY_DIRECTORY', 'SQLITE_READONLY_DBMOVED', 'SQLITE_CANTOPEN', 'EROFS', 'EACCES', 'EPERM']);
/** What busboy (under multer) throws for a body that is not the multipart form its header announces. */
const MULTIPART = [
  [/boundary not found/i, 'the multipart form has no boundary: let the client set the Content-Type header with its boundary'],
  [/unexpected end of (form|file|multipart data)/i, 'the upload ended before the form was complete; send the file again'],
  [/malformed part header|malformed urlencoded form/i, 'the multipart form is malformed; send the file again'],
] as const;

/** Errors of the system below the services (disk, database file, request body) as typed errors, or null. */
export function systemError(err: unknown): AppError | null {
  const e = err as { code?: unknown; message?: unknown } | null;
  const code = typeof e?.code === 'string' ? e.code : '';
  if (FULL.has(code)) return new StorageFullError();
  if (READ_ONLY.has(code) || code.startsWith('SQLITE_READONLY')) return new StorageReadOnlyError();
  if (code === 'SQLITE_BUSY' || code === 'SQLITE_LOCKED') {
    return new UnavailableError('the database is held by another writer (a backup or a second server?); try again in a moment', 'storage_busy');
  }
  if (err instanceof Error && !code) {
    for (const [pattern, message] of MULTIPART) if (pattern.test(err.message)) return new MalformedUploadError(message, 'file');
  }
  return null;
}

/** The one place where errors become responses. Never sends a stack trace. */
export function errorHandler(log: (msg: string, err: unknown) => void): ErrorRequestHandler {
  return (thrown, _req, res, next) => {
    if (res.headersSent) return next(thrown);
    const system = systemError(thrown);
    if (system && system.status >= 500) log('storage error', thrown);
    const err = system ?? thrown;
    if (err instanceof AppError) {
      if (err instanceof RetryLaterError) res.setHeader('Retry-After', String(err.retryAfterSeconds));
      res.status(err.status).json(body(err.code, err.message, err.field, err.extra));
      return;
    }
    if (err instanceof BudgetError) {
      res.status(422).json({ error: problemOf(err) } satisfies ErrorBody);
      return;
    }
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        res.status(413).json(body('too_large', 'the file is larger than allowed', err.field));
      } else {
        res.status(400).json(body('invalid_upload', err.message, err.field));
      }
      return;
    }
    const e = err as { type?: string; status?: number; message?: string };
    if (e?.type === 'entity.parse.failed') {
      res.status(400).json(body('invalid_json', 'the request body is not valid JSON'));
      return;
    }
    if (e?.type === 'entity.too.large') {
      res.status(413).json(body('too_large', 'the request body is larger than allowed'));
      return;
    }
    if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
      res.status(e.status).json(body('bad_request', 'the request could not be read'));
      return;
    }
    log('unhandled error', err);
    res.status(500).json(body('internal', 'something went wrong on the server; the error was logged'));
  };
}
