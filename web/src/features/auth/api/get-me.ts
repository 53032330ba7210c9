import useSWR from 'swr';
import type { MeResponse } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const meKey = () => '/api/auth/me';

/** The initial "who am I" check: a 401 here is an answer, not a redirect. */
export const getMe = () => apiFetch<MeResponse>(meKey(), { redirectOn401: false });

export function useMe() {
  return useSWR(meKey(), getMe, { shouldRetryOnError: false });
}
