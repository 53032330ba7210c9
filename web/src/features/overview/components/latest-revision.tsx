import { Link } from 'react-router-dom';
import { Typography } from 'antd';
import type { OverviewRevision } from '@sagline/common/api-types';
import { paths } from '@/app/paths';
import { formatDateTime } from '@/lib/format';

/** "Revision 3 "Rev C for permit", 2 Dec 2026, 19:40, by Kasimir Oduya from rev-c.xlsx: 412 members (against revision 2: …)". */
export function revisionText(r: OverviewRevision): string {
  const diff = r.diff
    ? ` Against revision ${r.diff.againstNumber}: ${r.diff.added} added, ${r.diff.removed} removed, ${r.diff.changed} changed, ${r.diff.flips} verdict${r.diff.flips === 1 ? '' : 's'} flipped.`
    : '';
  return `${r.memberCount} members from ${r.fileName}${r.uploadedBy ? `, uploaded by ${r.uploadedBy.name}` : ''}.${diff}`;
}

export function LatestRevision({ projectId, revision }: { projectId: number; revision: OverviewRevision | null }) {
  if (!revision) {
    return (
      <Typography.Paragraph style={{ margin: 0 }}>
        No revision yet. <Link to={paths.projectImports.getHref(projectId)}>Import a member schedule</Link> to see where the project stands.
      </Typography.Paragraph>
    );
  }
  return (
    <div aria-label="Latest revision">
      <Typography.Text strong>
        Revision {revision.number}
        {revision.label ? ` “${revision.label}”` : ''}
      </Typography.Text>
      <Typography.Text type="secondary"> · came in {formatDateTime(revision.createdAt)}</Typography.Text>
      <Typography.Paragraph type="secondary" style={{ margin: 0 }}>
        {revisionText(revision)}
      </Typography.Paragraph>
    </div>
  );
}
