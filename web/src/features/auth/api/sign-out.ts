import { useSWRConfig } from 'swr';
import { apiFetch } from '@/app/fetcher';

export const signOut = () => apiFetch<void>('/api/auth/sign-out', { method: 'POST', redirectOn401: false });

/** Signs out and forgets every cached answer, so the next person sees nothing of the last. */
export function useSignOut() {
  const { mutate } = useSWRConfig();
  return async () => {
    try {
      await signOut();
    } finally {
      await mutate(() => true, undefined, { revalidate: false });
    }
  };
}
