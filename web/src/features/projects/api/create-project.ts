import useSWRMutation from 'swr/mutation';
import type { CreateProjectRequest, Project } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';
import { projectsKey } from './get-projects';

export const createProject = (body: CreateProjectRequest) =>
  apiFetch<Project>(projectsKey(), { method: 'POST', body });

/** Creates a project; the projects list refetches afterwards. */
export function useCreateProject() {
  return useSWRMutation(projectsKey(), (_key: string, { arg }: { arg: CreateProjectRequest }) => createProject(arg));
}
