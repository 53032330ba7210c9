import { Alert, Flex, Typography } from 'antd';
import type { ApiErrorDetail, ImportProblemDetail } from '@sagline/common/api-types';
import { errorMessage, isApiError } from '@/app/api-error';
import { ProblemsTable, type ScheduleProblem } from './problems-table';

/** The 422 `details` as the import sends them (ImportProblemDetail); a detail without a severity is fatal. */
function toProblems(details: ApiErrorDetail[]): ScheduleProblem[] {
  return details.map((d) => {
    const p = d as Partial<ImportProblemDetail> & ApiErrorDetail;
    return {
      severity: p.severity === 'warning' ? 'warning' : 'error',
      code: p.code ?? '',
      sheet: p.sheet ?? '',
      row: p.row ?? 0,
      column: p.column ?? null,
      mark: p.mark,
      value: (p.value ?? null) as ScheduleProblem['value'],
      message: p.message,
    };
  });
}

const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

function titleOf(error: unknown): string {
  if (!isApiError(error)) return 'The upload failed';
  if (error.statusCode === 413) return 'The file is too large';
  if (error.code === 'IMPORT_FILE_INVALID') return 'This file cannot be read as a member schedule';
  return 'The upload failed';
}

/**
 * An upload the API refused. A 422 lists every problem of the file (nothing
 * was stored); a 400 or 413 has one message; anything else (network, 5xx)
 * says what the fetcher says.
 */
export function UploadRejected({ fileName, error }: { fileName: string; error: unknown }) {
  if (isApiError(error) && error.code === 'IMPORT_ROWS_INVALID') {
    const problems = toProblems(error.details);
    const errors = problems.filter((p) => p.severity === 'error').length;
    const warnings = problems.length - errors;
    return (
      <Flex vertical gap={12}>
        <Alert
          type="error"
          showIcon
          title="Nothing was stored"
          description={
            <>
              <div>{error.message}</div>
              <div>
                {fileName}: {count(errors, 'error', 'errors')}
                {warnings > 0 && `, ${count(warnings, 'warning', 'warnings')}`}, listed below.
              </div>
            </>
          }
        />
        <ProblemsTable problems={problems} label="Problems of the upload" />
      </Flex>
    );
  }
  return (
    <Alert
      type="error"
      showIcon
      title={titleOf(error)}
      description={
        <>
          <div>{errorMessage(error)}</div>
          <Typography.Text type="secondary">{fileName}: nothing was stored.</Typography.Text>
        </>
      }
    />
  );
}
