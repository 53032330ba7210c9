import { Button, Space, Table, Tag, Typography } from 'antd';
import type { RevisionSummary } from '@sagline/common/api-types';
import { formatDateTime } from '@/lib/format';
import { resultsWorkbookHref, revisionFileHref } from '../api/import-urls';

/** Every committed revision, newest first; the newest is the current one. Files download as they are. */
export function RevisionsTable({
  projectId,
  revisions,
  loading,
  onOpen,
}: {
  projectId: number | string;
  revisions: RevisionSummary[];
  loading?: boolean;
  onOpen: (revision: RevisionSummary) => void;
}) {
  const current = revisions.reduce<number | null>((max, r) => (max === null || r.number > max ? r.number : max), null);
  return (
    <Table<RevisionSummary>
      aria-label="Revisions"
      rowKey="id"
      size="small"
      loading={loading}
      dataSource={revisions}
      pagination={revisions.length > 20 ? { pageSize: 20 } : false}
      locale={{ emptyText: 'No revisions yet. Upload the member schedule to make revision 1.' }}
      scroll={{ x: 1040 }}
      columns={[
        {
          title: 'Revision',
          dataIndex: 'number',
          width: 120,
          render: (_v, r) => (
            <Space size={6}>
              <Typography.Text strong>{r.number}</Typography.Text>
              {r.number === current && <Tag color="blue">Current</Tag>}
            </Space>
          ),
        },
        {
          title: 'Label',
          dataIndex: 'label',
          ellipsis: { showTitle: true },
          render: (_v, r) => r.label ?? <Typography.Text type="secondary">—</Typography.Text>,
        },
        {
          title: 'Uploaded by',
          dataIndex: 'uploadedBy',
          width: 150,
          ellipsis: true,
          render: (_v, r) => r.uploadedBy?.name ?? <Typography.Text type="secondary">(removed account)</Typography.Text>,
        },
        { title: 'When', dataIndex: 'createdAt', width: 170, render: (_v, r) => formatDateTime(r.createdAt) },
        { title: 'Members', dataIndex: 'memberCount', width: 90, align: 'right' },
        {
          title: 'Failing',
          dataIndex: 'failCount',
          width: 80,
          align: 'right',
          render: (_v, r) => <Typography.Text type={r.failCount > 0 ? 'danger' : undefined}>{r.failCount}</Typography.Text>,
        },
        {
          title: 'Files',
          key: 'files',
          width: 250,
          render: (_v, r) => (
            <Space size={0} wrap>
              <Button
                type="link"
                size="small"
                href={revisionFileHref(projectId, r.id)}
                download
                aria-label={`Original file of revision ${r.number}`}
                title={r.fileName}
              >
                Original file
              </Button>
              <Button
                type="link"
                size="small"
                href={resultsWorkbookHref(projectId, r.id)}
                download
                aria-label={`Results workbook of revision ${r.number}`}
              >
                Results workbook
              </Button>
            </Space>
          ),
        },
        {
          title: '',
          key: 'open',
          width: 90,
          align: 'right',
          render: (_v, r) => (
            <Button size="small" onClick={() => onOpen(r)} aria-label={`Details of revision ${r.number}`}>
              Details
            </Button>
          ),
        },
      ]}
    />
  );
}
