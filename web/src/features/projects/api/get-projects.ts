import useSWR from 'swr';
import type { ProjectSummary } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const projectsKey = () => '/api/projects';

export const getProjects = () => apiFetch<ProjectSummary[]>(projectsKey());

export function useProjects() {
  return useSWR(projectsKey(), getProjects);
}
