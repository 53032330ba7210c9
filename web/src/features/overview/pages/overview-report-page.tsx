import { useEffect } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Button } from 'antd';
import { PrinterOutlined } from '@ant-design/icons';
import type { OverviewCounts } from '@sagline/common/api-types';
import { paths } from '@/app/paths';
import { CAUTION_TEXT } from '@/components/caution-note';
import { LoadError } from '@/components/load-error';
import { PageLoading } from '@/components/page-loading';
import { formatDateTime } from '@/lib/format';
import { useFlagsOverTime } from '../api/get-flags-over-time';
import { useOverview } from '../api/get-overview';
import { FlagsChart } from '../components/flags-chart';
import { revisionText } from '../components/latest-revision';
import { levelName, percentText, reviewerName, signOffText } from '../components/overview-labels';
import './overview-report.css';

const COUNT_HEADS = ['Members', 'Passing', 'Failing', 'Flags', 'Open', 'Answered', 'Closed', 'Waived', '% closed', 'Overdue'];

function CountCells({ c }: { c: OverviewCounts }) {
  return (
    <>
      <td>{c.members}</td>
      <td>{c.pass}</td>
      <td className={c.fail ? 'fail' : undefined}>{c.fail}</td>
      <td>{c.flagsTotal}</td>
      <td>{c.flagsOpen}</td>
      <td>{c.flagsAnswered}</td>
      <td>{c.flagsClosed}</td>
      <td>{c.flagsWaived}</td>
      <td>{percentText(c.percentClosed)}</td>
      <td className={c.overdue ? 'fail' : undefined}>{c.overdue}</td>
    </>
  );
}

/**
 * The overview as a status report to print (or save as PDF from the print
 * dialogue): the same server counts as the Overview screen, in plain tables,
 * with the chart, the sign-offs and the caution. No app chrome, no external
 * assets; print CSS in overview-report.css (A4 landscape).
 */
export function OverviewReportPage() {
  const { projectId = '' } = useParams();
  const overview = useOverview(projectId);
  const series = useFlagsOverTime(projectId, 90);
  const o = overview.data;

  useEffect(() => {
    if (o) document.title = `Status report: ${o.project.name} (${o.project.number})`;
  }, [o]);

  if (overview.error && !o) return <div style={{ padding: 24 }}><LoadError error={overview.error} what="the status report" onRetry={() => void overview.mutate()} /></div>;
  if (!o) return <PageLoading label="Counting members and flags…" />;
  const t = o.totals;

  return (
    <main className="overview-report" aria-label="Status report">
      <div className="report-toolbar">
        <Link to={paths.projectOverview.getHref(o.project.id)}>
          <Button>Back to the overview</Button>
        </Link>
        <Button type="primary" icon={<PrinterOutlined />} onClick={() => window.print()}>
          Print or save as PDF
        </Button>
      </div>

      <h1>
        Status report: {o.project.name} ({o.project.number})
      </h1>
      <p className="report-meta">Printed {formatDateTime(new Date().toISOString())}; overdue decided against {o.today} (UTC).</p>
      <p className="report-meta">
        {o.latestRevision
          ? `Latest revision ${o.latestRevision.number}${o.latestRevision.label ? ` “${o.latestRevision.label}”` : ''}, came in ${formatDateTime(o.latestRevision.createdAt)}: ${revisionText(o.latestRevision)}`
          : 'No revision yet.'}
      </p>

      <div className="totals" aria-label="Totals">
        {[
          ['Members', t.members], ['Passing', t.pass], ['Failing', t.fail], ['Open flags', t.flagsOpen], ['Answered', t.flagsAnswered],
          ['Closed', t.flagsClosed], ['Waived', t.flagsWaived], ['% closed', percentText(t.percentClosed)], ['Overdue', t.overdue],
        ].map(([label, value]) => (
          <div key={label}>
            <span>{label}</span>
            <strong>{value}</strong>
          </div>
        ))}
      </div>

      <h2>Per level</h2>
      <table aria-label="Per level">
        <thead>
          <tr>
            <th>Level</th>
            <th className="text">Assigned reviewer</th>
            {COUNT_HEADS.map((h) => <th key={h}>{h}</th>)}
            <th className="text">Sign-off</th>
          </tr>
        </thead>
        <tbody>
          {o.levels.map((r) => (
            <tr key={r.level === null ? 'gone' : `${r.level.id}:${r.level.name}`}>
              <td>{levelName(r)}</td>
              <td className="text">{r.assignedReviewer?.name ?? (r.level?.id ? <span className="muted">from the schedule</span> : '')}</td>
              <CountCells c={r} />
              <td className={`text${r.signOff?.state === 'voided' ? ' void' : ''}`}>{r.signOff ? signOffText(r.signOff) : r.level?.id ? <span className="muted">not signed off</span> : ''}</td>
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr>
            <td>All levels</td>
            <td />
            <CountCells c={t} />
            <td />
          </tr>
        </tfoot>
      </table>

      <h2>Per reviewer</h2>
      <table aria-label="Per reviewer">
        <thead>
          <tr>
            <th>Reviewer</th>
            {COUNT_HEADS.map((h) => <th key={h}>{h}</th>)}
          </tr>
        </thead>
        <tbody>
          {o.reviewers.map((r) => (
            <tr key={r.reviewer ? r.reviewer.id : r.present ? 'none' : 'gone'}>
              <td>{reviewerName(r)}</td>
              <CountCells c={r} />
            </tr>
          ))}
        </tbody>
      </table>

      <h2>Flags over time (up to 90 days, from the first flag)</h2>
      {series.data ? <FlagsChart points={series.data.points} compact /> : series.error ? <LoadError error={series.error} what="the chart" /> : <p className="muted">Drawing the chart…</p>}

      <p className="caution">
        {CAUTION_TEXT} Counts are of the latest revision’s members; a flag counts on its member’s level and reviewer there.
        “% closed” is closed and waived flags over all flags.
      </p>
    </main>
  );
}
