import useSWRMutation from 'swr/mutation';
import type { MeResponse, SignInRequest } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { meKey } from './get-me';

export const signIn = (body: SignInRequest) =>
  // A 401 here means a wrong e-mail or password: show it, do not redirect.
  apiFetch<MeResponse>('/api/auth/sign-in', { method: 'POST', body, redirectOn401: false });

/** Signs in and puts the answer in the "who am I" cache, so guards see it at once. */
export function useSignIn() {
  return useSWRMutation(meKey(), (_key: string, { arg }: { arg: SignInRequest }) => signIn(arg), {
    populateCache: true,
    revalidate: false,
  });
}
