import type { ApiErrorBody, ApiErrorDetail, ErrorCode } from '@sagline/common/api-types';

/**
 * Codes the client adds for failures that never reached the API's error
 * filter: the network was down, or something (a proxy) answered with a body
 * that is not our error shape.
 */
export type ClientErrorCode = 'NETWORK' | 'BAD_RESPONSE';

/** A failed API call, carrying the server's error shape (errors.ts). */
export class ApiError extends Error {
  override readonly name = 'ApiError';
  readonly statusCode: number;
  /** HTTP reason phrase ("Bad Request"), or empty for network failures. */
  readonly error: string;
  readonly code: ErrorCode | ClientErrorCode;
  readonly details: ApiErrorDetail[];
  /** From a `Retry-After` header (429 answers), in seconds. */
  readonly retryAfterSeconds: number | undefined;

  constructor(init: {
    statusCode: number;
    error: string;
    code: ErrorCode | ClientErrorCode;
    message: string;
    details?: ApiErrorDetail[];
    retryAfterSeconds?: number;
  }) {
    super(init.message);
    this.statusCode = init.statusCode;
    this.error = init.error;
    this.code = init.code;
    this.details = init.details ?? [];
    this.retryAfterSeconds = init.retryAfterSeconds;
  }

  static fromBody(body: ApiErrorBody, retryAfterSeconds?: number): ApiError {
    return new ApiError({ ...body, retryAfterSeconds });
  }
}

export function isApiError(e: unknown): e is ApiError {
  return e instanceof ApiError;
}

/** True when a value has the server's error shape (errors.ts). */
export function isApiErrorBody(v: unknown): v is ApiErrorBody {
  if (typeof v !== 'object' || v === null) return false;
  const o = v as Record<string, unknown>;
  return typeof o.statusCode === 'number' && typeof o.code === 'string' && typeof o.message === 'string';
}

/** A message a person can read, whatever was thrown. */
export function errorMessage(e: unknown): string {
  if (e instanceof Error && e.message) return e.message;
  return 'Something went wrong. Try again, and tell your administrator if it keeps happening.';
}
