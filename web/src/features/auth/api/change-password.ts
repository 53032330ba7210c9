import useSWRMutation from 'swr/mutation';
import type { ChangePasswordRequest } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const changePassword = (body: ChangePasswordRequest) =>
  apiFetch<void>('/api/auth/password', { method: 'POST', body });

export function useChangePassword() {
  return useSWRMutation('/api/auth/password', (_key: string, { arg }: { arg: ChangePasswordRequest }) =>
    changePassword(arg),
  );
}
