import useSWR from 'swr';
import type { FlagsOverTime } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

type Id = number | string;

export const flagsOverTimeKey = (projectId: Id, days: number) => `/api/projects/${projectId}/overview/flags-over-time?days=${days}`;

/** GET …/overview/flags-over-time: flags in each status at the end of each day (UTC). */
export const getFlagsOverTime = (projectId: Id, days: number) => apiFetch<FlagsOverTime>(flagsOverTimeKey(projectId, days));

export function useFlagsOverTime(projectId: Id, days: number) {
  return useSWR(flagsOverTimeKey(projectId, days), () => getFlagsOverTime(projectId, days), { keepPreviousData: true });
}
