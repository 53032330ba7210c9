import type { ApiErrorDetail, ErrorCode } from '@sagline/common/api-types';

/**
 * The error every area throws. The HTTP status follows from the code
 * (statusForCode), so a code always means the same status everywhere.
 */
export class ApiError extends Error {
  readonly status: number;

  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details?: ApiErrorDetail[],
    status?: number,
  ) {
    super(message);
    this.name = 'ApiError';
    this.status = status ?? statusForCode(code);
  }
}

/** HTTP status of each error code. Adding a code without a status here fails the build. */
export function statusForCode(code: ErrorCode): number {
  switch (code) {
    case 'VALIDATION_FAILED':
    case 'MALFORMED_JSON':
    case 'IMPORT_FILE_INVALID':
    case 'IMPORT_ROWS_INVALID':
      return 400;
    case 'UNAUTHENTICATED':
    case 'BAD_CREDENTIALS':
      return 401;
    case 'FORBIDDEN':
    case 'CSRF_INVALID':
      return 403;
    case 'NOT_FOUND':
    case 'INVITATION_INVALID':
      return 404;
    case 'CONFLICT':
    case 'STALE_WRITE':
      return 409;
    case 'INVITATION_EXPIRED':
    case 'INVITATION_USED':
      return 410;
    case 'PAYLOAD_TOO_LARGE':
      return 413;
    case 'RATE_LIMITED':
      return 429;
    case 'INTERNAL':
      return 500;
    default:
      return assertUnreachable(code);
  }
}

function assertUnreachable(value: never): never {
  throw new Error(`No HTTP status mapped for error code ${String(value)}`);
}

/** 404 for a thing the caller cannot see (missing or not theirs: the same answer). */
export function notFound(message: string): ApiError {
  return new ApiError('NOT_FOUND', message);
}

/** 400 with one field problem. */
export function invalidField(path: string, message: string): ApiError {
  return new ApiError('VALIDATION_FAILED', `${path}: ${message}`, [{ path, message }]);
}
