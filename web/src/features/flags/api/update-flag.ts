import type { FlagDetail, UpdateFlagRequest } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { flagKey } from './get-flag';

/** PATCH …/flags/:flagId (checkers, managers): assignee and/or due date, with the version seen. */
export const updateFlag = (projectId: number | string, flagId: number | string, body: UpdateFlagRequest) =>
  apiFetch<FlagDetail>(flagKey(projectId, flagId), { method: 'PATCH', body });
