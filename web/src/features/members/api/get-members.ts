import useSWR from 'swr';
import type { MembersPage } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { membersSearchParams, type MembersView } from '../components/member-query';

/** The screen's own query string, sent on as it is: the URL and the API share their parameter names. */
export const membersKey = (projectId: number | string, view: MembersView) => {
  const search = membersSearchParams(view).toString();
  return `/api/projects/${projectId}/members${search ? `?${search}` : ''}`;
};

/** One page of the members of a revision, filtered, sorted and paged by the server. */
export const getMembers = (projectId: number | string, view: MembersView) =>
  apiFetch<MembersPage>(membersKey(projectId, view));

/** Keeps the last page on screen while the next one loads, so the table does not jump. */
export function useMembers(projectId: number | string, view: MembersView | null) {
  return useSWR(view ? membersKey(projectId, view) : null, () => getMembers(projectId, view!), {
    keepPreviousData: true,
  });
}
