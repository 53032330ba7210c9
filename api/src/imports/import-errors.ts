import type { ImportProblem, ImportProblemDetail } from '@sagline/common/api-types';
import { ApiError } from '../common/api-error';

/**
 * 422 IMPORT_ROWS_INVALID: the schedule has fatal problems, listed in
 * `details` (errors first, then warnings) with sheet, row, column, value and
 * message. Nothing has been stored.
 */
export function rowsInvalid(problems: readonly ImportProblem[]): ApiError {
  const errors = problems.filter((p) => p.severity === 'error');
  const first = errors[0];
  const count = errors.some((p) => p.code === 'TOO_MANY_PROBLEMS') ? `more than ${errors.length - 1} errors` : errors.length === 1 ? '1 error' : `${errors.length} errors`;
  const message =
    `The schedule has ${count}, so nothing was stored. ` +
    (first ? `The first: ${/^\S+ row \d+/.test(first.message) ? '' : `${first.sheet} row ${first.row}: `}${first.message} ` : '') +
    'Fix the listed cells and upload the file again.';
  const details: ImportProblemDetail[] = problems.map((p) => {
    const d: ImportProblemDetail = { severity: p.severity, code: p.code, sheet: p.sheet, row: p.row, value: p.value, message: p.message };
    if (p.column !== null) d.column = p.column;
    if (p.mark !== undefined) d.mark = p.mark;
    return d;
  });
  return new ApiError('IMPORT_ROWS_INVALID', message, details, 422);
}
