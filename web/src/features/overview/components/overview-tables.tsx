import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Progress, Table, Tooltip, Typography } from 'antd';
import type { ColumnsType } from 'antd/es/table';
import type { OverviewCounts, OverviewLevelRow, OverviewReviewerRow } from '@sagline/common/api-types';
import { palette } from '@/app/theme';
import { levelLinks, levelName, percentText, reviewerLinks, reviewerName } from './overview-labels';

type CountKey = 'members' | 'pass' | 'fail' | 'flagsOpen' | 'flagsAnswered' | 'flagsClosed' | 'flagsWaived' | 'overdue';
type LinkKey = 'members' | 'pass' | 'fail' | 'open' | 'answered' | 'closed' | 'waived' | 'overdue' | 'total';

const COUNT_COLUMNS: { key: CountKey; title: string; link: LinkKey; hint: string; tone?: string }[] = [
  { key: 'members', title: 'Members', link: 'members', hint: 'Members in the latest revision' },
  { key: 'pass', title: 'Passing', link: 'pass', hint: 'Every check within its limit', tone: palette.pass },
  { key: 'fail', title: 'Failing', link: 'fail', hint: 'At least one check over its limit', tone: palette.fail },
  { key: 'flagsOpen', title: 'Open', link: 'open', hint: 'Flags waiting for the engineer’s answer' },
  { key: 'flagsAnswered', title: 'Answered', link: 'answered', hint: 'Flags waiting for the checker to close or reopen them' },
  { key: 'flagsClosed', title: 'Closed', link: 'closed', hint: 'Flags resolved' },
  { key: 'flagsWaived', title: 'Waived', link: 'waived', hint: 'Flags accepted as they are, with a reason' },
  { key: 'overdue', title: 'Overdue', link: 'overdue', hint: 'Open or answered flags past their due date', tone: palette.fail },
];

function countCell(value: number, href: string | undefined, label: string, tone?: string): ReactNode {
  const text = <span style={{ color: value > 0 && tone ? tone : undefined, fontVariantNumeric: 'tabular-nums' }}>{value}</span>;
  if (!href) return text;
  return (
    <Link to={href} aria-label={label}>
      {text}
    </Link>
  );
}

function countColumns<R extends OverviewCounts>(name: (r: R) => string, links: (r: R) => Partial<Record<LinkKey, string>> | null): ColumnsType<R> {
  const cols: ColumnsType<R> = COUNT_COLUMNS.map((c) => ({
    key: c.key,
    title: <Tooltip title={c.hint}>{c.title}</Tooltip>,
    align: 'right' as const,
    render: (_: unknown, r: R) => countCell(r[c.key], links(r)?.[c.link], `${c.title}: ${r[c.key]} (${name(r)})`, c.tone),
  }));
  cols.splice(3, 0, {
    key: 'flagsTotal',
    title: <Tooltip title="Every flag, whatever its status">Flags</Tooltip>,
    align: 'right',
    render: (_: unknown, r: R) => countCell(r.flagsTotal, links(r)?.total, `Flags: ${r.flagsTotal} (${name(r)})`),
  });
  cols.splice(cols.length - 1, 0, {
    key: 'percentClosed',
    title: <Tooltip title="Closed and waived flags over all flags">% closed</Tooltip>,
    width: 130,
    render: (_: unknown, r: R) =>
      r.percentClosed === null ? (
        <Typography.Text type="secondary">—</Typography.Text>
      ) : (
        <Tooltip title={percentText(r.percentClosed)}>
          <Progress percent={r.percentClosed} size="small" strokeColor={palette.pass} format={() => percentText(r.percentClosed)} aria-label={`${percentText(r.percentClosed)} closed (${name(r)})`} />
        </Tooltip>
      ),
  });
  return cols;
}

export function LevelTable({
  projectId,
  rows,
  reviewerCell,
  signOffCell,
}: {
  projectId: number;
  rows: OverviewLevelRow[];
  reviewerCell: (row: OverviewLevelRow) => ReactNode;
  signOffCell: (row: OverviewLevelRow) => ReactNode;
}) {
  const columns: ColumnsType<OverviewLevelRow> = [
    {
      key: 'level',
      title: 'Level',
      fixed: 'left',
      render: (_: unknown, r) => {
        const links = levelLinks(projectId, r);
        return links ? <Link to={links.members}>{levelName(r)}</Link> : <Typography.Text type="secondary">{levelName(r)}</Typography.Text>;
      },
    },
    { key: 'reviewer', title: 'Assigned reviewer', render: (_: unknown, r) => reviewerCell(r) },
    ...countColumns<OverviewLevelRow>(levelName, (r) => levelLinks(projectId, r)),
    { key: 'signOff', title: 'Sign-off', render: (_: unknown, r) => signOffCell(r) },
  ];
  return (
    <Table<OverviewLevelRow>
      aria-label="Per level"
      size="small"
      rowKey={(r) => (r.level === null ? 'gone' : r.level.id === null ? `name:${r.level.name}` : String(r.level.id))}
      columns={columns}
      dataSource={rows}
      pagination={false}
      scroll={{ x: 'max-content' }}
    />
  );
}

export function ReviewerTable({ projectId, rows }: { projectId: number; rows: OverviewReviewerRow[] }) {
  const columns: ColumnsType<OverviewReviewerRow> = [
    {
      key: 'reviewer',
      title: 'Reviewer',
      fixed: 'left',
      render: (_: unknown, r) => {
        const links = reviewerLinks(projectId, r);
        return links ? <Link to={links.members}>{reviewerName(r)}</Link> : <Typography.Text type="secondary">{reviewerName(r)}</Typography.Text>;
      },
    },
    ...countColumns<OverviewReviewerRow>(reviewerName, (r) => reviewerLinks(projectId, r)),
  ];
  return (
    <Table<OverviewReviewerRow>
      aria-label="Per reviewer"
      size="small"
      rowKey={(r) => (r.reviewer ? String(r.reviewer.id) : r.present ? 'none' : 'gone')}
      columns={columns}
      dataSource={rows}
      pagination={false}
      scroll={{ x: 'max-content' }}
    />
  );
}
