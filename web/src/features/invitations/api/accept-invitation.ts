import useSWRMutation from 'swr/mutation';
import type { AcceptInvitationRequest } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { invitationKey } from './get-invitation';

export const acceptInvitation = (token: string, body: AcceptInvitationRequest) =>
  apiFetch<void>(`${invitationKey(token)}/accept`, { method: 'POST', body, redirectOn401: false });

export function useAcceptInvitation(token: string) {
  return useSWRMutation(
    `${invitationKey(token)}/accept`,
    (_key: string, { arg }: { arg: AcceptInvitationRequest }) => acceptInvitation(token, arg),
  );
}
