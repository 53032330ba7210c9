import type { CommentFlagRequest, FlagDetail } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { flagKey } from './get-flag';

/** POST …/flags/:flagId/comments (everyone but viewers; no version: a comment overwrites nothing). */
export const commentFlag = (projectId: number | string, flagId: number | string, body: CommentFlagRequest) =>
  apiFetch<FlagDetail>(`${flagKey(projectId, flagId)}/comments`, { method: 'POST', body });
