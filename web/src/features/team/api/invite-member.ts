import useSWRMutation from 'swr/mutation';
import type { InviteRequest, TeamMember } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { teamKey } from './get-team';

export const inviteMember = (projectId: number | string, body: InviteRequest) =>
  apiFetch<TeamMember>(`/api/projects/${projectId}/invitations`, { method: 'POST', body });

/** Invites a person (or adds an existing account); the team list refetches. */
export function useInviteMember(projectId: number | string) {
  return useSWRMutation(teamKey(projectId), (_key: string, { arg }: { arg: InviteRequest }) =>
    inviteMember(projectId, arg),
  );
}
