import { screen, waitFor, within } from '@testing-library/react';
import type { FlagsOverTime, OverviewCounts, ProjectOverview, ReviewerAssignments } from '@sagline/common/api-types';
import { apiError, stubFetch } from '@/testing/fetch-stub';
import { checker, halvercote, manager } from '@/testing/fixtures';
import { renderApp, setCsrfCookie } from '@/testing/render';

const counts = (c: Partial<OverviewCounts>): OverviewCounts => ({
  members: 0, pass: 0, fail: 0, unchecked: 0, flagsOpen: 0, flagsAnswered: 0, flagsClosed: 0, flagsWaived: 0, flagsTotal: 0, percentClosed: null, overdue: 0, ...c,
});

const overview: ProjectOverview = {
  project: { id: 7, name: 'Halvercote Yard', number: 'HY-2041' },
  latestRevision: {
    id: 31, number: 3, label: 'Rev C for permit', createdAt: '2026-12-02T09:30:00.000Z', uploadedBy: { id: 4, name: 'Rafe Lindqvist' },
    fileName: 'rev-c.xlsx', memberCount: 7, diff: { againstNumber: 2, added: 1, removed: 0, changed: 2, flips: 1 },
  },
  totals: counts({ members: 7, pass: 3, fail: 4, flagsOpen: 1, flagsAnswered: 1, flagsClosed: 2, flagsWaived: 1, flagsTotal: 5, percentClosed: 60, overdue: 1 }),
  levels: [
    {
      level: { id: 100, name: 'L1' }, ...counts({ members: 4, pass: 2, fail: 2, flagsOpen: 1, flagsAnswered: 1, flagsClosed: 1, flagsTotal: 3, percentClosed: 33.3, overdue: 1 }),
      assignedReviewer: null, signOff: null,
    },
    {
      level: { id: 101, name: 'L2' }, ...counts({ members: 3, pass: 1, fail: 2, flagsClosed: 1, flagsWaived: 1, flagsTotal: 2, percentClosed: 100 }),
      assignedReviewer: { id: 3, name: 'Ilse Varga' },
      signOff: {
        id: 5, level: { id: 101, name: 'L2' }, state: 'voided', signedBy: { id: 3, name: 'Ilse Varga' }, signedAt: '2026-12-01T10:00:00.000Z', revisionNumber: 2,
        comment: null, voidedAt: '2026-12-02T09:30:00.000Z', voidedInRevisionNumber: 3, voidedBy: null, voidReason: 'Revision 3 changed members on L2: C3 (added)',
      },
    },
    { level: { id: 102, name: 'L3' }, ...counts({ members: 0 }), assignedReviewer: null, signOff: null },
  ],
  reviewers: [
    { reviewer: { id: 3, name: 'Ilse Varga', email: checker.email }, present: true, ...counts({ members: 6, pass: 2, fail: 4, flagsOpen: 1, flagsAnswered: 1, flagsClosed: 2, flagsWaived: 1, flagsTotal: 5, percentClosed: 60, overdue: 1 }) },
    { reviewer: null, present: true, ...counts({ members: 1, pass: 1 }) },
  ],
  today: '2026-12-02',
};

const series: FlagsOverTime = {
  from: '2026-11-30',
  to: '2026-12-02',
  points: [
    { day: '2026-11-30', open: 2, answered: 0, closed: 0, waived: 0, raised: 2 },
    { day: '2026-12-01', open: 2, answered: 1, closed: 0, waived: 0, raised: 1 },
    { day: '2026-12-02', open: 1, answered: 1, closed: 2, waived: 1, raised: 2 },
  ],
};

const assignments: ReviewerAssignments = {
  levels: [{ level: { id: 100, name: 'L1' }, reviewer: null }, { level: { id: 101, name: 'L2' }, reviewer: { id: 3, name: 'Ilse Varga' } }],
  members: [],
  candidates: [{ id: 3, name: 'Ilse Varga', email: checker.email }, { id: 8, name: 'Noor Haddad', email: 'noor.haddad@halvercote.example' }],
};

function api(me: typeof manager, myRole: Parameters<typeof halvercote>[0]) {
  return stubFetch({
    'GET /api/auth/me': { body: { user: me } },
    'GET /api/projects/7': { body: halvercote(myRole) },
    'GET /api/projects/7/overview': { body: overview },
    'GET /api/projects/7/overview/flags-over-time': { body: series },
    'GET /api/projects/7/reviewer-assignments': { body: assignments },
  });
}

describe('Overview', () => {
  it('shows the counts per level and per reviewer as the server counted them, each linking to its filtered view', async () => {
    api(checker, 'viewer');
    renderApp('/projects/7/overview');
    const levels = await screen.findByRole('table', { name: 'Per level' });
    const l1 = within(levels).getByRole('row', { name: /^L1/ });
    expect(within(l1).getByRole('link', { name: 'L1' })).toHaveAttribute('href', '/projects/7/members?level=100');
    expect(within(l1).getByRole('link', { name: 'Failing: 2 (L1)' })).toHaveAttribute('href', '/projects/7/members?level=100&verdict=fail');
    expect(within(l1).getByRole('link', { name: 'Open: 1 (L1)' })).toHaveAttribute('href', '/projects/7/flags?status=open&level=100');
    expect(within(l1).getByRole('link', { name: 'Overdue: 1 (L1)' })).toHaveAttribute('href', '/projects/7/flags?overdue=true&level=100');
    expect(within(l1).getByRole('link', { name: 'Flags: 3 (L1)' })).toHaveAttribute('href', '/projects/7/flags?level=100');
    expect(within(l1).getByText('33.3 %')).toBeInTheDocument();
    // A voided sign-off says why.
    const l2 = within(levels).getByRole('row', { name: /^L2/ });
    expect(within(l2).getByText('Void')).toBeInTheDocument();
    expect(within(l2).getByText('Revision 3 changed members on L2: C3 (added)')).toBeInTheDocument();
    expect(within(l2).getByText('Ilse Varga')).toBeInTheDocument();

    const reviewers = screen.getByRole('table', { name: 'Per reviewer' });
    expect(within(reviewers).getByRole('link', { name: 'Ilse Varga' })).toHaveAttribute('href', '/projects/7/members?reviewer=3');
    expect(within(reviewers).getByRole('link', { name: 'No reviewer on the team' })).toHaveAttribute('href', '/projects/7/members?reviewer=none');
    expect(within(reviewers).getByRole('link', { name: 'Failing: 4 (Ilse Varga)' })).toHaveAttribute('href', '/projects/7/members?reviewer=3&verdict=fail');

    expect(screen.getByLabelText('Latest revision')).toHaveTextContent(/^Revision 3 “Rev C for permit” · came in 2 Dec 2026/);
    expect(screen.getByText(/Against revision 2: 1 added, 0 removed, 2 changed, 1 verdict flipped\./)).toBeInTheDocument();
    expect(await screen.findByRole('img', { name: 'Flags over time. On 2 Dec: 1 open, 1 answered, 2 closed, 1 waived.' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: /Printable report/ })).toHaveAttribute('href', '/projects/7/overview/report');
    // A viewer gets neither the reviewer select nor a sign-off action.
    expect(screen.queryByRole('combobox')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Sign off/ })).not.toBeInTheDocument();
  });

  it('lets a manager assign a checker to a level, then shows the new counts', async () => {
    setCsrfCookie('csrf-7');
    const stub = api(manager, 'manager');
    stub.set({ 'PUT /api/projects/7/reviewer-assignments/levels/:levelId': { body: assignments } });
    const { user } = renderApp('/projects/7/overview');
    const select = await screen.findByRole('combobox', { name: 'Reviewer of L1' });
    await waitFor(() => expect(stub.calls('GET /api/projects/7/reviewer-assignments')).toHaveLength(1));
    await user.click(select);
    await user.click(await screen.findByTitle('Noor Haddad'));
    await waitFor(() => expect(stub.calls('PUT /api/projects/7/reviewer-assignments/levels/:levelId')).toHaveLength(1));
    const [put] = stub.calls('PUT /api/projects/7/reviewer-assignments/levels/:levelId');
    expect(put.path).toBe('/api/projects/7/reviewer-assignments/levels/100');
    expect(put.body).toEqual({ reviewerId: 8 });
    expect(put.headers['x-csrf-token']).toBe('csrf-7');
    expect(await screen.findByText('Noor Haddad now reviews L1.')).toBeInTheDocument();
    await waitFor(() => expect(stub.calls('GET /api/projects/7/overview').length).toBeGreaterThan(1));
  });

  it('lets a checker sign off a level with nothing open, and shows the refusal the server gives', async () => {
    setCsrfCookie('csrf-7');
    const stub = api(checker, 'checker');
    const clear = { ...overview, levels: [{ ...overview.levels[0], ...counts({ members: 4, pass: 2, fail: 2, flagsClosed: 3, flagsTotal: 3, percentClosed: 100 }) }, ...overview.levels.slice(1)] };
    stub.set({
      'GET /api/projects/7/overview': { body: clear },
      'POST /api/projects/7/levels/:levelId/sign-off': apiError(409, 'CONFLICT', 'L1 cannot be signed off: 1 open flag on it still needs action: B1 (flag 12, open). Close or waive it first.'),
    });
    const { user } = renderApp('/projects/7/overview');
    const levels = await screen.findByRole('table', { name: 'Per level' });
    // No sign-off action on a level without members.
    expect(within(within(levels).getByRole('row', { name: /^L3/ })).queryByRole('button')).not.toBeInTheDocument();
    await user.click(within(levels).getByRole('button', { name: 'Sign off L1' }));
    await user.type(await screen.findByRole('textbox', { name: 'Comment on the sign-off of L1' }), 'All reviewed.');
    await user.click(screen.getByRole('button', { name: 'Confirm the sign-off of L1' }));
    expect(await screen.findByText(/L1 cannot be signed off: 1 open flag/)).toBeInTheDocument();
    expect(stub.calls('POST /api/projects/7/levels/:levelId/sign-off')[0].body).toEqual({ comment: 'All reviewed.' });
    // L2 (void, nothing open) can be signed off again; a level with open flags has its button disabled.
    expect(within(within(levels).getByRole('row', { name: /^L2/ })).getByRole('button', { name: 'Sign off L2' })).toBeEnabled();
  });

  it('disables the sign-off of a level while a flag on it waits for action', async () => {
    api(checker, 'checker');
    renderApp('/projects/7/overview');
    const levels = await screen.findByRole('table', { name: 'Per level' });
    expect(within(within(levels).getByRole('row', { name: /^L1/ })).getByRole('button', { name: 'Sign off L1' })).toBeDisabled();
  });
});
