import useSWR from 'swr';
import type { ActivityPerson } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const activityPeopleKey = (projectId: number | string) => `/api/projects/${projectId}/activity/people`;

export const getActivityPeople = (projectId: number | string) => apiFetch<ActivityPerson[]>(activityPeopleKey(projectId));

/** Everyone who appears in the feed: the person filter's choices. */
export function useActivityPeople(projectId: number | string) {
  return useSWR(activityPeopleKey(projectId), () => getActivityPeople(projectId));
}
