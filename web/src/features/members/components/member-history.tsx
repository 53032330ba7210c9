import { Link } from 'react-router-dom';
import { Table, Tag, Typography } from 'antd';
import type { MemberHistoryEntry } from '@sagline/common/api-types';
import { paths } from '@/app/paths';
import { UtilisationBar } from '@/components/utilisation-bar';
import { VerdictTag } from '@/components/verdict-tag';
import { formatDateTime } from '@/lib/format';

/**
 * The member in every revision of the project, oldest first: there or not,
 * its verdict and utilisation, and what changed since the last revision that
 * had it. Each revision opens the member as it was then.
 */
export function MemberHistory({
  projectId,
  mark,
  history,
  shownRevisionId,
}: {
  projectId: number;
  mark: string;
  history: MemberHistoryEntry[];
  shownRevisionId: number;
}) {
  const newestId = history.length ? history[history.length - 1].revision.id : null;
  return (
    <Table<MemberHistoryEntry>
      aria-label="History across revisions"
      size="small"
      rowKey={(h) => h.revision.id}
      pagination={false}
      dataSource={history}
      scroll={{ x: 820 }}
      rowClassName={(h) => (h.revision.id === shownRevisionId ? 'ant-table-row-selected' : '')}
      columns={[
        {
          title: 'Revision',
          key: 'revision',
          width: 220,
          render: (_v, h) => {
            const href = paths.projectMember.getHref(projectId, mark);
            const label = `Revision ${h.revision.number}${h.revision.label ? `, ${h.revision.label}` : ''}`;
            return (
              <div>
                {h.present && h.revision.id !== shownRevisionId ? (
                  <Link to={h.revision.id === newestId ? href : `${href}?revision=${h.revision.id}`}>{label}</Link>
                ) : (
                  <Typography.Text strong={h.revision.id === shownRevisionId}>{label}</Typography.Text>
                )}
                {h.revision.id === shownRevisionId && <Tag style={{ marginLeft: 6 }}>shown</Tag>}
                <div>
                  <Typography.Text type="secondary" style={{ fontSize: 12 }}>
                    {formatDateTime(h.revision.createdAt)}
                  </Typography.Text>
                </div>
              </div>
            );
          },
        },
        {
          title: 'Verdict',
          key: 'verdict',
          width: 100,
          render: (_v, h) => (h.present ? <VerdictTag verdict={h.verdict} /> : <Tag>Not in this revision</Tag>),
        },
        { title: 'Utilisation', key: 'u', width: 150, render: (_v, h) => (h.present ? <UtilisationBar value={h.maxUtilization} /> : null) },
        { title: 'Governing check', key: 'g', width: 140, render: (_v, h) => (h.present ? (h.governingCheck ?? '—') : null) },
        {
          title: 'Changes',
          key: 'changes',
          render: (_v, h, i) => {
            if (!h.present) return null;
            const first = history.slice(0, i).every((e) => !e.present);
            if (first) return <Typography.Text type="secondary">{i === 0 ? 'First revision' : 'Added'}</Typography.Text>;
            if (!h.changes.length) return <Typography.Text type="secondary">Unchanged</Typography.Text>;
            return (
              <ul style={{ margin: 0, paddingLeft: 18 }}>
                {h.changes.map((c) => (
                  <li key={c.field}>
                    {c.label}: {c.beforeText} → {c.afterText}
                  </li>
                ))}
              </ul>
            );
          },
        },
      ]}
    />
  );
}
