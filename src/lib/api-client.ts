// The one way the client talks to the server: same-origin cookies, JSON both ways, and every non-2xx
// turned into an ApiError carrying the server's {error:{code,message,fields}} shape.

export type FieldErrors = Record<string, string>;

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: FieldErrors;
  /** Seconds from the Retry-After header (429), when the server sent one. */
  readonly retryAfterSeconds: number | null;

  constructor(opts: { status: number; code: string; message: string; fields?: FieldErrors; retryAfterSeconds?: number | null }) {
    super(opts.message);
    this.name = 'ApiError';
    this.status = opts.status;
    this.code = opts.code;
    this.fields = opts.fields ?? {};
    this.retryAfterSeconds = opts.retryAfterSeconds ?? null;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

type UnauthorizedHandler = () => void;
let onUnauthorized: UnauthorizedHandler | null = null;

/**
 * Registers what happens when the server says the session is gone (401): the provider clears the cached
 * user so the header and guarded pages update. One place handles it; requests are never retried on 401.
 */
export function setUnauthorizedHandler(handler: UnauthorizedHandler | null): void {
  onUnauthorized = handler;
}

/** Retry-After is either delay-seconds or an HTTP date (RFC 9110 §10.2.3). */
export function parseRetryAfter(value: string | null, now = Date.now()): number | null {
  if (!value) return null;
  const trimmed = value.trim();
  if (/^\d+$/.test(trimmed)) return Number(trimmed);
  const at = Date.parse(trimmed);
  if (Number.isNaN(at)) return null;
  return Math.max(0, Math.ceil((at - now) / 1000));
}

type ErrorBody = { error?: { code?: unknown; message?: unknown; fields?: unknown } };

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (!text) return null;
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

function toApiError(response: Response, body: unknown): ApiError {
  const error = (body as ErrorBody | null)?.error;
  const fields = error?.fields && typeof error.fields === 'object' ? (error.fields as FieldErrors) : {};
  return new ApiError({
    status: response.status,
    code: typeof error?.code === 'string' ? error.code : `http_${response.status}`,
    message: typeof error?.message === 'string' ? error.message : `The server answered ${response.status}. Please try again.`,
    fields,
    retryAfterSeconds: parseRetryAfter(response.headers.get('retry-after')),
  });
}

export type RequestOptions = { signal?: AbortSignal };

async function request<T>(method: string, path: string, body?: unknown, opts: RequestOptions = {}): Promise<T> {
  let response: Response;
  try {
    response = await fetch(path, {
      method,
      credentials: 'same-origin',
      headers: { Accept: 'application/json', ...(body === undefined ? {} : { 'Content-Type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal: opts.signal,
    });
  } catch (cause) {
    if ((cause as Error)?.name === 'AbortError') throw cause;
    throw new ApiError({ status: 0, code: 'network', message: 'Kitlane could not be reached. Check your connection and try again.' });
  }
  const parsed = await readJson(response);
  if (!response.ok) {
    if (response.status === 401) onUnauthorized?.();
    throw toApiError(response, parsed);
  }
  return parsed as T;
}

export const api = {
  get: <T>(path: string, opts?: RequestOptions) => request<T>('GET', path, undefined, opts),
  post: <T>(path: string, body?: unknown, opts?: RequestOptions) => request<T>('POST', path, body ?? {}, opts),
  patch: <T>(path: string, body: unknown, opts?: RequestOptions) => request<T>('PATCH', path, body, opts),
  put: <T>(path: string, body: unknown, opts?: RequestOptions) => request<T>('PUT', path, body, opts),
  delete: <T>(path: string, opts?: RequestOptions) => request<T>('DELETE', path, undefined, opts),
};
