import useSWR from 'swr';
import type { ReviewerAssignments } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

type Id = number | string;

export const reviewerAssignmentsKey = (projectId: Id) => `/api/projects/${projectId}/reviewer-assignments`;

/** GET …/reviewer-assignments: each level's assigned reviewer, members' own, and the checkers who may be assigned. */
export const getReviewerAssignments = (projectId: Id) => apiFetch<ReviewerAssignments>(reviewerAssignmentsKey(projectId));

export function useReviewerAssignments(projectId: Id, enabled = true) {
  return useSWR(enabled ? reviewerAssignmentsKey(projectId) : null, () => getReviewerAssignments(projectId));
}
