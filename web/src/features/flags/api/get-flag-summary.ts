import useSWR from 'swr';
import type { FlagSummary } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { flagsRoot } from './get-flags';

type Id = number | string;

export const flagSummaryKey = (projectId: Id) => `${flagsRoot(projectId)}/summary`;

export const getFlagSummary = (projectId: Id) => apiFetch<FlagSummary>(flagSummaryKey(projectId));

/** Counts by status, level and assignee (computed in SQL). */
export function useFlagSummary(projectId: Id) {
  return useSWR(flagSummaryKey(projectId), () => getFlagSummary(projectId));
}
