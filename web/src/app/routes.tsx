import type { ComponentType } from 'react';
import { Navigate, Outlet, type RouteObject } from 'react-router-dom';
import { PageLoading } from '@/components/page-loading';
import { AppLayout } from './layout/app-layout';
import { PublicLayout } from './layout/public-layout';
import { NotFoundPage } from './not-found-page';
import { paths } from './paths';
import { OptionalAuth, RequireAuth } from './require-auth';
import { RootFrame } from './root-frame';
import { RouteError } from './route-error';

/** A route module loaded on first visit: each page is its own chunk. */
function lazyPage<M>(load: () => Promise<M>, pick: (m: M) => ComponentType) {
  return async () => ({ Component: pick(await load()) });
}

/**
 * Every screen of the app. The browser router (router.tsx) and the tests'
 * memory router are built from this one table.
 */
export const routes: RouteObject[] = [
  {
    id: 'root',
    element: <RootFrame />,
    errorElement: <RouteError />,
    HydrateFallback: () => <PageLoading />,
    children: [
      { index: true, element: <Navigate to={paths.projects.getHref()} replace /> },
      {
        element: <PublicLayout />,
        errorElement: <RouteError />,
        children: [
          {
            path: paths.signIn.path,
            lazy: lazyPage(() => import('@/features/auth/pages/sign-in-page'), (m) => m.SignInPage),
          },
          {
            path: paths.invitation.path,
            lazy: lazyPage(() => import('@/features/invitations/pages/invitation-page'), (m) => m.InvitationPage),
          },
        ],
      },
      {
        element: (
          <RequireAuth>
            <AppLayout />
          </RequireAuth>
        ),
        errorElement: <RouteError />,
        children: [
          {
            path: paths.projects.path,
            lazy: lazyPage(() => import('@/features/projects/pages/projects-page'), (m) => m.ProjectsPage),
          },
          {
            path: paths.account.path,
            lazy: lazyPage(() => import('@/features/auth/pages/account-page'), (m) => m.AccountPage),
          },
          {
            path: paths.project.path,
            lazy: lazyPage(() => import('@/features/projects/pages/project-shell-page'), (m) => m.ProjectShellPage),
            errorElement: <RouteError />,
            children: [
              { index: true, element: <Navigate to="overview" replace /> },
              {
                path: paths.projectOverview.path,
                lazy: lazyPage(() => import('@/features/overview/pages/overview-page'), (m) => m.OverviewPage),
              },
              {
                path: paths.projectMembers.path,
                lazy: lazyPage(() => import('@/features/members/pages/members-page'), (m) => m.MembersPage),
              },
              {
                path: paths.projectMember.path,
                lazy: lazyPage(() => import('@/features/members/pages/member-page'), (m) => m.MemberPage),
              },
              {
                path: paths.projectImports.path,
                lazy: lazyPage(() => import('@/features/imports/pages/imports-page'), (m) => m.ImportsPage),
              },
              {
                path: paths.projectFlags.path,
                lazy: lazyPage(() => import('@/features/flags/pages/flags-page'), (m) => m.FlagsPage),
              },
              {
                path: paths.projectFlag.path,
                lazy: lazyPage(() => import('@/features/flags/pages/flag-page'), (m) => m.FlagPage),
              },
              {
                path: paths.projectLimitSets.path,
                lazy: lazyPage(() => import('@/features/limit-sets/pages/limit-sets-page'), (m) => m.LimitSetsPage),
              },
              {
                path: paths.projectActivity.path,
                lazy: lazyPage(() => import('@/features/activity/pages/activity-page'), (m) => m.ActivityPage),
              },
              {
                path: paths.projectTeam.path,
                lazy: lazyPage(() => import('@/features/team/pages/team-page'), (m) => m.TeamPage),
              },
            ],
          },
        ],
      },
      {
        // Printable pages: signed in, without the app's top bar and navigation.
        element: (
          <RequireAuth>
            <Outlet />
          </RequireAuth>
        ),
        errorElement: <RouteError />,
        children: [
          {
            path: paths.projectOverviewReport.path,
            lazy: lazyPage(() => import('@/features/overview/pages/overview-report-page'), (m) => m.OverviewReportPage),
          },
        ],
      },
      {
        // Signed in or not: an invitee reads their invitation in the mailbox
        // before they have an account; a 404 should not demand a sign-in.
        element: (
          <OptionalAuth>
            <AppLayout />
          </OptionalAuth>
        ),
        errorElement: <RouteError />,
        children: [
          {
            path: paths.mailbox.path,
            lazy: lazyPage(() => import('@/features/mailbox/pages/mailbox-page'), (m) => m.MailboxPage),
          },
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
];
