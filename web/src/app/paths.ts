/**
 * Every screen's route pattern and a function that builds a link to it.
 * Route modules and links read this table; nothing else spells a URL.
 */
type ProjectId = number | string;

const withQuery = (path: string, query: Record<string, string | undefined>): string => {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (v) params.set(k, v);
  const s = params.toString();
  return s ? `${path}?${s}` : path;
};

export const paths = {
  home: { path: '/', getHref: () => '/' },
  signIn: {
    path: '/sign-in',
    /** `next`: where to go after signing in; `email`: pre-fills the form. */
    getHref: (opts: { next?: string; email?: string } = {}) =>
      withQuery('/sign-in', { next: opts.next, email: opts.email }),
  },
  invitation: {
    path: '/invitations/:token',
    getHref: (token: string) => `/invitations/${encodeURIComponent(token)}`,
  },
  projects: { path: '/projects', getHref: () => '/projects' },
  project: {
    path: '/projects/:projectId',
    getHref: (projectId: ProjectId) => `/projects/${projectId}`,
  },
  projectOverview: {
    path: '/projects/:projectId/overview',
    getHref: (projectId: ProjectId) => `/projects/${projectId}/overview`,
  },
  projectOverviewReport: {
    /** The printable status report (no app chrome; the browser prints it to PDF). */
    path: '/projects/:projectId/overview/report',
    getHref: (projectId: ProjectId) => `/projects/${projectId}/overview/report`,
  },
  projectMembers: {
    path: '/projects/:projectId/members',
    /**
     * `query`: the filters, with the API's MemberListQuery names, e.g.
     * `{ level: '3', verdict: 'fail' }` (lists comma-separated).
     */
    getHref: (projectId: ProjectId, query: Record<string, string | undefined> = {}) =>
      withQuery(`/projects/${projectId}/members`, query),
  },
  projectMember: {
    path: '/projects/:projectId/members/:mark',
    getHref: (projectId: ProjectId, mark: string) => `/projects/${projectId}/members/${encodeURIComponent(mark)}`,
  },
  projectImports: {
    path: '/projects/:projectId/imports',
    getHref: (projectId: ProjectId) => `/projects/${projectId}/imports`,
  },
  projectFlags: {
    path: '/projects/:projectId/flags',
    /** `query`: the list's filters, named as the API's FlagListQuery (`status=open&assignee=4`). */
    getHref: (projectId: ProjectId, query: Record<string, string | undefined> = {}) =>
      withQuery(`/projects/${projectId}/flags`, query),
  },
  projectFlag: {
    path: '/projects/:projectId/flags/:flagId',
    getHref: (projectId: ProjectId, flagId: number | string) => `/projects/${projectId}/flags/${flagId}`,
  },
  projectLimitSets: {
    path: '/projects/:projectId/limit-sets',
    getHref: (projectId: ProjectId) => `/projects/${projectId}/limit-sets`,
  },
  projectActivity: {
    path: '/projects/:projectId/activity',
    /** `query`: the feed's filters, named as the API's ActivityQuery (`kind=flags,sign-offs&actorId=4&from=2026-11-01`). */
    getHref: (projectId: ProjectId, query: Record<string, string | undefined> = {}) =>
      withQuery(`/projects/${projectId}/activity`, query),
  },
  projectTeam: {
    path: '/projects/:projectId/team',
    getHref: (projectId: ProjectId) => `/projects/${projectId}/team`,
  },
  account: { path: '/account', getHref: () => '/account' },
  mailbox: { path: '/dev/mailbox', getHref: () => '/dev/mailbox' },
} as const;

/**
 * A return path is only honoured when it stays inside the app: it must start
 * with one slash (not `//host`, not `https:`), so a crafted sign-in link
 * cannot send someone to another site.
 */
export function safeReturnPath(next: string | null | undefined): string | undefined {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return undefined;
  if (next.startsWith(paths.signIn.path)) return undefined;
  return next;
}
