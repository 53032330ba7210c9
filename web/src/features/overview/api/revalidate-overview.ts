import { useCallback } from 'react';
import { useSWRConfig } from 'swr';

type Id = number | string;

/**
 * After an assignment or a sign-off, the overview, the assignments and the
 * members list (reviewers, facets) may all show it: refetch those on screen.
 */
export function useRevalidateOverview(projectId: Id) {
  const { mutate } = useSWRConfig();
  return useCallback(() => {
    const prefixes = [`/api/projects/${projectId}/overview`, `/api/projects/${projectId}/reviewer-assignments`, `/api/projects/${projectId}/members`];
    return mutate((key) => typeof key === 'string' && prefixes.some((p) => key.startsWith(p)));
  }, [mutate, projectId]);
}
