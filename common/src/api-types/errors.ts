/**
 * The one error shape every failing API response has. `details` carries
 * field- or row-level problems (import reports, validation errors).
 */
export interface ApiErrorBody {
  statusCode: number;
  /** HTTP reason phrase, e.g. "Bad Request". */
  error: string;
  /** Stable machine code, see ErrorCode. */
  code: ErrorCode;
  /** What went wrong and how to fix it, for a person. */
  message: string;
  details?: ApiErrorDetail[];
}

export interface ApiErrorDetail {
  /** Field path (`body.email`) or spreadsheet location. */
  path?: string;
  sheet?: string;
  row?: number;
  column?: string;
  value?: unknown;
  message: string;
}

/** Stable error codes. Add here first, then map in the api's exception filter. */
export const ERROR_CODES = [
  'VALIDATION_FAILED',
  'MALFORMED_JSON',
  'PAYLOAD_TOO_LARGE',
  'UNAUTHENTICATED',
  'BAD_CREDENTIALS',
  'FORBIDDEN',
  'CSRF_INVALID',
  'NOT_FOUND',
  'CONFLICT',
  'STALE_WRITE',
  'RATE_LIMITED',
  'INVITATION_INVALID',
  'INVITATION_EXPIRED',
  'INVITATION_USED',
  'IMPORT_FILE_INVALID',
  'IMPORT_ROWS_INVALID',
  'INTERNAL',
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];
