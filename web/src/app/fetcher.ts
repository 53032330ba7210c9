import { CSRF_HEADER } from '@sagline/common/api-types';
import { ApiError, isApiErrorBody } from './api-error';
import { readCsrfToken } from './csrf';

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface ApiFetchOptions {
  method?: HttpMethod;
  /** Sent as JSON; a FormData (a file upload) is sent as multipart/form-data as it is. */
  body?: unknown;
  /**
   * Whether a 401 sends the person to the sign-in page. Off for the sign-in
   * call itself (a wrong password is not an expired session) and for the
   * initial "who am I" check (the guard decides what to do).
   */
  redirectOn401?: boolean;
  signal?: AbortSignal;
}

type UnauthenticatedHandler = () => void;

/** Until the router registers itself, fall back to a full page load. */
let onUnauthenticated: UnauthenticatedHandler = () => {
  const next = window.location.pathname + window.location.search;
  window.location.assign(`/sign-in?next=${encodeURIComponent(next)}`);
};

/** The router registers how to reach the sign-in page with a return path. */
export function setUnauthenticatedHandler(handler: UnauthenticatedHandler): void {
  onUnauthenticated = handler;
}

const UNSAFE: ReadonlySet<HttpMethod> = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * The one HTTP client of the web app: every SWR hook and mutation calls it.
 * JSON in and out, same-origin cookies, the CSRF header on state-changing
 * requests, and every failure turned into an ApiError.
 */
export async function apiFetch<T>(path: string, options: ApiFetchOptions = {}): Promise<T> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json' };
  // The browser writes a multipart body's Content-Type itself (it holds the boundary).
  const isForm = typeof FormData !== 'undefined' && options.body instanceof FormData;
  if (options.body !== undefined && !isForm) headers['Content-Type'] = 'application/json';
  if (UNSAFE.has(method)) {
    const token = readCsrfToken();
    if (token) headers[CSRF_HEADER] = token;
  }

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
      credentials: 'same-origin',
      signal: options.signal,
    });
  } catch (e) {
    // Compare by name: the abort error may come from another realm (tests).
    if ((e as { name?: unknown }).name === 'AbortError') throw e;
    throw new ApiError({
      statusCode: 0,
      error: '',
      code: 'NETWORK',
      message: 'Sagline cannot be reached. Check your connection, then try again.',
    });
  }

  if (response.ok) {
    if (response.status === 204) return undefined as T;
    const text = await response.text();
    if (!text) return undefined as T;
    try {
      return JSON.parse(text) as T;
    } catch {
      throw badResponse(response);
    }
  }

  const error = await toApiError(response);
  // BAD_CREDENTIALS is a wrong password, not an expired session.
  if (error.statusCode === 401 && error.code !== 'BAD_CREDENTIALS' && options.redirectOn401 !== false) {
    onUnauthenticated();
  }
  throw error;
}

async function toApiError(response: Response): Promise<ApiError> {
  const retryAfter = parseRetryAfter(response.headers.get('Retry-After'));
  let body: unknown;
  try {
    body = JSON.parse(await response.text());
  } catch {
    return badResponse(response, retryAfter);
  }
  if (isApiErrorBody(body)) return ApiError.fromBody(body, retryAfter);
  return badResponse(response, retryAfter);
}

function badResponse(response: Response, retryAfterSeconds?: number): ApiError {
  const status = `${response.status}${response.statusText ? ` ${response.statusText}` : ''}`;
  return new ApiError({
    statusCode: response.status,
    error: response.statusText,
    code: 'BAD_RESPONSE',
    message: `The server gave an answer Sagline could not read (HTTP ${status}). Try again in a moment; if it keeps happening, the API may not be running.`,
    retryAfterSeconds,
  });
}

/** Retry-After is either seconds or an HTTP date (RFC 9110, section 10.2.3). */
function parseRetryAfter(value: string | null): number | undefined {
  if (!value) return undefined;
  const seconds = Number(value);
  if (Number.isFinite(seconds)) return Math.max(0, Math.round(seconds));
  const at = Date.parse(value);
  return Number.isNaN(at) ? undefined : Math.max(0, Math.round((at - Date.now()) / 1000));
}
