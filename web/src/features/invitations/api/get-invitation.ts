import useSWR from 'swr';
import type { InvitationResponse } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const invitationKey = (token: string) => `/api/invitations/${encodeURIComponent(token)}`;

export const getInvitation = (token: string) =>
  apiFetch<InvitationResponse>(invitationKey(token), { redirectOn401: false });

export function useInvitation(token: string) {
  return useSWR(invitationKey(token), () => getInvitation(token), {
    shouldRetryOnError: false,
    revalidateOnFocus: false,
  });
}
