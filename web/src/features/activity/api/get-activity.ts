import useSWR from 'swr';
import type { ActivityEntry, Page } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { activityViewQuery, type ActivityView } from '../components/activity-view';

export const activityKey = (projectId: number | string, view: ActivityView) => {
  const q = activityViewQuery(view);
  return `/api/projects/${projectId}/activity${q ? `?${q}` : ''}`;
};

export const getActivity = (projectId: number | string, view: ActivityView) => apiFetch<Page<ActivityEntry>>(activityKey(projectId, view));

/** One page of the feed; the previous page stays on screen while the next loads. */
export function useActivity(projectId: number | string, view: ActivityView) {
  return useSWR(activityKey(projectId, view), () => getActivity(projectId, view), { keepPreviousData: true });
}
