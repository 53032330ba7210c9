import useSWR from 'swr';
import type { LimitSetJobStatus } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { limitSetsKey } from './get-limit-sets';

export const LIMIT_SET_JOB_POLL_MS = 1000;

export const limitSetJobKey = (projectId: number | string, jobId: string) => `${limitSetsKey(projectId)}/jobs/${encodeURIComponent(jobId)}`;

export const getLimitSetJob = (projectId: number | string, jobId: string) => apiFetch<LimitSetJobStatus>(limitSetJobKey(projectId, jobId));

export const isLimitSetJobFinished = (job: LimitSetJobStatus | undefined) => job?.state === 'completed' || job?.state === 'failed';

/** Polls a background recompute about once a second until it completes or fails; `jobId` null: nothing to poll. */
export function useLimitSetJob(projectId: number | string, jobId: string | null) {
  return useSWR(jobId ? limitSetJobKey(projectId, jobId) : null, () => getLimitSetJob(projectId, jobId!), {
    refreshInterval: (job) => (isLimitSetJobFinished(job) ? 0 : LIMIT_SET_JOB_POLL_MS),
    revalidateOnFocus: false,
  });
}
