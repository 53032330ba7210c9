import { screen, waitFor, within } from '@testing-library/react';
import { apiError, stubFetch, type StubRoutes } from '@/testing/fetch-stub';
import { checker, halvercote } from '@/testing/fixtures';
import { renderApp } from '@/testing/render';
import { memberDetail, report, results } from './members-fixtures';

function memberApi(more: StubRoutes = {}) {
  return stubFetch({
    'GET /api/auth/me': { body: { user: checker } },
    'GET /api/projects/7': { body: halvercote('checker') },
    'GET /api/projects/7/members/:mark': { body: memberDetail() },
    'GET /api/projects/7/flags': { body: { items: [], total: 0, page: 1, pageSize: 200 } },
    ...more,
  });
}

/** "−12.34 mm" → -12.34 */
const mm = (text: string) => Number(text.replace('−', '-').replace(/[^\d.+-]/g, ''));

/** The rows of the contributions table (not the summary rows). */
function contributionRows(table: HTMLElement) {
  return within(table)
    .getAllByRole('row')
    .filter((r) => r.closest('tbody') && r.classList.contains('ant-table-row'));
}

describe('Member: the calculation explained', () => {
  it('shows each load’s signed contribution at the governing point, summing to the deflection of the checks table', async () => {
    const api = memberApi();
    const { user } = renderApp('/projects/7/members/L3-B12');

    expect(await screen.findByRole('heading', { name: 'L3-B12' })).toBeInTheDocument();
    expect(api.calls('GET /api/projects/7/members/:mark')[0].path).toBe('/api/projects/7/members/L3-B12');

    // Governing: L/360 under live load (the dead load is not in it).
    const governing = results.reduce((a, b) => (b.utilization > a.utilization ? b : a));
    expect(governing.checkName).toBe('L/360 live');
    expect(governing.pass).toBe(false);
    const contributions = await screen.findByRole('table', { name: 'Contributions' });
    const rows = contributionRows(contributions);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toHaveTextContent('#2');
    expect(rows[0]).toHaveTextContent('uniform 7.00 kN/m from 0.00 m to 7.20 m');
    expect(rows[1]).toHaveTextContent('#3');
    expect(rows[1]).toHaveTextContent('point 20.0 kN at 2.40 m');

    // Signed (down is negative), summed like a hand calculation.
    const shares = rows.map((r) => mm(within(r).getAllByRole('cell')[5].textContent ?? ''));
    expect(shares.every((s) => s < 0)).toBe(true);
    const sumRow = within(contributions).getByTestId('contributions-sum');
    const checkRow = within(contributions).getByTestId('contributions-check');
    const sumText = within(sumRow).getAllByRole('cell')[1].textContent!;
    const checkText = within(checkRow).getAllByRole('cell')[1].textContent!;
    // The printed lines add up to the printed sum, give or take the last digit, which the table then explains.
    const added = Math.round((shares[0] + shares[1]) * 100) / 100;
    expect(Math.abs(mm(sumText) - added)).toBeLessThanOrEqual(0.010001);
    if (mm(sumText) !== added) expect(within(contributions).getByText(/Each line is rounded to 0\.01 mm/)).toBeInTheDocument();
    expect(sumText).toBe(checkText);
    expect(checkRow).toHaveTextContent('equal');
    // The engine's extreme, in mm with two decimals.
    const extreme = report.combinations.L.segments[0].extreme.deflection * 1000;
    expect(mm(sumText)).toBeCloseTo(extreme, 2);

    // The checks table shows the same number on the governing row.
    const checks = screen.getByRole('table', { name: 'Checks' });
    const liveRow = within(checks).getByText('L/360 live').closest('tr') as HTMLElement;
    expect(liveRow).toHaveTextContent(checkText);
    expect(liveRow).toHaveTextContent('(governing)');
    expect(within(liveRow).getByTestId('limit-source')).toHaveTextContent('IBC 2021, Table 1604.3 (from memory)');
    expect(within(liveRow).getByText('Fail')).toBeInTheDocument();

    // Another check: D+L, three loads, again summing to its row.
    await user.click(within(checks).getByRole('button', { name: 'Contributions of L/240 total, D+L, span 1' }));
    await waitFor(() => expect(contributionRows(screen.getByRole('table', { name: 'Contributions' }))).toHaveLength(3));
    const table2 = screen.getByRole('table', { name: 'Contributions' });
    const shares2 = contributionRows(table2).map((r) => mm(within(r).getAllByRole('cell')[5].textContent ?? ''));
    const sum2 = within(within(table2).getByTestId('contributions-sum')).getAllByRole('cell')[1].textContent!;
    const check2 = within(within(table2).getByTestId('contributions-check')).getAllByRole('cell')[1].textContent!;
    expect(sum2).toBe(check2);
    expect(mm(sum2)).toBeCloseTo(shares2.reduce((a, b) => a + b, 0), 1);
    expect(within(table2).getByTestId('contributions-check')).toHaveTextContent('equal');
  });

  it('draws the member with its curves, and shows its facts, history, flags and the caution', async () => {
    memberApi();
    renderApp('/projects/7/members/L3-B12');
    const drawing = await screen.findByTestId('beam-drawing');
    expect(drawing.querySelectorAll('[data-testid="support"]')).toHaveLength(2);
    expect(drawing.querySelectorAll('[data-testid="elastic-curve"]')).toHaveLength(2);
    expect(within(drawing).getByTestId('curve-scale').textContent).toMatch(/deflection × \d/);

    expect(screen.getByText('W310x39')).toBeInTheDocument();
    expect(screen.getByText('Members sheet, row 58')).toBeInTheDocument();

    const history = screen.getByRole('table', { name: 'History across revisions' });
    expect(within(history).getByText('Loads L: 7.00 kN/m → 7.00 kN/m, 20.0 kN at 2.40 m')).toBeInTheDocument();
    expect(within(history).getByRole('link', { name: 'Revision 1, Rev A, scheme design' })).toHaveAttribute(
      'href',
      '/projects/7/members/L3-B12?revision=31',
    );

    expect(await screen.findByText('No flag on L3-B12 yet.')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: /Raise flag/ })).toBeInTheDocument();
    expect(screen.getAllByText(/does not replace the engineer of record's judgement or the local building code/).length).toBeGreaterThan(0);
  });

  it('opens an earlier revision from the address and says it is not the current one', async () => {
    const api = memberApi({
      'GET /api/projects/7/members/:mark': () => ({ body: { ...memberDetail(), isLatest: false, revision: memberDetail().history[0].revision } }),
    });
    renderApp('/projects/7/members/L3-B12?revision=31');
    expect(await screen.findByText('This is L3-B12 as it was in revision 1.')).toBeInTheDocument();
    expect(api.calls('GET /api/projects/7/members/:mark')[0].path).toBe('/api/projects/7/members/L3-B12?revision=31');
  });

  it('says so when the mark is not in the revision', async () => {
    memberApi({
      'GET /api/projects/7/members/:mark': apiError(404, 'NOT_FOUND', 'There is no member "L9-X1" in revision 2; the Members screen lists the marks of each revision.'),
    });
    renderApp('/projects/7/members/L9-X1');
    expect(await screen.findByText('L9-X1 not found')).toBeInTheDocument();
    expect(screen.getByText(/There is no member "L9-X1" in revision 2/)).toBeInTheDocument();
  });

  it('says so when no check applies: no governing point, nothing to sum', async () => {
    const detail = memberDetail();
    memberApi({
      'GET /api/projects/7/members/:mark': {
        body: {
          ...detail,
          member: { ...detail.member, verdict: null, maxUtilization: null, requiredI: null, governingCheck: null },
          beamInput: { ...detail.beamInput, checks: [] },
          report: { ...detail.report, checks: [] },
          results: [],
          rules: [],
        },
      },
    });
    renderApp('/projects/7/members/L3-B12');
    expect(await screen.findByText('No check applies to this member, so there is no governing point.')).toBeInTheDocument();
    expect(screen.getByText('No check of the limit set applies to this member (its category, material or loads).')).toBeInTheDocument();
    expect(screen.getAllByText('No check').length).toBeGreaterThan(0);
    expect(screen.queryByRole('table', { name: 'Contributions' })).not.toBeInTheDocument();
  });
});
