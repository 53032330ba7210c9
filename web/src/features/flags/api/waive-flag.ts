import type { WaiveFlagRequest, FlagDetail } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { flagKey } from './get-flag';

/** POST …/flags/:flagId/waive (checkers, managers; open or answered → waived, a reason required), with the version seen. */
export const waiveFlag = (projectId: number | string, flagId: number | string, body: WaiveFlagRequest) =>
  apiFetch<FlagDetail>(`${flagKey(projectId, flagId)}/waive`, { method: 'POST', body });
