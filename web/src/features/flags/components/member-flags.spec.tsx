import { screen, waitFor, within } from '@testing-library/react';
import type { MemberListQuery, ProjectSummary } from '@sagline/common/api-types';
import { CurrentProjectProvider } from '@/lib/current-project';
import { CurrentUserProvider } from '@/lib/current-user';
import { apiError, stubFetch, type StubRoutes } from '@/testing/fetch-stub';
import { checker, halvercote } from '@/testing/fixtures';
import { renderWithProviders, setCsrfCookie } from '@/testing/render';
import { flag, flagTeam, openFlag, page } from '../pages/flags-fixtures';
import { BulkRaiseButton } from './bulk-raise-button';
import { MemberFlags } from './member-flags';

const CHECKS = ['L/360 live', 'L/240 total'];

function api(more: StubRoutes = {}) {
  return stubFetch({
    'GET /api/projects/7/team': { body: flagTeam },
    // "contains": L3-B07 and L3-B070 both come back; only the member's own is listed.
    'GET /api/projects/7/flags': { body: page([flag(), flag({ id: 30, mark: 'L3-B070', title: 'L3-B070 needs a look' })]) },
    ...more,
  });
}

function inProject(ui: React.ReactElement, myRole: ProjectSummary['myRole']) {
  return renderWithProviders(
    <CurrentUserProvider user={checker}>
      <CurrentProjectProvider project={halvercote(myRole)}>{ui}</CurrentProjectProvider>
    </CurrentUserProvider>,
  );
}

describe('MemberFlags', () => {
  it("lists the member's own flags, each linking to its page", async () => {
    const stub = api();
    inProject(<MemberFlags projectId={7} mark="L3-B07" checks={CHECKS} />, 'viewer');
    const list = await screen.findByRole('list', { name: 'Flags of L3-B07' });
    const link = await within(list).findByRole('link', { name: 'L3-B07 fails L/360 live (utilisation 1.24)' });
    expect(link).toHaveAttribute('href', '/projects/7/flags/12');
    expect(within(list).queryByText('L3-B070 needs a look')).not.toBeInTheDocument();
    expect(new URL(stub.requests[0].path, 'http://x').searchParams.get('mark')).toBe('L3-B07');
    // Viewers cannot raise.
    expect(screen.queryByRole('button', { name: 'Raise flag' })).not.toBeInTheDocument();
  });

  it('a checker raises a flag on one check with a comment, an engineer and a due date', async () => {
    setCsrfCookie('csrf-7');
    const stub = api({ 'POST /api/projects/7/flags': { status: 201, body: openFlag } });
    const { user } = inProject(<MemberFlags projectId={7} mark="L3-B07" checks={CHECKS} />, 'checker');
    await user.click(await screen.findByRole('button', { name: /Raise flag$/ }));
    const form = await screen.findByRole('form', { name: 'Raise a flag on L3-B07' });

    await user.click(within(form).getByRole('combobox', { name: 'Check' }));
    await user.click(await screen.findByTitle('L/360 live'));
    await user.type(within(form).getByLabelText('Comment'), 'Check the section against the new slab load.');
    await user.click(within(form).getByRole('combobox', { name: 'Assignee' }));
    await user.click(await screen.findByTitle('Rafe Lindqvist'));
    await user.type(within(form).getByLabelText('Due date'), '2099-12-18');
    await user.click(within(form).getByRole('button', { name: 'Raise flag' }));

    expect(await screen.findByText('Flag 12 raised on L3-B07, assigned to Rafe Lindqvist.')).toBeInTheDocument();
    const [sent] = stub.calls('POST /api/projects/7/flags');
    expect(sent.body).toEqual({ mark: 'L3-B07', checkName: 'L/360 live', comment: 'Check the section against the new slab load.', assigneeId: 4, dueDate: '2099-12-18' });
    expect(sent.headers['x-csrf-token']).toBe('csrf-7');
  });

  it('says why a second open flag on the same check is refused, and keeps the form', async () => {
    api({
      'POST /api/projects/7/flags': apiError(409, 'CONFLICT', 'L3-B07 already has an open flag on the member as a whole (flag 12); add a comment to that one instead.'),
    });
    const { user } = inProject(<MemberFlags projectId={7} mark="L3-B07" checks={CHECKS} />, 'checker');
    await user.click(await screen.findByRole('button', { name: /Raise flag$/ }));
    const form = await screen.findByRole('form', { name: 'Raise a flag on L3-B07' });
    await user.click(within(form).getByRole('button', { name: 'Raise flag' }));
    expect(await within(form).findByText(/already has an open flag on the member as a whole \(flag 12\)/)).toBeInTheDocument();
  });
});

describe('BulkRaiseButton', () => {
  const query: MemberListQuery = { level: '102', check: 'L/360 live', verdict: 'fail', q: 'B0', sort: '-utilization', page: 2, pageSize: 50 };

  it('asks to confirm, sends the filter (not the page), and reports raised and skipped', async () => {
    setCsrfCookie('csrf-7');
    const stub = api({
      'POST /api/projects/7/flags/bulk': { status: 201, body: { created: [flag(), flag({ id: 13, mark: 'L3-B08' })], skipped: 1, skippedMarks: ['L3-B09'] } },
    });
    const { user } = inProject(<BulkRaiseButton projectId={7} query={query} failingCount={3} />, 'checker');
    await user.click(await screen.findByRole('button', { name: /Raise flags for 3 failing members/ }));
    const form = await screen.findByRole('form', { name: 'Raise flags in bulk' });
    expect(within(form).getByText(/One flag on each of the 3 failing members of the current filter/)).toBeInTheDocument();
    await user.click(within(form).getByRole('button', { name: 'Raise 3 flags' }));

    expect(await screen.findByText('2 flags raised; 1 member skipped.')).toBeInTheDocument();
    expect(screen.getByText(/already have an open or answered flag: L3-B09/)).toBeInTheDocument();
    await waitFor(() => expect(stub.calls('POST /api/projects/7/flags/bulk')).toHaveLength(1));
    expect(stub.calls('POST /api/projects/7/flags/bulk')[0].body).toEqual({ filter: { level: '102', check: 'L/360 live', q: 'B0' } });
  });

  it('is not there for anyone but checkers, and is off without failing members', async () => {
    api();
    const first = inProject(<BulkRaiseButton projectId={7} query={query} failingCount={3} />, 'manager');
    expect(screen.queryByRole('button', { name: /Raise flags/ })).not.toBeInTheDocument();
    first.unmount();
    inProject(<BulkRaiseButton projectId={7} query={query} failingCount={0} />, 'checker');
    expect(await screen.findByRole('button', { name: /Raise flags for 0 failing members/ })).toBeDisabled();
  });
});
