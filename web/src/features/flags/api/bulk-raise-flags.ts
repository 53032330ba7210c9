import type { BulkRaiseFlagsRequest, BulkRaiseFlagsResponse } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { flagsRoot } from './get-flags';

/** POST …/flags/bulk (checkers): one flag per failing member; marks already flagged are skipped and counted. */
export const bulkRaiseFlags = (projectId: number | string, body: BulkRaiseFlagsRequest) =>
  apiFetch<BulkRaiseFlagsResponse>(`${flagsRoot(projectId)}/bulk`, { method: 'POST', body });
