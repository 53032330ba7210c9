import type { AssignMemberReviewersRequest, AssignMemberReviewersResponse } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { reviewerAssignmentsKey } from './get-reviewer-assignments';

/**
 * PUT …/reviewer-assignments/members (managers): these marks get their own
 * reviewer (beating their level's), or lose it (null). For a bulk action on
 * the Members screen; call useRevalidateOverview afterwards.
 */
export const assignMemberReviewers = (projectId: number | string, body: AssignMemberReviewersRequest) =>
  apiFetch<AssignMemberReviewersResponse>(`${reviewerAssignmentsKey(projectId)}/members`, { method: 'PUT', body });
