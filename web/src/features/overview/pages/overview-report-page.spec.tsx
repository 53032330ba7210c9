import { screen, within } from '@testing-library/react';
import type { FlagsOverTime, ProjectOverview } from '@sagline/common/api-types';
import { stubFetch } from '@/testing/fetch-stub';
import { manager } from '@/testing/fixtures';
import { renderApp } from '@/testing/render';

const counts = { members: 4, pass: 2, fail: 2, unchecked: 0, flagsOpen: 0, flagsAnswered: 0, flagsClosed: 3, flagsWaived: 0, flagsTotal: 3, percentClosed: 100, overdue: 0 };
const overview: ProjectOverview = {
  project: { id: 7, name: 'Halvercote Yard', number: 'HY-2041' },
  latestRevision: { id: 31, number: 3, label: null, createdAt: '2026-12-02T09:30:00.000Z', uploadedBy: null, fileName: 'rev-c.xlsx', memberCount: 4, diff: null },
  totals: counts,
  levels: [
    {
      level: { id: 100, name: 'L1' }, ...counts, assignedReviewer: { id: 3, name: 'Ilse Varga' },
      signOff: {
        id: 1, level: { id: 100, name: 'L1' }, state: 'signed', signedBy: { id: 3, name: 'Ilse Varga' }, signedAt: '2026-12-02T10:00:00.000Z', revisionNumber: 3,
        comment: null, voidedAt: null, voidedInRevisionNumber: null, voidedBy: null, voidReason: null,
      },
    },
  ],
  reviewers: [{ reviewer: { id: 3, name: 'Ilse Varga', email: 'ilse.varga@halvercote.example' }, present: true, ...counts }],
  today: '2026-12-02',
};
const series: FlagsOverTime = { from: '2026-12-02', to: '2026-12-02', points: [{ day: '2026-12-02', open: 0, answered: 0, closed: 3, waived: 0, raised: 3 }] };

describe('Printable status report', () => {
  it('prints the server counts in plain tables, with sign-offs, the chart and the caution, without the app chrome', async () => {
    stubFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/projects/7/overview': { body: overview },
      'GET /api/projects/7/overview/flags-over-time': { body: series },
    });
    renderApp('/projects/7/overview/report');
    const report = await screen.findByRole('main', { name: 'Status report' });
    expect(within(report).getByRole('heading', { name: 'Status report: Halvercote Yard (HY-2041)' })).toBeInTheDocument();
    const row = within(within(report).getByRole('table', { name: 'Per level' })).getByRole('row', { name: /^L1/ });
    expect(row).toHaveTextContent('L1Ilse Varga42230030100 %0Signed off by Ilse Varga, 2 Dec 2026, 10:00 (revision 3)');
    expect(within(report).getByRole('table', { name: 'Per level' })).toHaveTextContent('All levels');
    expect(await within(report).findByRole('img', { name: /^Flags over time\. On 2 Dec: 0 open, 0 answered, 3 closed, 0 waived\./ })).toBeInTheDocument();
    expect(within(report).getByText(/does not replace the engineer of record's judgement/)).toBeInTheDocument();
    expect(within(report).getByRole('button', { name: /Print or save as PDF/ })).toBeInTheDocument();
    // No top bar or project navigation on paper.
    expect(screen.queryByRole('navigation')).not.toBeInTheDocument();
    expect(document.title).toBe('Status report: Halvercote Yard (HY-2041)');
  });
});
