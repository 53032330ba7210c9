import useSWRMutation from 'swr/mutation';
import { apiFetch } from '@/app/fetcher';
import { teamKey } from './get-team';

export const removeMember = (projectId: number | string, userId: number) =>
  apiFetch<void>(`/api/projects/${projectId}/team/${userId}`, { method: 'DELETE' });

export function useRemoveMember(projectId: number | string) {
  return useSWRMutation(teamKey(projectId), (_key: string, { arg }: { arg: { userId: number } }) =>
    removeMember(projectId, arg.userId),
  );
}
