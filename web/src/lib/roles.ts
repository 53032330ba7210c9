import type { Me, ProjectRole, ProjectSummary } from '@sagline/common/api-types';

/** What a role means to a person, as shown in tags and selects (product.md). */
export const ROLE_LABELS: Record<ProjectRole | 'admin', string> = {
  admin: 'Admin',
  manager: 'Manager',
  engineer: 'Engineer',
  checker: 'Checker',
  viewer: 'Viewer',
};

export const ROLE_DESCRIPTIONS: Record<ProjectRole, string> = {
  manager: 'assigns reviewers, manages the team, watches closure',
  engineer: 'uploads schedule revisions, edits members, answers flags',
  checker: 'reviews members, raises, closes and reopens flags',
  viewer: 'read-only',
};

/**
 * The UI's reading of who may do what. The API decides (its guards answer
 * 403/404); these only keep controls away from people who cannot use them.
 */
export const can = {
  createProject: (me: Me) => me.isAdmin,
  /** Managers and admins invite people, change roles and remove people. */
  manageTeam: (me: Me, myRole: ProjectSummary['myRole']) =>
    me.isAdmin || myRole === 'admin' || myRole === 'manager',
  /** Checkers raise flags (one or in bulk), close and reopen them. */
  raiseFlags: (myRole: ProjectSummary['myRole']) => myRole === 'checker',
  closeFlags: (myRole: ProjectSummary['myRole']) => myRole === 'checker',
  /** Checkers and managers (admins count as managers) reassign, set due dates, waive, bulk assign. */
  manageFlags: (myRole: ProjectSummary['myRole']) => myRole === 'checker' || myRole === 'manager' || myRole === 'admin',
  /** The assignee, or any engineer, answers a flag; viewers never. */
  answerFlag: (me: Me, myRole: ProjectSummary['myRole'], assigneeId: number | null | undefined) =>
    myRole !== 'viewer' && (myRole === 'engineer' || (assigneeId != null && assigneeId === me.id)),
  /** Everyone but viewers comments. */
  commentOnFlags: (myRole: ProjectSummary['myRole']) => myRole !== 'viewer',
};
