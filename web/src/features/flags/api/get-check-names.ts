import useSWR from 'swr';
import type { MemberFacets } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

type Id = number | string;

/** The latest revision's facets (the same request and key as the Members screen's). */
export const checkNamesKey = (projectId: Id) => `/api/projects/${projectId}/members/facets`;

export const getMemberFacets = (projectId: Id) => apiFetch<MemberFacets>(checkNamesKey(projectId));

/** The check names of the latest revision's limit set, for the flags' "check" filter. */
export function useCheckNames(projectId: Id) {
  const swr = useSWR(checkNamesKey(projectId), () => getMemberFacets(projectId));
  return { ...swr, names: (swr.data?.checks ?? []).map((c) => c.name) };
}
