import type { AssignLevelReviewerRequest, ReviewerAssignments } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { reviewerAssignmentsKey } from './get-reviewer-assignments';

/** PUT …/reviewer-assignments/levels/:levelId (managers): a checker for every member of the level, or null to go back to the schedule's. */
export const assignLevelReviewer = (projectId: number | string, levelId: number, body: AssignLevelReviewerRequest) =>
  apiFetch<ReviewerAssignments>(`${reviewerAssignmentsKey(projectId)}/levels/${levelId}`, { method: 'PUT', body });
