import useSWR from 'swr';
import type { MemberFacets } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const memberFacetsKey = (projectId: number | string, revision: string | null) =>
  `/api/projects/${projectId}/members/facets${revision ? `?revision=${encodeURIComponent(revision)}` : ''}`;

/** What the filters can choose from in one revision (`null`: the latest), with counts. */
export const getMemberFacets = (projectId: number | string, revision: string | null) =>
  apiFetch<MemberFacets>(memberFacetsKey(projectId, revision));

export function useMemberFacets(projectId: number | string, revision: string | null) {
  return useSWR(memberFacetsKey(projectId, revision), () => getMemberFacets(projectId, revision), {
    keepPreviousData: true,
  });
}
