import type { ProjectRole, UnitSystem } from './constraints';

/**
 * Projects, levels, team and activity.
 *
 * GET    /api/projects                          -> 200 ProjectSummary[] (admins see all)
 * POST   /api/projects            CreateProjectRequest (admin)   -> 201 Project
 * GET    /api/projects/:projectId                -> 200 Project | 404 (not in the project)
 * PATCH  /api/projects/:projectId UpdateProjectRequest (manager) -> 200 Project
 * GET    /api/projects/:projectId/team           -> 200 TeamMember[]
 * POST   /api/projects/:projectId/invitations InviteRequest (manager) -> 201 TeamMember
 * PATCH  /api/projects/:projectId/team/:userId ChangeRoleRequest (manager) -> 200 TeamMember
 * DELETE /api/projects/:projectId/team/:userId (manager) -> 204
 * GET    /api/projects/:projectId/activity?…       -> 200 Page<ActivityEntry> (see activity.ts)
 * GET    /api/users (admin)                      -> 200 Me[]
 * GET    /api/dev/mailbox (development only)     -> 200 MailboxMessage[]
 * GET    /api/health                             -> 200 { status: 'ok', database: 'ok' }
 *
 * An admin acts with manager rights on every project; `myRole` is 'admin'
 * when the admin holds no role there.
 */
export interface Level {
  id: number;
  name: string;
  /** Order from the bottom (0) up. */
  position: number;
}

export interface ProjectSummary {
  id: number;
  name: string;
  number: string;
  unitSystem: UnitSystem;
  myRole: ProjectRole | 'admin';
  createdAt: string;
}

export interface Project extends ProjectSummary {
  levels: Level[];
}

export interface CreateProjectRequest {
  name: string;
  number: string;
  unitSystem: UnitSystem;
  /** Level names, bottom to top. */
  levels: string[];
}

export interface UpdateProjectRequest {
  name?: string;
  number?: string;
  unitSystem?: UnitSystem;
  levels?: string[];
}

export interface TeamMember {
  userId: number;
  name: string;
  email: string;
  role: ProjectRole;
  /** 'invited' until the person has set a password. */
  status: 'active' | 'invited';
}

export interface InviteRequest {
  email: string;
  role: ProjectRole;
  name?: string;
}

export interface ChangeRoleRequest {
  role: ProjectRole;
}

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export interface MailboxMessage {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}
