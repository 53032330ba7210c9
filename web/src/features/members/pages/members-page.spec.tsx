import { screen, waitFor, within } from '@testing-library/react';
import { stubFetch, type StubRoutes } from '@/testing/fetch-stub';
import { checker, halvercote } from '@/testing/fixtures';
import { renderApp } from '@/testing/render';
import { facets, memberRow, membersPage, revision1Ref, revisions } from './members-fixtures';

const rows = [
  memberRow(),
  memberRow({ id: 9002, mark: 'L3-B13', grid: 'C/5-6', maxUtilization: 0.62, verdict: 'pass', requiredI: 50e-6, openFlagCount: 0 }),
];

function membersApi(more: StubRoutes = {}, role: Parameters<typeof halvercote>[0] = 'checker') {
  return stubFetch({
    'GET /api/auth/me': { body: { user: checker } },
    'GET /api/projects/7': { body: halvercote(role) },
    'GET /api/projects/7/revisions': { body: revisions },
    'GET /api/projects/7/members/facets': { body: facets },
    'GET /api/projects/7/members': (req) => {
      const q = new URL(req.path, 'http://x').searchParams;
      // The one-row count of failing members (for the bulk raise).
      if (q.get('pageSize') === '1') return { body: membersPage([rows[0]], { total: 4, pageSize: 1 }) };
      return { body: membersPage(rows, { total: 2 }) };
    },
    ...more,
  });
}

/** The list requests of the table (not the one-row failing count). */
const listCalls = (api: ReturnType<typeof stubFetch>) =>
  api.calls('GET /api/projects/7/members').filter((r) => new URL(r.path, 'http://x').searchParams.get('pageSize') !== '1');

const lastListQuery = (api: ReturnType<typeof stubFetch>) => {
  const calls = listCalls(api);
  return calls.length ? calls[calls.length - 1].path.split('?')[1] ?? '' : null;
};

/** The chosen values an antd multiple select shows as tags. */
const chosen = (label: string) => {
  const select = screen.getByRole('combobox', { name: label }).closest('.ant-select') as HTMLElement;
  return [...select.querySelectorAll('.ant-select-selection-item')].map((el) => el.textContent);
};

async function pick(user: ReturnType<typeof renderApp>['user'], label: string, option: string) {
  await user.click(screen.getByRole('combobox', { name: label }));
  const item = await waitFor(() => {
    const found = [...document.querySelectorAll<HTMLElement>('.ant-select-item-option')].find((el) => el.getAttribute('title') === option);
    if (!found) throw new Error(`no option ${option}`);
    return found;
  });
  await user.click(item);
  await user.keyboard('{Escape}');
}

describe('Members: filters live in the URL', () => {
  beforeEach(() => window.localStorage.clear());

  it('opens a shared address with its filters applied and sends the same parameters to the API', async () => {
    const check = 'L/240 total, D+L';
    const search =
      `?level=102&verdict=fail&check=${encodeURIComponent(check)}&utilMin=1&utilMax=2.5&q=B1&sort=-utilization&page=2`;
    const api = membersApi({
      'GET /api/projects/7/members': { body: membersPage(rows, { total: 120, page: 2 }) },
    });
    renderApp(`/projects/7/members${search}`);

    const table = await screen.findByRole('table', { name: 'Members' });
    expect(await within(table).findByText('L3-B12')).toBeInTheDocument();

    // The API got the very same parameters (same names, check not split at its comma).
    await waitFor(() => expect(lastListQuery(api)).not.toBeNull());
    const sent = new URLSearchParams(lastListQuery(api)!);
    expect(sent.get('level')).toBe('102');
    expect(sent.get('verdict')).toBe('fail');
    expect(sent.getAll('check')).toEqual([check]);
    expect(sent.get('utilMin')).toBe('1');
    expect(sent.get('utilMax')).toBe('2.5');
    expect(sent.get('q')).toBe('B1');
    expect(sent.get('sort')).toBe('-utilization');
    expect(sent.get('page')).toBe('2');

    // And the screen shows them set.
    await waitFor(() => expect(chosen('Level')).toEqual(['L3 · 70 (4 failing)']));
    expect(chosen('Fails check')).toEqual([`${check} · 5 failing`]);
    expect(screen.getByRole('button', { name: /Failing only/ })).toHaveAttribute('aria-pressed', 'true');
    expect(screen.getByRole('searchbox', { name: 'Mark or grid contains' })).toHaveValue('B1');
    expect(screen.getByRole('spinbutton', { name: 'Utilisation from' })).toHaveValue('1.0');
    expect(screen.getByRole('spinbutton', { name: 'Utilisation to' })).toHaveValue('2.5');
    expect(within(table).getByRole('columnheader', { name: /Utilisation/ })).toHaveAttribute('aria-sort', 'descending');
    expect(screen.getByRole('listitem', { name: '2' })).toHaveClass('ant-pagination-item-active');
    expect(screen.getByText('match the filters', { exact: false })).toHaveTextContent('120 match the filters');
  });

  it('writes each filter change into the URL, back to page 1, and loads that view', async () => {
    const api = membersApi();
    const { user, router } = renderApp('/projects/7/members?page=3');
    const table = await screen.findByRole('table', { name: 'Members' });
    await within(table).findByText('L3-B12');
    const search = () => new URLSearchParams(router.state.location.search);

    // "Failing only" is one click.
    await user.click(screen.getByRole('button', { name: /Failing only \(15\)/ }));
    await waitFor(() => expect(search().get('verdict')).toBe('fail'));
    expect(search().get('page')).toBeNull();
    await waitFor(() => expect(lastListQuery(api)).toBe('verdict=fail'));

    // A level from the facets.
    await pick(user, 'Level', 'L3 · 70 (4 failing)');
    await waitFor(() => expect(search().get('level')).toBe('102'));
    await waitFor(() => expect(lastListQuery(api)).toBe('level=102&verdict=fail'));

    // A check name with a comma stays one value.
    await pick(user, 'Fails check', 'L/240 total, D+L · 5 failing');
    await waitFor(() => expect(search().getAll('check')).toEqual(['L/240 total, D+L']));

    // Text on mark or grid.
    await user.type(screen.getByRole('searchbox', { name: 'Mark or grid contains' }), 'B1{Enter}');
    await waitFor(() => expect(search().get('q')).toBe('B1'));

    // Utilisation range, applied on Enter.
    await user.type(screen.getByRole('spinbutton', { name: 'Utilisation from' }), '0.9{Enter}');
    await waitFor(() => expect(search().get('utilMin')).toBe('0.9'));

    // Sort by utilisation: the first click sorts the worst first.
    await user.click(within(table).getByRole('columnheader', { name: /Utilisation/ }));
    await waitFor(() => expect(search().get('sort')).toBe('-utilization'));
    await waitFor(() =>
      expect(lastListQuery(api)).toBe(
        `level=102&verdict=fail&check=${encodeURIComponent('L/240 total, D+L').replace(/%20/g, '+')}&utilMin=0.9&q=B1&sort=-utilization`,
      ),
    );

    // "Failing only" again: off.
    await user.click(screen.getByRole('button', { name: /Failing only/ }));
    await waitFor(() => expect(search().get('verdict')).toBeNull());
    expect(search().get('level')).toBe('102');

    // Clear filters keeps the sort.
    await user.click(screen.getByRole('button', { name: /Clear filters/ }));
    await waitFor(() => expect(router.state.location.search).toBe('?sort=-utilization'));
  });

  it('pages on the server: the next page is a new request and a new address', async () => {
    const api = membersApi({
      'GET /api/projects/7/members': (req) => {
        const q = new URL(req.path, 'http://x').searchParams;
        if (q.get('pageSize') === '1') return { body: membersPage([rows[0]], { total: 4, pageSize: 1 }) };
        const page = Number(q.get('page') ?? 1);
        return { body: membersPage([memberRow({ id: 100 + page, mark: `L1-J${page}` })], { total: 10_000, page }) };
      },
    });
    const { user, router } = renderApp('/projects/7/members');
    const table = await screen.findByRole('table', { name: 'Members' });
    await within(table).findByText('L1-J1');
    expect(screen.getByText('1–50 of 10,000')).toBeInTheDocument();
    await user.click(screen.getByRole('listitem', { name: '2' }));
    await waitFor(() => expect(router.state.location.search).toBe('?page=2'));
    expect(await within(table).findByText('L1-J2')).toBeInTheDocument();
    expect(lastListQuery(api)).toBe('page=2');
  });

  it('links each mark to its member page, offers the results workbook of the shown revision, and lets columns be chosen', async () => {
    membersApi();
    const { user, router } = renderApp('/projects/7/members?level=102');
    const table = await screen.findByRole('table', { name: 'Members' });
    await within(table).findByText('L3-B12');

    const workbook = screen.getByRole('link', { name: 'Results workbook of revision 2' });
    expect(workbook).toHaveAttribute('href', '/api/projects/7/revisions/32/results.xlsx');

    // Verdicts and utilisation as a bar with words.
    const row = within(table).getByText('L3-B12').closest('tr') as HTMLElement;
    expect(within(row).getByText('Fail')).toBeInTheDocument();
    expect(within(row).getByRole('img', { name: 'utilisation 1.24, over the limit' })).toBeInTheDocument();
    expect(within(row).getByText('7.20 m')).toBeInTheDocument();

    // Column chooser: Grid off, Material on; kept for the next visit.
    expect(within(table).getByRole('columnheader', { name: 'Grid' })).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: /Columns/ }));
    await user.click(await screen.findByRole('checkbox', { name: 'Grid' }));
    await user.click(screen.getByRole('checkbox', { name: 'Material' }));
    await waitFor(() => expect(within(table).queryByRole('columnheader', { name: 'Grid' })).not.toBeInTheDocument());
    expect(within(table).getByRole('columnheader', { name: 'Material' })).toBeInTheDocument();
    expect(JSON.parse(window.localStorage.getItem('sagline.members.columns')!)).toContain('material');

    expect(within(row).getByRole('link', { name: 'L3-B12' })).toHaveAttribute('href', '/projects/7/members/L3-B12');
    await user.click(within(row).getByRole('link', { name: 'L3-B12' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/projects/7/members/L3-B12'));
    expect(router.state.location.state).toEqual({ from: '/projects/7/members?level=102' });
  });

  it('shows an earlier revision from the address: its members, its facets and its results workbook', async () => {
    const api = membersApi({
      'GET /api/projects/7/members': (req) => {
        const q = new URL(req.path, 'http://x').searchParams;
        return { body: membersPage(rows, { revision: q.get('revision') === '31' ? revision1Ref : revisions[0] }) };
      },
    });
    const { user, router } = renderApp('/projects/7/members?verdict=fail');
    const table = await screen.findByRole('table', { name: 'Members' });
    await within(table).findByText('L3-B12');
    expect(await screen.findByRole('link', { name: 'Results workbook of revision 2' })).toBeInTheDocument();

    await pick(user, 'Revision', 'Revision 1, Rev A, scheme design');
    await waitFor(() => expect(router.state.location.search).toBe('?revision=31&verdict=fail'));
    await waitFor(() => expect(lastListQuery(api)).toBe('revision=31&verdict=fail'));
    expect(api.calls('GET /api/projects/7/members/facets').some((r) => r.path.endsWith('?revision=31'))).toBe(true);
    expect(await screen.findByRole('link', { name: 'Results workbook of revision 1' })).toHaveAttribute(
      'href',
      '/api/projects/7/revisions/31/results.xlsx',
    );
    // Flags are raised on the latest revision only: no bulk raise on an earlier one.
    expect(screen.queryByRole('button', { name: /Raise flags for/ })).not.toBeInTheDocument();
    // The members open as they were in that revision.
    expect(within(table).getByRole('link', { name: 'L3-B12' })).toHaveAttribute('href', '/projects/7/members/L3-B12?revision=31');
  });

  it('offers checkers the bulk raise for the failing members of the filter, counted by the server', async () => {
    const api = membersApi();
    renderApp('/projects/7/members?level=102');
    expect(await screen.findByRole('button', { name: /Raise flags for 4 failing members/ })).toBeInTheDocument();
    const count = api.calls('GET /api/projects/7/members').find((r) => r.path.includes('pageSize=1'))!;
    expect(new URLSearchParams(count.path.split('?')[1]).get('level')).toBe('102');
    expect(new URLSearchParams(count.path.split('?')[1]).get('verdict')).toBe('fail');
  });

  it('shows viewers the list without the bulk raise', async () => {
    const api = membersApi({}, 'viewer');
    renderApp('/projects/7/members');
    const table = await screen.findByRole('table', { name: 'Members' });
    await within(table).findByText('L3-B12');
    expect(screen.queryByRole('button', { name: /Raise flags for/ })).not.toBeInTheDocument();
    expect(api.calls('GET /api/projects/7/members').some((r) => r.path.includes('pageSize=1'))).toBe(false);
  });

  it('writes lengths and inertias in the project’s units (US customary here)', async () => {
    membersApi({ 'GET /api/projects/7': { body: { ...halvercote('checker'), unitSystem: 'US' } } });
    renderApp('/projects/7/members');
    const table = await screen.findByRole('table', { name: 'Members' });
    const row = (await within(table).findByText('L3-B12')).closest('tr') as HTMLElement;
    // 7.2 m = 23.62 ft; I required 1.24 × 86.9 ×10⁶ mm⁴ = 107.8 ×10⁶ mm⁴ = 259 in⁴.
    expect(within(row).getByText('23.6 ft')).toBeInTheDocument();
    expect(within(row).getByText('259 in⁴')).toBeInTheDocument();
  });
});
