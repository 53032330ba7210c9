/** Stable codes of limit-set errors. */
export const LIMIT_ERROR_CODES = [
  /** The limit set has no such member category. */
  'UNKNOWN_CATEGORY',
  /** A length-dependent rule (framing supporting glass) needs the member length. */
  'LENGTH_REQUIRED',
  /** A limit set or rule is malformed (see validateLimitSet). */
  'INVALID_LIMIT_SET',
] as const;
export type LimitErrorCode = (typeof LIMIT_ERROR_CODES)[number];

/** Thrown by the limits helpers; `message` says what to change. */
export class LimitError extends Error {
  readonly code: LimitErrorCode;
  readonly path: string;

  constructor(code: LimitErrorCode, message: string, path = '') {
    super(message);
    this.name = 'LimitError';
    this.code = code;
    this.path = path;
  }
}
