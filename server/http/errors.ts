/** Typed errors of the services; `http/error-handler.ts` maps them to JSON. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
    this.name = new.target.name;
  }
}

export class ValidationError extends AppError {
  constructor(message: string, field?: string, code = 'invalid_input') {
    super(400, code, message, field);
  }
}

export class UnauthenticatedError extends AppError {
  constructor(message = 'sign in first', code = 'unauthenticated') {
    super(401, code, message);
  }
}

export class ForbiddenError extends AppError {
  constructor(message = 'your role does not allow this', code = 'forbidden') {
    super(403, code, message);
  }
}

export class NotFoundError extends AppError {
  constructor(message = 'not found', code = 'not_found') {
    super(404, code, message);
  }
}

export class ConflictError extends AppError {
  constructor(message: string, code = 'conflict', extra?: Record<string, unknown>) {
    super(409, code, message, undefined, extra);
  }
}

export class PayloadTooLargeError extends AppError {
  constructor(message: string) {
    super(413, 'too_large', message);
  }
}

export class UnsupportedMediaTypeError extends AppError {
  constructor(message: string, field?: string) {
    super(415, 'unsupported_media_type', message, field);
  }
}

/** The budget was refused by the engine (422, field names the culprit). */
export class UnprocessableError extends AppError {
  constructor(code: string, message: string, field?: string) {
    super(422, code, message, field);
  }
}

export class UnavailableError extends AppError {
  constructor(message: string, code = 'unavailable') {
    super(503, code, message);
  }
}

/** The client may try again after `retryAfterSeconds`; the answer carries `Retry-After`. */
export abstract class RetryLaterError extends AppError {
  constructor(
    status: 429 | 503,
    code: string,
    message: string,
    readonly retryAfterSeconds: number,
  ) {
    super(status, code, message, undefined, { retryAfterSeconds });
  }
}

/** Too much work is waiting (429 for one user, 503 for the whole server). */
export class BusyError extends RetryLaterError {}

/** Too many failed attempts (429). */
export class TooManyAttemptsError extends RetryLaterError {
  constructor(message: string, retryAfterSeconds: number) {
    super(429, 'rate_limited', message, retryAfterSeconds);
  }
}

/** The disk or the database file is full (507). */
export class StorageFullError extends AppError {
  constructor(message = 'the server has no room left to store this (disk or database full); ask the administrator to free space') {
    super(507, 'storage_full', message);
  }
}

/** The data folder or the database cannot be written (503). */
export class StorageReadOnlyError extends AppError {
  constructor(message = 'the server cannot write its data folder (read-only or no permission); ask the administrator to check it') {
    super(503, 'storage_read_only', message);
  }
}

/** The request could not be read as the multipart form it claims to be (400). */
export class MalformedUploadError extends AppError {
  constructor(message: string, field?: string) {
    super(400, 'invalid_upload', message, field);
  }
}
