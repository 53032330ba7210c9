/**
 * Stable codes of the engine's errors. Each names what is wrong; the message
 * says where and how to fix it, and `path` points at the offending field.
 */
export const ENGINE_ERROR_CODES = [
  /** The supports let the member move or rotate freely: no support, one pin only, all pins at one point. */
  'MECHANISM',
  /** length, E, I, a check ratio or cap, or a distributed load's extent is zero or negative. */
  'NOT_POSITIVE',
  /** A support, load, probe or load end lies outside 0 ≤ x ≤ length, or x2 ≤ x1. */
  'OUT_OF_RANGE',
  /** NaN or ±Infinity where a number is required. */
  'NOT_FINITE',
  /** A support or load kind the engine does not know. */
  'UNKNOWN_KIND',
  /** A combination names a load case that no load has. */
  'UNKNOWN_CASE',
  /** A check names a combination that is not defined. */
  'UNKNOWN_COMBINATION',
  /** A field has the wrong JSON type, is missing, or is not expected (e.g. a misspelt name). */
  'INVALID_TYPE',
  /** The text is not JSON at all (command line only). */
  'MALFORMED_JSON',
] as const;

export type EngineErrorCode = (typeof ENGINE_ERROR_CODES)[number];

/**
 * The one error the engine throws for bad input. `path` uses the input's
 * field names: `loads[3].x`, `combinations.total.L`, `checks[0].ratio`
 * (empty for the document as a whole).
 */
export class EngineError extends Error {
  readonly code: EngineErrorCode;
  readonly path: string;

  constructor(code: EngineErrorCode, path: string, message: string) {
    super(message);
    this.name = 'EngineError';
    this.code = code;
    this.path = path;
  }

  /** The command line's error body: `{ code, message, path }`. */
  toJSON(): { code: EngineErrorCode; message: string; path: string } {
    return { code: this.code, message: this.message, path: this.path };
  }
}
