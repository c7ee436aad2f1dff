import type { FieldError } from '@shared/schemas';

export interface AppErrorOptions {
  status: number;
  code: string;
  message: string;
  fields?: FieldError[];
  /** For 429: seconds until a retry can succeed; sent as the Retry-After header and in the body. */
  retryAfterSeconds?: number;
}

/** The one error type of the API: carries its HTTP status, a stable code and a readable message. */
export class AppError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields?: FieldError[];
  readonly retryAfterSeconds?: number;

  constructor({ status, code, message, fields, retryAfterSeconds }: AppErrorOptions) {
    super(message);
    this.name = 'AppError';
    this.status = status;
    this.code = code;
    this.fields = fields;
    this.retryAfterSeconds = retryAfterSeconds;
  }

  static validation(message: string, fields: FieldError[]) {
    return new AppError({ status: 400, code: 'validation_failed', message, fields });
  }
  static unauthenticated(message = 'Sign in to continue.') {
    return new AppError({ status: 401, code: 'unauthenticated', message });
  }
  static forbidden(message = 'Your role does not allow this.') {
    return new AppError({ status: 403, code: 'forbidden', message });
  }
  static notFound(what = 'Record') {
    return new AppError({ status: 404, code: 'not_found', message: `${what} not found.` });
  }
  static conflict(message: string, code = 'conflict') {
    return new AppError({ status: 409, code, message });
  }
  static tooManyAttempts(what: string, retryAfterSeconds: number) {
    const seconds = Math.max(1, Math.ceil(retryAfterSeconds));
    return new AppError({
      status: 429,
      code: 'too_many_attempts',
      message: `${what} Try again in ${seconds} ${seconds === 1 ? 'second' : 'seconds'}.`,
      retryAfterSeconds: seconds,
    });
  }
  static staleVersion(what = 'record') {
    return new AppError({
      status: 409,
      code: 'stale_version',
      message: `Someone else changed this ${what} since you loaded it. Reload and try again.`,
    });
  }
}
