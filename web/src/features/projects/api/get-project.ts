import useSWR from 'swr';
import type { Project } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const projectKey = (projectId: number | string) => `/api/projects/${projectId}`;

export const getProject = (projectId: number | string) => apiFetch<Project>(projectKey(projectId));

export function useProject(projectId: number | string) {
  return useSWR(projectKey(projectId), () => getProject(projectId));
}
