import type { FlagDetail, RaiseFlagRequest } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { flagsRoot } from './get-flags';

/** POST …/flags (checkers): 201 with the new flag. Callers revalidate with useRevalidateFlags. */
export const raiseFlag = (projectId: number | string, body: RaiseFlagRequest) =>
  apiFetch<FlagDetail>(flagsRoot(projectId), { method: 'POST', body });
