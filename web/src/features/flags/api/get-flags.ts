import useSWR from 'swr';
import type { FlagListQuery, FlagPage } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

type Id = number | string;

/** Every flag request of a project starts here; mutations revalidate keys under it. */
export const flagsRoot = (projectId: Id) => `/api/projects/${projectId}/flags`;

/** The query as the API reads it (FlagListQuery): empty values are left out, keys in a fixed order. */
export function flagQueryString(query: FlagListQuery): string {
  const params = new URLSearchParams();
  const keys: (keyof FlagListQuery)[] = ['status', 'assignee', 'level', 'mark', 'check', 'overdue', 'sort', 'page', 'pageSize'];
  for (const k of keys) {
    const v = query[k];
    if (v !== undefined && v !== null && v !== '') params.set(k, String(v));
  }
  return params.toString();
}

export const flagsKey = (projectId: Id, query: FlagListQuery) => {
  const qs = flagQueryString(query);
  return qs ? `${flagsRoot(projectId)}?${qs}` : flagsRoot(projectId);
};

export const getFlags = (projectId: Id, query: FlagListQuery) => apiFetch<FlagPage>(flagsKey(projectId, query));

/** A page of flags; the previous page stays on screen while the next loads. */
export function useFlags(projectId: Id, query: FlagListQuery | null) {
  return useSWR(query ? flagsKey(projectId, query) : null, () => getFlags(projectId, query as FlagListQuery), {
    keepPreviousData: true,
  });
}
