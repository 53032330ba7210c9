import useSWR from 'swr';
import type { RevisionDetail } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const revisionKey = (projectId: number | string, revisionId: number) =>
  `/api/projects/${projectId}/revisions/${revisionId}`;

export const getRevision = (projectId: number | string, revisionId: number) =>
  apiFetch<RevisionDetail>(revisionKey(projectId, revisionId));

/** `revisionId` null: nothing open, nothing fetched. */
export function useRevision(projectId: number | string, revisionId: number | null) {
  return useSWR(revisionId === null ? null : revisionKey(projectId, revisionId), () =>
    getRevision(projectId, revisionId!),
  );
}
