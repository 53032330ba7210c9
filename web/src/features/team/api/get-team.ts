import useSWR from 'swr';
import type { TeamMember } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const teamKey = (projectId: number | string) => `/api/projects/${projectId}/team`;

export const getTeam = (projectId: number | string) => apiFetch<TeamMember[]>(teamKey(projectId));

export function useTeam(projectId: number | string) {
  return useSWR(teamKey(projectId), () => getTeam(projectId));
}
