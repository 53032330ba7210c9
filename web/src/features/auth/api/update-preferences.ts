import useSWRMutation from 'swr/mutation';
import type { Preferences, UpdatePreferencesRequest } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { preferencesKey } from './get-preferences';

export const updatePreferences = (body: UpdatePreferencesRequest) => apiFetch<Preferences>(preferencesKey(), { method: 'PATCH', body });

/** Saves a change; the answer replaces the cached preferences. */
export function useUpdatePreferences() {
  return useSWRMutation(preferencesKey(), (_key: string, { arg }: { arg: UpdatePreferencesRequest }) => updatePreferences(arg), {
    populateCache: true,
    revalidate: false,
  });
}
