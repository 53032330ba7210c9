import { apiFetch } from '@/app/fetcher';
import { limitSetsKey } from './get-limit-sets';

/** Deletes a set the project does not use (204; 409 for the set in use). Refresh the limit sets afterwards. */
export const deleteLimitSet = (projectId: number | string, setId: number) =>
  apiFetch<void>(`${limitSetsKey(projectId)}/${setId}`, { method: 'DELETE' });
