import type { ProjectRole } from '@sagline/common/api-types';

/** What ProjectRoleGuard learnt about the caller and the project named by the route. */
export interface ProjectAccess {
  projectId: number;
  /** The caller's own role on the project; null for an admin without one. */
  role: ProjectRole | null;
  /** As shown to the client: the role, or 'admin' when an admin holds none. */
  myRole: ProjectRole | 'admin';
  /** Managers, and admins (who act with manager rights everywhere). */
  canManage: boolean;
}

export const PROJECT_ACCESS = Symbol('projectAccess');
