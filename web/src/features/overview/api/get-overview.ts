import useSWR from 'swr';
import type { ProjectOverview } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

type Id = number | string;

export const overviewKey = (projectId: Id) => `/api/projects/${projectId}/overview`;

/** GET …/overview: counts per level and per reviewer (computed by the server), the latest revision, sign-offs. */
export const getOverview = (projectId: Id) => apiFetch<ProjectOverview>(overviewKey(projectId));

export function useOverview(projectId: Id) {
  return useSWR(overviewKey(projectId), () => getOverview(projectId), { keepPreviousData: true });
}
