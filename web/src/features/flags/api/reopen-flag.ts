import type { ReopenFlagRequest, FlagDetail } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { flagKey } from './get-flag';

/** POST …/flags/:flagId/reopen (checkers; closed or waived → open, a comment required), with the version seen. */
export const reopenFlag = (projectId: number | string, flagId: number | string, body: ReopenFlagRequest) =>
  apiFetch<FlagDetail>(`${flagKey(projectId, flagId)}/reopen`, { method: 'POST', body });
