import type { CopyLimitSetRequest, ProjectLimitSetView } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { limitSetsKey } from './get-limit-sets';

/** A preset (or one of the project's sets) copied into the project as a new set, not in use yet. */
export const copyLimitSet = (projectId: number | string, body: CopyLimitSetRequest) =>
  apiFetch<ProjectLimitSetView>(limitSetsKey(projectId), { method: 'POST', body });
