import useSWRMutation from 'swr/mutation';
import type { ChangeRoleRequest, ProjectRole, TeamMember } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { teamKey } from './get-team';

export const changeRole = (projectId: number | string, userId: number, body: ChangeRoleRequest) =>
  apiFetch<TeamMember>(`/api/projects/${projectId}/team/${userId}`, { method: 'PATCH', body });

export function useChangeRole(projectId: number | string) {
  return useSWRMutation(
    teamKey(projectId),
    (_key: string, { arg }: { arg: { userId: number; role: ProjectRole } }) =>
      changeRole(projectId, arg.userId, { role: arg.role }),
  );
}
