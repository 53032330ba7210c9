import { useCallback } from 'react';
import { useSWRConfig } from 'swr';
import { flagsRoot } from './get-flags';

type Id = number | string;

/**
 * After a flag changes, every list, count and detail of the project's flags
 * may show it, and so may the members list (its open-flag counts): refetch
 * those that are on screen.
 */
export function useRevalidateFlags(projectId: Id) {
  const { mutate } = useSWRConfig();
  return useCallback(
    (except?: string) => {
      const flags = flagsRoot(projectId);
      const members = `/api/projects/${projectId}/members`;
      return mutate(
        (key) =>
          typeof key === 'string' &&
          key !== except &&
          (key === flags || key.startsWith(`${flags}/`) || key.startsWith(`${flags}?`) || key.startsWith(members)),
      );
    },
    [mutate, projectId],
  );
}
