import type { z } from 'zod';
import type { FieldError } from '@shared/schemas/common';
import { rememberSession } from './session';

/**
 * The one API client. Every call goes through `api.*`: same-origin JSON with the session cookie,
 * one error type, and one place that reacts to an expired session.
 */

export class ApiError extends Error {
  override readonly name = 'ApiError';
  readonly status: number;
  readonly code: string;
  readonly fields: FieldError[];
  /** With 429: seconds until a retry can succeed (the Retry-After header), else null. */
  readonly retryAfterSeconds: number | null;

  constructor(options: { status: number; code: string; message: string; fields?: FieldError[]; retryAfterSeconds?: number | null }) {
    super(options.message);
    this.status = options.status;
    this.code = options.code;
    this.fields = options.fields ?? [];
    this.retryAfterSeconds = options.retryAfterSeconds ?? null;
  }

  /** The server's message for one field, if it sent one. */
  fieldMessage(field: string): string | undefined {
    return this.fields.find((f) => f.field === field)?.message;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

/** Paths whose 401 means "not signed in / wrong password", not "session expired". */
const PATHS_THAT_HANDLE_401 = ['/api/auth/login', '/api/auth/me'];

type UnauthorizedHandler = (nextPath: string) => void;

let onUnauthorized: UnauthorizedHandler = (nextPath) => {
  window.location.assign(signInHref(nextPath));
};

/** The app installs its router-aware handler here, so a 401 navigates without a full reload. */
export function setUnauthorizedHandler(handler: UnauthorizedHandler): void {
  onUnauthorized = handler;
}

export function signInHref(nextPath: string): string {
  if (!nextPath || nextPath === '/' || nextPath.startsWith('/sign-in')) return '/sign-in';
  return `/sign-in?next=${encodeURIComponent(nextPath)}`;
}

/** Only same-site paths are followed after sign-in, never another origin. */
export function safeNextPath(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return '/';
  return next;
}

function currentPath(): string {
  return `${window.location.pathname}${window.location.search}${window.location.hash}`;
}

type Query = Record<string, string | number | boolean | undefined | null>;

type RequestOptions<S extends z.ZodType | undefined> = {
  query?: Query;
  body?: unknown;
  signal?: AbortSignal;
  /** Parses the response body; its output type becomes the call's result. */
  schema?: S;
};

type Result<S> = S extends z.ZodType ? z.output<S> : void;

function buildUrl(path: string, query?: Query): string {
  if (!query) return path;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null) params.set(key, String(value));
  }
  const qs = params.toString();
  return qs ? `${path}?${qs}` : path;
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (!text) return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

/** Retry-After in seconds (the header may also be an HTTP date), preferring the body's figure. */
function retryAfterSeconds(response: Response, fromBody: number | undefined): number | null {
  if (fromBody !== undefined) return fromBody;
  const header = response.headers.get('Retry-After');
  if (!header) return null;
  if (/^\d+$/.test(header.trim())) return Number(header.trim());
  const at = Date.parse(header);
  return Number.isNaN(at) ? null : Math.max(1, Math.ceil((at - Date.now()) / 1000));
}

const FALLBACK_MESSAGES: Record<number, string> = {
  401: 'Please sign in to continue.',
  403: 'Your role does not allow this.',
  404: 'We could not find that.',
  409: 'Someone else changed this record. Reload and try again.',
  413: 'That upload is too large.',
  429: 'Too many attempts. Wait a moment and try again.',
  502: 'Packwright’s server is not answering right now. Try again in a moment.',
  503: 'Packwright’s server is not answering right now. Try again in a moment.',
  504: 'Packwright’s server took too long to answer. Try again in a moment.',
};

async function request<S extends z.ZodType | undefined>(
  method: string,
  path: string,
  options: RequestOptions<S> = {},
): Promise<Result<S>> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  let body: BodyInit | undefined;
  if (options.body instanceof FormData) {
    body = options.body;
  } else if (options.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(options.body);
  }

  let response: Response;
  try {
    response = await fetch(buildUrl(path, options.query), {
      method,
      headers,
      body,
      credentials: 'same-origin',
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError({
      status: 0,
      code: 'network_error',
      message: 'Packwright could not reach its server. Check your connection and try again.',
    });
  }

  const payload = await readJson(response);

  if (!response.ok) {
    // The error envelope's schema (and zod) load on the first error, not with the first screen.
    const { apiErrorSchema } = await import('@shared/schemas/common');
    const parsed = apiErrorSchema.safeParse(payload);
    const error = new ApiError({
      status: response.status,
      code: parsed.success ? parsed.data.error.code : `http_${response.status}`,
      message: parsed.success
        ? parsed.data.error.message
        : (FALLBACK_MESSAGES[response.status] ?? `The server answered ${response.status}. Try again in a moment.`),
      fields: parsed.success ? parsed.data.error.fields : undefined,
      retryAfterSeconds: retryAfterSeconds(response, parsed.success ? parsed.data.error.retryAfterSeconds : undefined),
    });
    if (response.status === 401) rememberSession(false);
    if (response.status === 401 && !PATHS_THAT_HANDLE_401.includes(path)) {
      onUnauthorized(currentPath());
    }
    throw error;
  }
  if (path === '/api/auth/login' || path === '/api/auth/me') rememberSession(true);
  if (path === '/api/auth/logout') rememberSession(false);

  if (!options.schema) return undefined as Result<S>;
  const parsed = options.schema.safeParse(payload);
  if (!parsed.success) {
    throw new ApiError({
      status: response.status,
      code: 'unexpected_response',
      message: `The server's answer to ${method} ${path} was not in the expected shape.`,
    });
  }
  return parsed.data as Result<S>;
}

export const api = {
  get: <S extends z.ZodType | undefined = undefined>(path: string, options?: Omit<RequestOptions<S>, 'body'>) =>
    request<S>('GET', path, options),
  post: <S extends z.ZodType | undefined = undefined>(path: string, options?: RequestOptions<S>) =>
    request<S>('POST', path, options),
  patch: <S extends z.ZodType | undefined = undefined>(path: string, options?: RequestOptions<S>) =>
    request<S>('PATCH', path, options),
  put: <S extends z.ZodType | undefined = undefined>(path: string, options?: RequestOptions<S>) =>
    request<S>('PUT', path, options),
  delete: <S extends z.ZodType | undefined = undefined>(path: string, options?: RequestOptions<S>) =>
    request<S>('DELETE', path, options),
};

/** A short sentence for any thrown value, for error panels. */
export function errorMessage(error: unknown): string {
  if (isApiError(error)) return error.message;
  if (error instanceof Error) return error.message;
  return 'Something went wrong.';
}
