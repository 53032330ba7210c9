import type { LimitSetChangeResponse, LimitSetJobAccepted, UpdateLimitSetRequest } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { limitSetsKey } from './get-limit-sets';

export type LimitSetChangeOutcome = LimitSetChangeResponse | LimitSetJobAccepted;

export const isLimitSetJob = (o: LimitSetChangeOutcome): o is LimitSetJobAccepted => 'jobId' in o;

/** Saves an edit; on the set in use, 200 with the recompute, or 202 { jobId } on a large project. */
export const updateLimitSet = (projectId: number | string, setId: number, body: UpdateLimitSetRequest) =>
  apiFetch<LimitSetChangeOutcome>(`${limitSetsKey(projectId)}/${setId}`, { method: 'PUT', body });
