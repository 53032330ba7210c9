import type { UseLimitSetRequest } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { limitSetsKey } from './get-limit-sets';
import type { LimitSetChangeOutcome } from './update-limit-set';

/** Makes a set the project's: 200 with the recompute of the latest revision, or 202 { jobId }. */
export const applyLimitSet = (projectId: number | string, setId: number, body: UseLimitSetRequest = {}) =>
  apiFetch<LimitSetChangeOutcome>(`${limitSetsKey(projectId)}/${setId}/use`, { method: 'POST', body });
