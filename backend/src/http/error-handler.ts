import type { ErrorRequestHandler, RequestHandler } from 'express';
import { BaseError as SequelizeBaseError, ConnectionError } from 'sequelize';
import { AppError } from './errors';

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError({ status: 404, code: 'route_not_found', message: `No API route ${req.method} ${req.originalUrl}.` }));
};

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
