import type { BulkAssignFlagsRequest, BulkAssignFlagsResponse } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { flagsRoot } from './get-flags';

/** POST …/flags/bulk-assign (checkers, managers): closed or waived flags are skipped and counted. */
export const bulkAssignFlags = (projectId: number | string, body: BulkAssignFlagsRequest) =>
  apiFetch<BulkAssignFlagsResponse>(`${flagsRoot(projectId)}/bulk-assign`, { method: 'POST', body });
