import type { LevelSignOff, SignOffLevelRequest, WithdrawSignOffRequest } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

const signOffPath = (projectId: number | string, levelId: number) => `/api/projects/${projectId}/levels/${levelId}/sign-off`;

/** POST …/levels/:levelId/sign-off (checkers): refused (409) while a flag on the level is open or answered. */
export const signOffLevel = (projectId: number | string, levelId: number, body: SignOffLevelRequest) =>
  apiFetch<LevelSignOff>(signOffPath(projectId, levelId), { method: 'POST', body });

/** POST …/levels/:levelId/sign-off/withdraw (checkers), with the reason. */
export const withdrawSignOff = (projectId: number | string, levelId: number, body: WithdrawSignOffRequest) =>
  apiFetch<LevelSignOff>(`${signOffPath(projectId, levelId)}/withdraw`, { method: 'POST', body });
