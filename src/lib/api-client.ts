/**
 * The one way the client talks to the API: JSON over fetch with the session cookie
 * (`credentials: 'same-origin'`; the browser adds the Origin header to state-changing requests).
 * Every failure becomes an `ApiError` carrying the server's problem shape
 * `{ error: { code, message, details?: [{ path, message }] } }`.
 */

export interface ApiErrorDetail {
  /** dotted field path, e.g. "email" or "wavelengthNm" ("" for the whole body) */
  path: string;
  message: string;
}

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: ApiErrorDetail[];

  constructor(status: number, code: string, message: string, details: ApiErrorDetail[] = []) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

export function isApiError(value: unknown): value is ApiError {
  return value instanceof ApiError;
}

const FALLBACK_MESSAGES: Record<number, string> = {
  400: 'The request was not accepted. Check the fields and try again.',
  401: 'You are signed out. Sign in to continue.',
  403: 'Your role on this bench does not allow this.',
  404: 'This page or record does not exist, or you have no access to it.',
  409: 'This conflicts with something that already exists.',
  413: 'The request is too large.',
  429: 'Too many attempts in a short time. Wait a minute and try again.',
};

function normalisePath(path: unknown): string {
  if (Array.isArray(path)) return path.map(String).join('.');
  if (typeof path === 'string') return path;
  if (typeof path === 'number') return String(path);
  return '';
}

/** Reads the server's problem shape; anything else becomes a generic error for the status. */
export function toApiError(status: number, body: unknown): ApiError {
  const error = (body as { error?: unknown } | null)?.error;
  if (error && typeof error === 'object') {
    const e = error as { code?: unknown; message?: unknown; details?: unknown };
    const details = Array.isArray(e.details)
      ? e.details
          .filter((d): d is { path?: unknown; message: string } =>
            Boolean(d) && typeof (d as { message?: unknown }).message === 'string',
          )
          .map((d) => ({ path: normalisePath(d.path), message: d.message }))
      : [];
    return new ApiError(
      status,
      typeof e.code === 'string' ? e.code : `http_${status}`,
      typeof e.message === 'string' && e.message ? e.message : (FALLBACK_MESSAGES[status] ?? `The server answered ${status}.`),
      details,
    );
  }
  const message =
    FALLBACK_MESSAGES[status] ??
    (status >= 500
      ? 'The server ran into a problem. Try again in a moment; if it keeps happening, tell whoever runs Phaseloom.'
      : `The server answered ${status}.`);
  return new ApiError(status, `http_${status}`, message);
}

export interface RequestOptions {
  signal?: AbortSignal;
  /** injectable for tests; defaults to the global fetch */
  fetchImpl?: typeof fetch;
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

export async function apiRequest<T>(method: Method, url: string, body?: unknown, options: RequestOptions = {}): Promise<T> {
  const doFetch = options.fetchImpl ?? fetch;
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';
  let response: Response;
  try {
    response = await doFetch(url, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
      signal: options.signal,
    });
  } catch (cause) {
    if ((cause as { name?: string } | null)?.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network_error', 'Phaseloom could not reach its server. Check the connection and try again.');
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  let parsed: unknown = undefined;
  if (text) {
    try {
      parsed = JSON.parse(text);
    } catch {
      parsed = undefined;
    }
  }
  if (!response.ok) throw toApiError(response.status, parsed);
  if (text && parsed === undefined) {
    throw new ApiError(response.status, 'bad_response', 'The server sent an answer the client could not read.');
  }
  return parsed as T;
}

export const api = {
  get: <T>(url: string, options?: RequestOptions) => apiRequest<T>('GET', url, undefined, options),
  post: <T>(url: string, body?: unknown, options?: RequestOptions) => apiRequest<T>('POST', url, body ?? {}, options),
  patch: <T>(url: string, body: unknown, options?: RequestOptions) => apiRequest<T>('PATCH', url, body, options),
  delete: <T = void>(url: string, options?: RequestOptions) => apiRequest<T>('DELETE', url, undefined, options),
};
