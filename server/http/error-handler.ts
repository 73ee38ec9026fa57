import type { ErrorRequestHandler, RequestHandler } from 'express';
import multer from 'multer';
import { BudgetError } from '../../shared/budget/budget-error';
import { AppError, BusyError, NotFoundError } from './errors';

export interface ErrorBody {
  error: { code: string; message: string; field?: string; [k: string]: unknown };
}

function body(code: string, message: string, field?: string, extra?: Record<string, unknown>): ErrorBody {
  return { error: { code, message, ...(field ? { field } : {}), ...(extra ?? {}) } };
}

/** Unknown API paths answer JSON, not HTML. */
export const apiNotFound: RequestHandler = (_req, _res, next) => next(new NotFoundError('no such API route'));

/** The one place where errors become responses. Never sends a stack trace. */
export function errorHandler(log: (msg: string, err: unknown) => void): ErrorRequestHandler {
  return (err, _req, res, next) => {
    if (res.headersSent) return next(err);
    if (err instanceof AppError) {
      if (err instanceof BusyError) res.setHeader('Retry-After', String(err.retryAfterSeconds));
      res.status(err.status).json(body(err.code, err.message, err.field, err.extra));
      return;
    }
    if (err instanceof BudgetError) {
      res.status(422).json(body(err.code, err.message, err.field));
      return;
    }
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        res.status(413).json(body('too_large', `the file is larger than allowed`, err.field));
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
