import useSWR from 'swr';
import type { LimitSetsOverview } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const limitSetsKey = (projectId: number | string) => `/api/projects/${projectId}/limit-sets`;

/** Presets with their sources, the project's sets (active first), the state of the latest results, a running job. */
export const getLimitSets = (projectId: number | string) => apiFetch<LimitSetsOverview>(limitSetsKey(projectId));

export function useLimitSets(projectId: number | string) {
  return useSWR(limitSetsKey(projectId), () => getLimitSets(projectId));
}
