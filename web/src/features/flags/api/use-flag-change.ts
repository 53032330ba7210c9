import { useCallback, useState } from 'react';
import { useSWRConfig } from 'swr';
import type { FlagDetail, StaleFlagDetail } from '@sagline/common/api-types';
import { isApiError } from '@/app/api-error';
import { flagKey } from './get-flag';
import { useRevalidateFlags } from './revalidate-flags';

/** The flag as the server has it, from the details of a 409 STALE_WRITE; null for any other failure. */
export function staleFlagOf(e: unknown): FlagDetail | null {
  if (!isApiError(e) || e.code !== 'STALE_WRITE') return null;
  const d = e.details[0] as Partial<StaleFlagDetail> | undefined;
  const value = d?.value as FlagDetail | undefined;
  return value && typeof value === 'object' && typeof value.version === 'number' ? value : null;
}

/**
 * Runs one change of a flag (a call of one of the request files). On success
 * the answer replaces the cached flag and lists are refetched. On a stale write
 * the cached flag becomes the CURRENT one from the error's details (so the
 * screen shows what changed) and the error is thrown on for the form to report.
 */
export function useFlagChange(projectId: number | string, flagId: number | string) {
  const { mutate } = useSWRConfig();
  const revalidate = useRevalidateFlags(projectId);
  const [isMutating, setMutating] = useState(false);
  const key = flagKey(projectId, flagId);

  const run = useCallback(
    async (call: () => Promise<FlagDetail>): Promise<FlagDetail> => {
      setMutating(true);
      try {
        const flag = await call();
        await mutate(key, flag, { revalidate: false });
        void revalidate(key);
        return flag;
      } catch (e) {
        const current = staleFlagOf(e);
        if (current) {
          await mutate(key, current, { revalidate: false });
          void revalidate(key);
        }
        throw e;
      } finally {
        setMutating(false);
      }
    },
    [key, mutate, revalidate],
  );
  return { run, isMutating };
}
