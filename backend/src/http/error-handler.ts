import type { ErrorRequestHandler, RequestHandler } from 'express';
import { BaseError as SequelizeBaseError, ConnectionError, DatabaseError } from 'sequelize';
import { AppError } from './errors';

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError({ status: 404, code: 'route_not_found', message: `No API route ${req.method} ${req.originalUrl}.` }));
};

/**
 * The SQLSTATE of a database error, when it has one (Sequelize keeps the driver's error as
 * `parent`/`original`).
 */
function sqlState(err: unknown): string | undefined {
  if (!(err instanceof DatabaseError)) return undefined;
  const original = (err as DatabaseError & { original?: { code?: unknown } }).original ?? (err.parent as { code?: unknown } | undefined);
  return typeof original?.code === 'string' ? original.code : undefined;
}

/**
 * PostgreSQL class 22 "data exception" (PostgreSQL documentation, Appendix A, "PostgreSQL Error
 * Codes"): a value the database will not take — invalid text representation (22P02), a
 * character not in the encoding (22021), an untranslatable character such as \u0000 in jsonb
 * (22P05), a string too long (22001), a number out of range (22003), a bad date (22007, 22008).
 * They come from the request's values, so they are the client's to fix: 400, not 500. Each one
 * means a schema let the value through; it is logged so the schema can be tightened.
 */
function isDataException(state: string | undefined): boolean {
  return state !== undefined && state.startsWith('22');
}

/** Maps every error to the one JSON error shape; unknown errors are logged and answer 500. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let appError: AppError;
  if (err instanceof AppError) {
    appError = err;
  } else if (err?.type === 'entity.too.large') {
    appError = new AppError({ status: 413, code: 'payload_too_large', message: 'The request body is too large.' });
  } else if (err?.type === 'entity.parse.failed') {
    appError = new AppError({ status: 400, code: 'invalid_json', message: 'The request body is not valid JSON.' });
  } else if (err instanceof ConnectionError || (err instanceof SequelizeBaseError && /connect/i.test(err.message))) {
    appError = new AppError({ status: 503, code: 'database_unavailable', message: 'The database is unavailable. Try again shortly.' });
  } else if (isDataException(sqlState(err))) {
    console.warn(`[api] ${req.method} ${req.originalUrl}: a value the database refused (${sqlState(err)}): ${(err as Error).message}`);
    appError = new AppError({
      status: 400,
      code: 'invalid_value',
      message: `A value in the request cannot be stored: ${(err as Error).message}. Check the text (no NUL characters or broken Unicode), the lengths and the numbers you sent.`,
    });
  } else if (typeof err?.status === 'number' && err.status >= 400 && err.status < 500) {
    appError = new AppError({ status: err.status, code: err.code ?? 'bad_request', message: err.message ?? 'Bad request.' });
  } else {
    console.error(`[api] ${req.method} ${req.originalUrl} failed:`, err);
    appError = new AppError({ status: 500, code: 'internal_error', message: 'Something went wrong on our side.' });
  }
  if (res.headersSent) return;
  if (appError.retryAfterSeconds !== undefined) res.setHeader('Retry-After', String(appError.retryAfterSeconds));
  res.status(appError.status).json({
    error: {
      code: appError.code,
      message: appError.message,
      ...(appError.fields ? { fields: appError.fields } : {}),
      ...(appError.retryAfterSeconds !== undefined ? { retryAfterSeconds: appError.retryAfterSeconds } : {}),
    },
  });
};
