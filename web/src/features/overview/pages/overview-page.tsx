import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button, Card, Flex, Segmented, Statistic, Typography } from 'antd';
import { PrinterOutlined } from '@ant-design/icons';
import { paths } from '@/app/paths';
import { palette } from '@/app/theme';
import { CautionNote } from '@/components/caution-note';
import { LoadError } from '@/components/load-error';
import { PageLoading } from '@/components/page-loading';
import { RegionBoundary } from '@/components/region-boundary';
import { useCurrentProject } from '@/lib/current-project';
import { useFlagsOverTime } from '../api/get-flags-over-time';
import { useOverview } from '../api/get-overview';
import { useReviewerAssignments } from '../api/get-reviewer-assignments';
import { useRevalidateOverview } from '../api/revalidate-overview';
import { FlagsChart } from '../components/flags-chart';
import { LatestRevision } from '../components/latest-revision';
import { LevelReviewerSelect, SignOffCell } from '../components/level-controls';
import { percentText } from '../components/overview-labels';
import { LevelTable, ReviewerTable } from '../components/overview-tables';

const RANGES = [
  { label: '30 days', value: 30 },
  { label: '90 days', value: 90 },
  { label: '1 year', value: 365 },
];

/**
 * Journey 3: where the project stands, per level and per reviewer, with the
 * closure chart. Every number comes counted from the server; each row links
 * to the Members or Flags view it counts. Managers assign a level's reviewer
 * here; checkers sign a level off when nothing on it waits for action.
 */
export function OverviewPage() {
  const project = useCurrentProject();
  const [days, setDays] = useState(30);
  const overview = useOverview(project.id);
  const series = useFlagsOverTime(project.id, days);
  const canManage = project.myRole === 'manager' || project.myRole === 'admin';
  const canSignOff = project.myRole === 'checker';
  const assignments = useReviewerAssignments(project.id, canManage);
  const revalidate = useRevalidateOverview(project.id);

  if (overview.error && !overview.data) return <LoadError error={overview.error} what="the overview" onRetry={() => void overview.mutate()} />;
  const o = overview.data;
  if (!o) return <PageLoading label="Counting members and flags…" />;
  const t = o.totals;

  return (
    <Flex vertical gap={16}>
      <Card
        size="small"
        title="Where the project stands"
        extra={
          <Link to={paths.projectOverviewReport.getHref(project.id)} target="_blank">
            <Button icon={<PrinterOutlined />}>Printable report</Button>
          </Link>
        }
      >
        <Flex vertical gap={12}>
          <LatestRevision projectId={project.id} revision={o.latestRevision} />
          <Flex gap={32} wrap aria-label="Totals">
            <Statistic title="Members" value={t.members} />
            <Statistic title="Passing" value={t.pass} valueStyle={{ color: palette.pass }} />
            <Statistic title="Failing" value={t.fail} valueStyle={{ color: t.fail ? palette.fail : undefined }} />
            <Statistic title="Open flags" value={t.flagsOpen} />
            <Statistic title="Answered" value={t.flagsAnswered} />
            <Statistic title="Closed" value={t.flagsClosed} />
            <Statistic title="Waived" value={t.flagsWaived} />
            <Statistic title="% closed" value={percentText(t.percentClosed)} />
            <Statistic title="Overdue" value={t.overdue} valueStyle={{ color: t.overdue ? palette.fail : undefined }} />
          </Flex>
          <CautionNote />
        </Flex>
      </Card>

      <Card
        size="small"
        title="Flags over time"
        extra={<Segmented size="small" aria-label="Days shown" options={RANGES} value={days} onChange={(v) => setDays(Number(v))} />}
      >
        <RegionBoundary region="the chart">
          {series.error && !series.data ? (
            <LoadError error={series.error} what="the flags over time" onRetry={() => void series.mutate()} />
          ) : series.data ? (
            <FlagsChart points={series.data.points} />
          ) : (
            <PageLoading label="Drawing the chart…" />
          )}
        </RegionBoundary>
      </Card>

      <Card size="small" title="Per level">
        <RegionBoundary region="the level table">
          <LevelTable
            projectId={project.id}
            rows={o.levels}
            reviewerCell={(row) =>
              canManage ? (
                <LevelReviewerSelect projectId={project.id} row={row} assignments={assignments.data} onChanged={() => void revalidate()} />
              ) : row.assignedReviewer ? (
                row.assignedReviewer.name
              ) : row.level?.id ? (
                <Typography.Text type="secondary">From the schedule</Typography.Text>
              ) : null
            }
            signOffCell={(row) => <SignOffCell projectId={project.id} row={row} canSignOff={canSignOff} onChanged={() => void revalidate()} />}
          />
          <Typography.Paragraph type="secondary" style={{ fontSize: 12, margin: '8px 0 0' }}>
            A flag counts on its member’s level and reviewer in the latest revision. A reviewer assigned to a level reviews every
            member on it, unless a member has its own; without either, the schedule’s Reviewer column applies. A later revision
            that changes a member on a signed-off level voids its sign-off.
          </Typography.Paragraph>
        </RegionBoundary>
      </Card>

      <Card size="small" title="Per reviewer">
        <RegionBoundary region="the reviewer table">
          <ReviewerTable projectId={project.id} rows={o.reviewers} />
        </RegionBoundary>
      </Card>
    </Flex>
  );
}
