import { createContext, useContext, type ReactNode } from 'react';
import type { Project } from '@sagline/common/api-types';

/**
 * The open project, provided by the project shell so the pages under it
 * (team, later members and flags) get its name, levels and my role without
 * importing the projects feature.
 */
const CurrentProjectContext = createContext<Project | null>(null);

export function CurrentProjectProvider({ project, children }: { project: Project; children: ReactNode }) {
  return <CurrentProjectContext.Provider value={project}>{children}</CurrentProjectContext.Provider>;
}

export function useCurrentProject(): Project {
  const project = useContext(CurrentProjectContext);
  if (!project) throw new Error('useCurrentProject is used outside the project shell');
  return project;
}
