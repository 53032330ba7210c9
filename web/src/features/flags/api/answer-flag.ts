import type { AnswerFlagRequest, FlagDetail } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { flagKey } from './get-flag';

/** POST …/flags/:flagId/answer (the assignee or any engineer; open → answered), with the version seen. */
export const answerFlag = (projectId: number | string, flagId: number | string, body: AnswerFlagRequest) =>
  apiFetch<FlagDetail>(`${flagKey(projectId, flagId)}/answer`, { method: 'POST', body });
