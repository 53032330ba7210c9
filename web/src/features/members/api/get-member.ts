import useSWR from 'swr';
import type { MemberDetail } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const memberKey = (projectId: number | string, mark: string, revision: string | null) =>
  `/api/projects/${projectId}/members/${encodeURIComponent(mark)}${revision ? `?revision=${encodeURIComponent(revision)}` : ''}`;

/** One member explained: input, engine report, stored results with sources, flags and history. */
export const getMember = (projectId: number | string, mark: string, revision: string | null) =>
  apiFetch<MemberDetail>(memberKey(projectId, mark, revision));

export function useMember(projectId: number | string, mark: string, revision: string | null) {
  return useSWR(memberKey(projectId, mark, revision), () => getMember(projectId, mark, revision));
}
