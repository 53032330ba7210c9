import type { Dimension } from './dimensions';

export type UnitErrorCode = 'UNKNOWN_UNIT' | 'WRONG_DIMENSION' | 'NOT_A_NUMBER';

/**
 * Thrown for a unit we do not know, a unit of the wrong kind, or a value
 * that is not a number. The message is meant for a person: it says what was
 * wrong and which units are accepted.
 */
export class UnitError extends Error {
  override readonly name = 'UnitError';
  readonly code: UnitErrorCode;
  /** The text that was given (unit or value). */
  readonly input: string;
  /** The dimension that was expected, when there was one. */
  readonly dimension?: Dimension;
  /** Canonical symbols accepted where the error happened. */
  readonly accepted: readonly string[];

  constructor(
    code: UnitErrorCode,
    message: string,
    details: { input: string; dimension?: Dimension; accepted?: readonly string[] },
  ) {
    super(message);
    this.code = code;
    this.input = details.input;
    this.dimension = details.dimension;
    this.accepted = details.accepted ?? [];
    // Keeps instanceof working when compiled to ES5-style classes.
    Object.setPrototypeOf(this, new.target.prototype);
  }
}
