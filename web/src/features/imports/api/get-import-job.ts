import useSWR from 'swr';
import type { ImportJobStatus } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

/** About once a second, as the API suggests for a progress bar (imports.ts). */
export const JOB_POLL_MS = 1000;

export const importJobKey = (projectId: number | string, jobId: string) =>
  `/api/projects/${projectId}/imports/jobs/${encodeURIComponent(jobId)}`;

export const getImportJob = (projectId: number | string, jobId: string) =>
  apiFetch<ImportJobStatus>(importJobKey(projectId, jobId));

export const isJobFinished = (job: ImportJobStatus | undefined) => job?.state === 'completed' || job?.state === 'failed';

/** Polls a background commit until it completes or fails; `jobId` null: nothing to poll. */
export function useImportJob(projectId: number | string, jobId: string | null) {
  return useSWR(jobId ? importJobKey(projectId, jobId) : null, () => getImportJob(projectId, jobId!), {
    refreshInterval: (job) => (isJobFinished(job) ? 0 : JOB_POLL_MS),
    revalidateOnFocus: false,
  });
}
