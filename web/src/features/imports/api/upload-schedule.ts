import type { ImportPreview } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

/** The multipart field the API reads the schedule from (imports.ts). */
export const UPLOAD_FIELD = 'file';

export const importsKey = (projectId: number | string) => `/api/projects/${projectId}/imports`;

/**
 * Uploads a schedule file. 201: a draft and its preview (nothing is a
 * revision yet). Fails with an ApiError: 422 IMPORT_ROWS_INVALID with every
 * problem in `details` (nothing stored), 400 IMPORT_FILE_INVALID, 413
 * PAYLOAD_TOO_LARGE.
 */
export function uploadSchedule(projectId: number | string, file: File, signal?: AbortSignal): Promise<ImportPreview> {
  const body = new FormData();
  body.append(UPLOAD_FIELD, file, file.name);
  return apiFetch<ImportPreview>(importsKey(projectId), { method: 'POST', body, signal });
}
