import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import type { ActivityEntry, Page } from '@sagline/common/api-types';
import { stubFetch, type StubRequest } from '@/testing/fetch-stub';
import { checker, halvercote, manager } from '@/testing/fixtures';
import { renderApp } from '@/testing/render';

const entries: ActivityEntry[] = [
  {
    id: 31,
    at: '2026-11-20T10:15:00.000Z',
    actor: { id: 3, name: 'Ilse Varga' },
    action: 'flag.closed',
    kind: 'flags',
    summary: 'Ilse Varga closed flag 12 on B1',
    refs: { flagIds: [12], marks: ['B1'] },
  },
  {
    id: 30,
    at: '2026-11-19T08:00:00.000Z',
    actor: null,
    action: 'sign_off.voided',
    kind: 'sign-offs',
    summary: 'Revision 2 changed B7 on L3: its sign-off no longer holds',
    refs: { revision: { id: 55, number: 2 }, level: { id: 102, name: 'L3' }, marks: ['B7'] },
  },
];

function activityApi() {
  return stubFetch({
    'GET /api/auth/me': { body: { user: manager } },
    'GET /api/projects/7': { body: halvercote('manager') },
    'GET /api/projects/7/activity': (req: StubRequest) => {
      const q = new URL(req.path, 'http://x').searchParams;
      const page: Page<ActivityEntry> = { items: entries, total: 60, page: Number(q.get('page') ?? 1), pageSize: Number(q.get('pageSize') ?? 25) };
      return { body: page };
    },
    'GET /api/projects/7/activity/people': { body: [{ id: 3, name: 'Ilse Varga' }, { id: 2, name: 'Tomas Okafor' }] },
  });
}

/** The query of the newest request to the feed. */
function lastQuery(api: ReturnType<typeof stubFetch>): string {
  const calls = api.calls('GET /api/projects/7/activity');
  return calls[calls.length - 1].path.split('?')[1] ?? '';
}

describe('Activity', () => {
  it('reads its filters from the address, sends them to the API and shows readable entries with links', async () => {
    const api = activityApi();
    const { router } = renderApp('/projects/7/activity?kind=flags,sign-offs&actorId=3&from=2026-11-01&to=2026-11-30&q=B1&page=2');
    expect(await screen.findByText('Ilse Varga closed flag 12 on B1')).toBeInTheDocument();
    expect(lastQuery(api)).toBe('kind=flags%2Csign-offs&actorId=3&from=2026-11-01&to=2026-11-30&q=B1&page=2');

    // The controls show the view the address asked for.
    expect(screen.getByLabelText('From')).toHaveValue('2026-11-01');
    expect(screen.getByLabelText('To')).toHaveValue('2026-11-30');
    expect(screen.getByLabelText('Search the entries')).toHaveValue('B1');
    const kinds = screen.getByLabelText('Kind').closest('.ant-select') as HTMLElement;
    expect(within(kinds).getByText('Flags')).toBeInTheDocument();
    expect(within(kinds).getByText('Sign-offs')).toBeInTheDocument();

    // Entries: kind, summary, who, and links to what they concern.
    const table = screen.getByRole('table');
    expect(within(table).getByRole('link', { name: 'Flag 12' })).toHaveAttribute('href', '/projects/7/flags/12');
    expect(within(table).getByRole('link', { name: 'Member B1' })).toHaveAttribute('href', '/projects/7/members/B1');
    expect(within(table).getByRole('link', { name: 'Revision 2' })).toHaveAttribute('href', '/projects/7/imports');
    expect(within(table).getByRole('link', { name: 'Level L3' })).toHaveAttribute('href', '/projects/7/members?level=102');
    expect(within(table).getByText('Sagline (automatic)')).toBeInTheDocument();
    expect(screen.getByText('26–50 of 60 entries')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: /Flags workbook/ })).toHaveAttribute('href', '/api/projects/7/flags.xlsx');
    expect(router.state.location.search).toBe('?kind=flags,sign-offs&actorId=3&from=2026-11-01&to=2026-11-30&q=B1&page=2');
  });

  it('writes each filter change to the address, back on page 1, and the API follows', async () => {
    const api = activityApi();
    const { router, user } = renderApp('/projects/7/activity?page=3');
    expect(await screen.findByText('Ilse Varga closed flag 12 on B1')).toBeInTheDocument();
    const search = () => new URLSearchParams(router.state.location.search);

    // Clicking a person shows only their entries.
    await user.click(within(screen.getByRole('table')).getByRole('button', { name: 'Ilse Varga' }));
    await waitFor(() => expect(search().get('actorId')).toBe('3'));
    expect(search().get('page')).toBeNull();
    await waitFor(() => expect(lastQuery(api)).toBe('actorId=3'));

    fireEvent.change(screen.getByLabelText('From'), { target: { value: '2026-11-10' } });
    await waitFor(() => expect(search().get('from')).toBe('2026-11-10'));

    await user.type(screen.getByLabelText('Search the entries'), 'L3{Enter}');
    await waitFor(() => expect(search().get('q')).toBe('L3'));
    await waitFor(() => expect(lastQuery(api)).toBe('actorId=3&from=2026-11-10&q=L3'));

    // A kind from the list.
    await user.click(screen.getByLabelText('Kind'));
    await user.click(await screen.findByTitle('Reviewer assignments'));
    await waitFor(() => expect(search().get('kind')).toBe('assignments'));

    // Next page keeps the filters.
    await user.click(screen.getByTitle('2'));
    await waitFor(() => expect(search().get('page')).toBe('2'));
    expect(search().get('q')).toBe('L3');

    await user.click(screen.getByRole('button', { name: 'Clear filters' }));
    await waitFor(() => expect(router.state.location.search).toBe(''));
    await waitFor(() => expect(lastQuery(api)).toBe(''));
  });

  it('says so when the day range is backwards, and does not send it', async () => {
    const api = activityApi();
    renderApp('/projects/7/activity?from=2026-11-20&to=2026-11-01');
    expect(await screen.findByRole('alert')).toHaveTextContent('The "To" day is before the "From" day');
    await waitFor(() => expect(lastQuery(api)).toBe('from=2026-11-20'));
  });

  it('is in the project navigation for every role', async () => {
    stubFetch({
      'GET /api/auth/me': { body: { user: checker } },
      'GET /api/projects/7': { body: halvercote('viewer') },
      'GET /api/projects/7/activity': { body: { items: [], total: 0, page: 1, pageSize: 25 } },
      'GET /api/projects/7/activity/people': { body: [] },
    });
    renderApp('/projects/7/activity');
    expect(await screen.findByText('Nothing has happened in this project yet.')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Activity' })).toHaveAttribute('href', '/projects/7/activity');
  });
});
