import useSWR from 'swr';
import type { Preferences } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const preferencesKey = () => '/api/me/preferences';

export const getPreferences = () => apiFetch<Preferences>(preferencesKey());

/** The signed-in person's e-mail preferences. */
export function usePreferences() {
  return useSWR(preferencesKey(), getPreferences);
}
