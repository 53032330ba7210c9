import { apiFetch } from '@/app/fetcher';

/** Throws a draft away (204). Nothing else refers to a draft, so no cache to refresh. */
export const discardImport = (projectId: number | string, draftId: string) =>
  apiFetch<void>(`/api/projects/${projectId}/imports/${encodeURIComponent(draftId)}`, { method: 'DELETE' });
