import useSWR from 'swr';
import type { RevisionSummary } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

/** The same address as the Imports screen's list, so the two share one cache entry. */
export const revisionsKey = (projectId: number | string) => `/api/projects/${projectId}/revisions`;

/** Newest first. */
export const getRevisions = (projectId: number | string) => apiFetch<RevisionSummary[]>(revisionsKey(projectId));

export function useRevisions(projectId: number | string) {
  return useSWR(revisionsKey(projectId), () => getRevisions(projectId));
}
