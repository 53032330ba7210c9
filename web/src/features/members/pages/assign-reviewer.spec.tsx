import { act, screen, waitFor, within } from '@testing-library/react';
import type { FlagPerson, MemberRow, ProjectSummary, ReviewerAssignments } from '@sagline/common/api-types';
import { stubFetch, type StubRequest } from '@/testing/fetch-stub';
import { admin, checker, halvercote, manager } from '@/testing/fixtures';
import { renderApp } from '@/testing/render';
import { facets, memberDetail, memberRow, membersPage, revision1Ref, revisions } from './members-fixtures';

/**
 * Reviewer assignment per member (journey 3) on the Members and Member
 * screens: managers and admins only, on the latest revision; the screen shows
 * the new reviewer afterwards because it asks the server again.
 */
const ILSE: FlagPerson = { id: 3, name: 'Ilse Varga' };
const NOOR: FlagPerson = { id: 8, name: 'Noor Haddad' };
const assignments: ReviewerAssignments = {
  levels: [],
  members: [],
  candidates: [
    { ...ILSE, email: 'ilse.varga@halvercote.example' },
    { ...NOOR, email: 'noor.haddad@halvercote.example' },
  ],
};

type Role = ProjectSummary['myRole'];
const meOf = (role: Role) => (role === 'admin' ? admin : role === 'manager' ? manager : checker);

/**
 * A small server: three members whose reviewers the PUT really changes (a
 * member's own reviewer, else its level's, else the schedule's, as the API
 * does), so a list or member fetched after it shows the new reviewer and one
 * fetched before it does not.
 */
function reviewerServer(role: Role, { levelReviewer = null as FlagPerson | null } = {}) {
  const rows: MemberRow[] = [
    memberRow(),
    memberRow({ id: 9002, mark: 'L3-B13', grid: 'C/5-6', maxUtilization: 0.62, verdict: 'pass', requiredI: 50e-6, openFlagCount: 0 }),
    memberRow({ id: 9003, mark: 'L3-B14', grid: 'C/6-7', maxUtilization: 0.4, verdict: 'pass', requiredI: 40e-6, openFlagCount: 0 }),
  ];
  const people = [ILSE, NOOR];
  const own = new Map<string, FlagPerson>();
  const reviewerOf = (r: MemberRow) => own.get(r.mark) ?? levelReviewer ?? ILSE;
  const current = () => rows.map((r) => ({ ...r, reviewer: reviewerOf(r) }));
  const api = stubFetch({
    'GET /api/auth/me': { body: { user: meOf(role) } },
    'GET /api/projects/7': { body: halvercote(role) },
    'GET /api/projects/7/revisions': { body: revisions },
    'GET /api/projects/7/members/facets': { body: facets },
    'GET /api/projects/7/reviewer-assignments': () => ({
      body: {
        ...assignments,
        levels: [{ level: { id: 102, name: 'L3' }, reviewer: levelReviewer }],
        members: [...own].map(([mark, reviewer]) => ({ mark, reviewer })),
      } satisfies ReviewerAssignments,
    }),
    'GET /api/projects/7/overview': { body: {} },
    'GET /api/projects/7/flags': { body: { items: [], total: 0, page: 1, pageSize: 200 } },
    'GET /api/projects/7/members': (req) => {
      const reviewer = new URL(req.path, 'http://x').searchParams.get('reviewer');
      const items = current().filter((r) => !reviewer || String(r.reviewer.id) === reviewer);
      return { body: membersPage(items, { total: items.length }) };
    },
    'GET /api/projects/7/members/:mark': (_req, { mark }) => {
      const detail = memberDetail();
      const row = current().find((r) => r.mark === decodeURIComponent(mark))!;
      return { body: { ...detail, member: { ...detail.member, reviewer: row.reviewer } } };
    },
    'PUT /api/projects/7/reviewer-assignments/members': (req: StubRequest) => {
      const { marks, reviewerId } = req.body as { marks: string[]; reviewerId: number | null };
      const reviewer = people.find((p) => p.id === reviewerId) ?? null;
      for (const mark of marks) {
        if (reviewer) own.set(mark, reviewer);
        else own.delete(mark);
      }
      return { body: { marks, reviewer } };
    },
  });
  return api;
}

const reviewerCell = (table: HTMLElement, mark: string) => {
  const row = within(table).getByText(mark).closest('tr') as HTMLElement;
  const headers = within(table).getAllByRole('columnheader').map((h) => h.textContent);
  return within(row).getAllByRole('cell')[headers.indexOf('Reviewer')];
};

async function chooseReviewer(user: ReturnType<typeof renderApp>['user'], label: string, name: string) {
  await user.click(await screen.findByRole('combobox', { name: label }));
  await waitFor(() => expect(document.querySelector(`.ant-select-item-option[title="${name}"]`)).not.toBeNull());
  await user.click(document.querySelector(`.ant-select-item-option[title="${name}"]`) as HTMLElement);
  await user.click(screen.getByRole('button', { name: 'Assign' }));
}

const listCalls = (api: ReturnType<typeof stubFetch>) => api.calls('GET /api/projects/7/members');

describe('Members: a manager assigns a reviewer to the selected members', () => {
  beforeEach(() => window.localStorage.clear());

  it('sends the marks of the selected rows, then the table shows the new reviewer', async () => {
    const api = reviewerServer('manager');
    const { user } = renderApp('/projects/7/members');
    // The first render of the file loads the lazy routes cold.
    const table = await screen.findByRole('table', { name: 'Members' }, { timeout: 12000 });
    await within(table).findByText('L3-B14');
    expect(reviewerCell(table, 'L3-B13')).toHaveTextContent('Ilse Varga');

    // Nothing selected yet: the button says what it needs.
    expect(screen.getByRole('button', { name: /Assign reviewer to selected members/ })).toBeDisabled();
    await user.click(within(table).getByRole('checkbox', { name: 'Select L3-B13' }));
    await user.click(within(table).getByRole('checkbox', { name: 'Select L3-B14' }));
    const before = listCalls(api).length;
    await user.click(screen.getByRole('button', { name: /Assign reviewer to 2 selected members/ }));
    await chooseReviewer(user, 'Reviewer of 2 members', 'Noor Haddad');

    expect(await screen.findByText('Noor Haddad now reviews 2 members.')).toBeInTheDocument();
    const [put] = api.calls('PUT /api/projects/7/reviewer-assignments/members');
    expect(put.body).toEqual({ marks: ['L3-B13', 'L3-B14'], reviewerId: 8 });
    // The list is asked again and shows it; the selection is cleared.
    await waitFor(() => expect(reviewerCell(table, 'L3-B13')).toHaveTextContent('Noor Haddad'));
    expect(listCalls(api).length).toBeGreaterThan(before);
    expect(reviewerCell(table, 'L3-B14')).toHaveTextContent('Noor Haddad');
    expect(reviewerCell(table, 'L3-B12')).toHaveTextContent('Ilse Varga');
    expect(within(table).getByRole('checkbox', { name: 'Select L3-B13' })).not.toBeChecked();
    expect(screen.getByRole('button', { name: /Assign reviewer to selected members/ })).toBeDisabled();
  });

  it('an admin assigns too; filtered by the new reviewer, the list holds the member just assigned', async () => {
    reviewerServer('admin');
    const { user, router } = renderApp('/projects/7/members');
    const table = await screen.findByRole('table', { name: 'Members' });
    await user.click(await within(table).findByRole('checkbox', { name: 'Select L3-B13' }));
    await user.click(screen.getByRole('button', { name: /Assign reviewer to 1 selected member$/ }));
    await chooseReviewer(user, 'Reviewer of L3-B13', 'Noor Haddad');
    expect(await screen.findByText('Noor Haddad now reviews L3-B13.')).toBeInTheDocument();

    await act(() => router.navigate('/projects/7/members?reviewer=8'));
    await waitFor(() => expect(within(table).queryByText('L3-B12')).not.toBeInTheDocument());
    expect(within(table).getByText('L3-B13')).toBeInTheDocument();
    expect(reviewerCell(table, 'L3-B13')).toHaveTextContent('Noor Haddad');
  });

  it('a new filter clears the selection', async () => {
    reviewerServer('manager');
    const { user, router } = renderApp('/projects/7/members');
    const table = await screen.findByRole('table', { name: 'Members' });
    await user.click(await within(table).findByRole('checkbox', { name: 'Select L3-B12' }));
    expect(screen.getByRole('button', { name: /Assign reviewer to 1 selected member$/ })).toBeEnabled();
    await act(() => router.navigate('/projects/7/members?verdict=fail'));
    await waitFor(() => expect(screen.getByRole('button', { name: /Assign reviewer to selected members/ })).toBeDisabled());
  });

  it.each([['a checker', 'checker'], ['a viewer', 'viewer'], ['an engineer', 'engineer']] as const)('%s sees no selection and no assign button', async (_who, role) => {
    reviewerServer(role);
    renderApp('/projects/7/members');
    const table = await screen.findByRole('table', { name: 'Members' });
    await within(table).findByText('L3-B12');
    expect(screen.queryByRole('button', { name: /Assign reviewer/ })).not.toBeInTheDocument();
    expect(within(table).queryByRole('checkbox')).not.toBeInTheDocument();
  });

  it('an earlier revision offers no assignment (the API takes the latest marks)', async () => {
    reviewerServer('manager');
    renderApp(`/projects/7/members?revision=${revision1Ref.id}`);
    const table = await screen.findByRole('table', { name: 'Members' });
    await within(table).findByText('L3-B12');
    expect(screen.queryByRole('button', { name: /Assign reviewer/ })).not.toBeInTheDocument();
  });
});

describe('Member: a manager assigns its reviewer', () => {
  const reviewerFact = () => {
    const label = screen.getAllByText('Reviewer').find((el) => el.classList.contains('ant-descriptions-item-label'))!;
    return label.nextElementSibling as HTMLElement;
  };

  it.each([['a manager', 'manager'], ['an admin', 'admin']] as const)('%s assigns one; the page asks again and shows the new reviewer', async (_who, role) => {
    const api = reviewerServer(role);
    const { user } = renderApp('/projects/7/members/L3-B12');
    expect(await screen.findByRole('heading', { name: 'L3-B12' })).toBeInTheDocument();
    await waitFor(() => expect(reviewerFact()).toHaveTextContent('Ilse Varga (from the schedule)'));
    const fetchedBefore = api.calls('GET /api/projects/7/members/:mark').length;

    await user.click(screen.getByRole('button', { name: /Assign reviewer/ }));
    await chooseReviewer(user, 'Reviewer of L3-B12', 'Noor Haddad');

    expect(await screen.findByText('Noor Haddad now reviews L3-B12.')).toBeInTheDocument();
    expect(api.calls('PUT /api/projects/7/reviewer-assignments/members')[0].body).toEqual({ marks: ['L3-B12'], reviewerId: 8 });
    await waitFor(() => expect(reviewerFact()).toHaveTextContent('Noor Haddad (its own assignment)'));
    expect(api.calls('GET /api/projects/7/members/:mark').length).toBeGreaterThan(fetchedBefore);
  });

  it('the dialogue opens on the member’s own reviewer; handed back, the member shows its level’s', async () => {
    const api = reviewerServer('manager', { levelReviewer: ILSE });
    const { user } = renderApp('/projects/7/members/L3-B12');
    await screen.findByRole('heading', { name: 'L3-B12' });
    await waitFor(() => expect(reviewerFact()).toHaveTextContent('Ilse Varga (assigned to L3)'));

    await user.click(screen.getByRole('button', { name: /Assign reviewer/ }));
    await chooseReviewer(user, 'Reviewer of L3-B12', 'Noor Haddad');
    await waitFor(() => expect(reviewerFact()).toHaveTextContent('Noor Haddad (its own assignment)'));

    // Open again: the dialogue shows the member's own reviewer; the first choice takes it away.
    await user.click(screen.getByRole('button', { name: /Assign reviewer/ }));
    const select = (await screen.findByRole('combobox', { name: 'Reviewer of L3-B12' })).closest('.ant-select') as HTMLElement;
    await waitFor(() => expect(select).toHaveTextContent('Noor Haddad'));
    await chooseReviewer(user, 'Reviewer of L3-B12', 'Their level’s or the schedule’s reviewer');
    expect(await screen.findByText("L3-B12 follows the level's or the schedule's reviewer again.")).toBeInTheDocument();
    expect(api.calls('PUT /api/projects/7/reviewer-assignments/members').map((c) => c.body)).toEqual([
      { marks: ['L3-B12'], reviewerId: 8 },
      { marks: ['L3-B12'], reviewerId: null },
    ]);
    await waitFor(() => expect(reviewerFact()).toHaveTextContent('Ilse Varga (assigned to L3)'));
  });

  it.each(['checker', 'viewer'] as const)('a %s sees the reviewer but no assign button', async (role) => {
    const api = reviewerServer(role);
    renderApp('/projects/7/members/L3-B12');
    await screen.findByRole('heading', { name: 'L3-B12' });
    expect(reviewerFact()).toHaveTextContent(/^Ilse Varga$/);
    expect(api.calls('GET /api/projects/7/reviewer-assignments')).toHaveLength(0);
    expect(screen.queryByRole('button', { name: /Assign reviewer/ })).not.toBeInTheDocument();
  });
});
