import useSWR from 'swr';
import type { FlagDetail } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { flagsRoot } from './get-flags';

type Id = number | string;

export const flagKey = (projectId: Id, flagId: Id) => `${flagsRoot(projectId)}/${flagId}`;

export const getFlag = (projectId: Id, flagId: Id) => apiFetch<FlagDetail>(flagKey(projectId, flagId));

/** One flag with its history (oldest first). */
export function useFlag(projectId: Id, flagId: Id) {
  return useSWR(flagKey(projectId, flagId), () => getFlag(projectId, flagId));
}
