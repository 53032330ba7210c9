import type { CloseFlagRequest, FlagDetail } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { flagKey } from './get-flag';

/** POST …/flags/:flagId/close (checkers; open or answered → closed), with the version seen. */
export const closeFlag = (projectId: number | string, flagId: number | string, body: CloseFlagRequest) =>
  apiFetch<FlagDetail>(`${flagKey(projectId, flagId)}/close`, { method: 'POST', body });
