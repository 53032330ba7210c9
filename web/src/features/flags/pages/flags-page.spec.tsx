import { screen, waitFor, within } from '@testing-library/react';
import type { FlagStatus, Me } from '@sagline/common/api-types';
import { stubFetch, type StubRequest, type StubRoutes } from '@/testing/fetch-stub';
import { checker, halvercote, manager } from '@/testing/fixtures';
import { renderApp, setCsrfCookie } from '@/testing/render';
import { flag, flagList, flagTeam, page, summary, viewer } from './flags-fixtures';

function flagsApi(me: Me, myRole: Parameters<typeof halvercote>[0], more: StubRoutes = {}) {
  return stubFetch({
    'GET /api/auth/me': { body: { user: me } },
    'GET /api/projects/7': { body: halvercote(myRole) },
    'GET /api/projects/7/team': { body: flagTeam },
    'GET /api/projects/7/flags/summary': { body: summary },
    'GET /api/projects/7/members/facets': { body: { checks: [{ name: 'L/360 live', failCount: 9 }, { name: 'L/240 total', failCount: 4 }] } },
    'GET /api/projects/7/flags': (req) => {
      const status = new URL(req.path, 'http://x').searchParams.get('status');
      const items = status ? flagList.filter((f) => status.split(',').includes(f.status)) : flagList;
      return { body: page(items) };
    },
    ...more,
  });
}

/** The query of the latest list request. */
const lastListQuery = (calls: StubRequest[]) => new URL(calls[calls.length - 1].path, 'http://x').searchParams;

describe('Flags screen', () => {
  it('reads the filters from the address (the API names) and sends them to the API as they are', async () => {
    const api = flagsApi(checker, 'checker');
    const { router } = renderApp('/projects/7/flags?status=open,answered&assignee=4&level=102&overdue=true&mark=L3&check=L%2F360%20live');
    const table = await screen.findByRole('table');
    await within(table).findByText('L3-B07 fails L/360 live (utilisation 1.24)');

    const q = lastListQuery(api.calls('GET /api/projects/7/flags'));
    expect(Object.fromEntries(q)).toEqual({
      status: 'open,answered',
      assignee: '4',
      level: '102',
      mark: 'L3',
      check: 'L/360 live',
      overdue: 'true',
      sort: '-updated',
      page: '1',
      pageSize: '50',
    });
    // The controls show the view of the address.
    const filters = screen.getByRole('search', { name: 'Flag filters' });
    expect(within(filters).getByText('Open')).toBeInTheDocument();
    expect(within(filters).getByText('Answered')).toBeInTheDocument();
    expect(await within(filters).findByText('Rafe Lindqvist')).toBeInTheDocument();
    expect(within(filters).getByText('L3')).toBeInTheDocument();
    expect(within(filters).getByRole('switch', { name: 'Overdue only' })).toBeChecked();
    expect(within(filters).getByLabelText('Mark contains')).toHaveValue('L3');
    expect(within(filters).getByText('L/360 live')).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/projects/7/flags');
  });

  it('writes each filter change to the address and asks the API again, from page 1', async () => {
    const api = flagsApi(checker, 'checker');
    const { router, user } = renderApp('/projects/7/flags?status=open&page=2');
    await screen.findByRole('table');

    await user.click(screen.getByRole('switch', { name: 'Overdue only' }));
    await waitFor(() => expect(router.state.location.search).toBe('?status=open&overdue=true'));
    await waitFor(() => expect(lastListQuery(api.calls('GET /api/projects/7/flags')).get('overdue')).toBe('true'));
    expect(lastListQuery(api.calls('GET /api/projects/7/flags')).get('page')).toBe('1');

    const mark = screen.getByLabelText('Mark contains');
    await user.type(mark, 'B07{Enter}');
    await waitFor(() => expect(router.state.location.search).toBe('?status=open&mark=B07&overdue=true'));

    await user.click(screen.getByRole('button', { name: 'Clear filters' }));
    await waitFor(() => expect(router.state.location.search).toBe(''));
    expect(Object.fromEntries(lastListQuery(api.calls('GET /api/projects/7/flags')))).toEqual({ sort: '-updated', page: '1', pageSize: '50' });
  });

  it('the board has a column per status, each with its own flags and count, and keeps the filters', async () => {
    const api = flagsApi(checker, 'checker');
    const { router, user } = renderApp('/projects/7/flags?assignee=4');
    await screen.findByRole('table');
    await user.click(screen.getByText('Board by status'));
    await waitFor(() => expect(router.state.location.search).toBe('?assignee=4&view=board'));

    const expected: Record<FlagStatus, string[]> = {
      open: ['L3-B07 fails L/360 live (utilisation 1.24)', 'L4-B02 fails L/360 live (utilisation 1.31)'],
      answered: ['L2-B11 fails L/240 total (utilisation 1.08)'],
      closed: ['L1-B03 needs a look'],
      waived: ['R-J22 fails L/240 total (utilisation 1.02)'],
    };
    for (const [status, titles] of Object.entries(expected)) {
      const label = status.charAt(0).toUpperCase() + status.slice(1);
      const column = await screen.findByRole('region', { name: `${label} flags` });
      for (const title of titles) expect(await within(column).findByRole('link', { name: title })).toBeInTheDocument();
      expect(within(column).getByText(`(${titles.length})`)).toBeInTheDocument();
    }
    const statuses = api.calls('GET /api/projects/7/flags').map((r) => new URL(r.path, 'http://x').searchParams).filter((p) => p.get('status'));
    expect(statuses.map((p) => p.get('status')).sort()).toEqual(['answered', 'closed', 'open', 'waived']);
    expect(statuses.every((p) => p.get('assignee') === '4')).toBe(true);
    // The overdue flag says so on its card.
    expect(within(screen.getByTestId('board-flag-16')).getByText(/overdue/)).toBeInTheDocument();
  });

  it('a manager assigns the selected flags in one request and sees what was done', async () => {
    setCsrfCookie('csrf-7');
    const api = flagsApi(manager, 'manager', {
      'POST /api/projects/7/flags/bulk-assign': { body: { updated: [flag({ id: 12 })], skipped: 1, skippedIds: [13] } },
    });
    const { user } = renderApp('/projects/7/flags');
    const table = await screen.findByRole('table');
    await within(table).findByText('L2-B11');
    await user.click(within(table).getByRole('checkbox', { name: 'Select flag 12 (L3-B07)' }));
    await user.click(within(table).getByRole('checkbox', { name: 'Select flag 13 (L2-B11)' }));
    // Closed and waived flags cannot be chosen.
    expect(within(table).getByRole('checkbox', { name: 'Select flag 14 (L1-B03)' })).toBeDisabled();

    await user.click(screen.getByRole('button', { name: /Assign 2 selected flags/ }));
    const dialog = await screen.findByRole('dialog');
    await user.click(within(dialog).getByRole('combobox', { name: 'Assignee' }));
    await user.click(await screen.findByTitle('Noor Achterberg'));
    await user.click(within(dialog).getByRole('button', { name: 'Assign' }));

    expect(await screen.findByText('1 flag updated; 1 flag skipped (closed, waived, or already so assigned).')).toBeInTheDocument();
    const [sent] = api.calls('POST /api/projects/7/flags/bulk-assign');
    expect(sent.body).toEqual({ flagIds: [12, 13], assigneeId: 6 });
    expect(sent.headers['x-csrf-token']).toBe('csrf-7');
  });

  it('shows a viewer the flags without any way to change them', async () => {
    flagsApi(viewer, 'viewer');
    renderApp('/projects/7/flags');
    const table = await screen.findByRole('table');
    await within(table).findByText('L3-B07');
    expect(within(table).queryByRole('checkbox')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Assign/ })).not.toBeInTheDocument();
  });
});
