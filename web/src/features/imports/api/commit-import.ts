import useSWRMutation from 'swr/mutation';
import type { CommitImportRequest, CommitImportResponse, ImportJobAccepted } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { revisionsKey } from './get-revisions';

export type CommitOutcome = CommitImportResponse | ImportJobAccepted;

/** 201 { revision } when committed in the request; 202 { jobId } for a background job. */
export const commitImport = (projectId: number | string, draftId: string, body: CommitImportRequest) =>
  apiFetch<CommitOutcome>(`/api/projects/${projectId}/imports/${encodeURIComponent(draftId)}/commit`, {
    method: 'POST',
    body,
  });

export const isJobAccepted = (o: CommitOutcome): o is ImportJobAccepted => 'jobId' in o;

/** Commits a draft; the revisions list refetches (a background job refetches it again when done). */
export function useCommitImport(projectId: number | string) {
  return useSWRMutation(
    revisionsKey(projectId),
    (_key: string, { arg }: { arg: { draftId: string; label?: string } }) =>
      commitImport(projectId, arg.draftId, arg.label ? { label: arg.label } : {}),
  );
}
