import useSWR from 'swr';
import type { TeamMember } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

type Id = number | string;

/** The team list; flags only need who may be assigned (engineers, flags.ts). */
export const teamKey = (projectId: Id) => `/api/projects/${projectId}/team`;

export const getTeam = (projectId: Id) => apiFetch<TeamMember[]>(teamKey(projectId));

/** The project's engineers, by name: the people a flag can be assigned to. */
export function useEngineers(projectId: Id, enabled = true) {
  const swr = useSWR(enabled ? teamKey(projectId) : null, () => getTeam(projectId));
  const engineers = (swr.data ?? [])
    .filter((m) => m.role === 'engineer')
    .sort((a, b) => (a.name || a.email).localeCompare(b.name || b.email));
  return { ...swr, engineers };
}
