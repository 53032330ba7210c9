import { Descriptions, Drawer, Flex, Spin, Table, Typography } from 'antd';
import type { ImportVerdictFlip, RevisionSummary } from '@sagline/common/api-types';
import { LoadError } from '@/components/load-error';
import { UtilisationBar } from '@/components/utilisation-bar';
import { formatDateTime } from '@/lib/format';
import { useRevision } from '../api/get-revision';
import { fileSizeText } from './file-size';
import { FlipText } from './import-diff';
import { ProblemsTable } from './problems-table';

/** An earlier (or the current) revision: its file, its diff counts, its flips and the warnings of its parse report. */
export function RevisionDrawer({
  projectId,
  revision,
  onClose,
}: {
  projectId: number | string;
  revision: RevisionSummary | null;
  onClose: () => void;
}) {
  const { data: detail, error, mutate } = useRevision(projectId, revision?.id ?? null);
  return (
    <Drawer open={revision !== null} onClose={onClose} size={720} title={revision ? `Revision ${revision.number}` : ''}>
      {error ? (
        <LoadError error={error} what="this revision" onRetry={() => void mutate()} />
      ) : !detail ? (
        <Spin />
      ) : (
        <Flex vertical gap={16}>
          <Descriptions
            size="small"
            column={1}
            bordered
            items={[
              { key: 'label', label: 'Label', children: detail.label ?? '—' },
              { key: 'file', label: 'File', children: `${detail.fileName} (${fileSizeText(detail.fileSize)})` },
              { key: 'who', label: 'Uploaded by', children: detail.uploadedBy?.name ?? '(removed account)' },
              { key: 'when', label: 'When', children: formatDateTime(detail.createdAt) },
              {
                key: 'members',
                label: 'Members',
                children: `${detail.memberCount} (${detail.passCount} passing, ${detail.failCount} failing); ${detail.parseReport.loadRows} load rows`,
              },
              { key: 'limits', label: 'Limit set', children: detail.limitSet.name },
              {
                key: 'diff',
                label: 'Changes',
                children: detail.diff.against
                  ? `Against revision ${detail.diff.against.number}: ${detail.diff.added} added, ${detail.diff.removed} removed, ${detail.diff.changed} changed, ${detail.diff.flips} verdicts flipped`
                  : 'The first revision of the project.',
              },
            ]}
          />
          {detail.diff.flipped.length > 0 && (
            <section aria-label="Verdicts that flipped">
              <Typography.Title level={5}>Verdicts that flipped</Typography.Title>
              <Table<ImportVerdictFlip>
                size="small"
                rowKey="mark"
                dataSource={detail.diff.flipped}
                pagination={detail.diff.flipped.length > 20 ? { pageSize: 20 } : false}
                columns={[
                  { title: 'Mark', dataIndex: 'mark', width: 110 },
                  { title: 'Level', dataIndex: 'level', width: 80 },
                  { title: 'Verdict', key: 'flip', render: (_v, f) => <FlipText from={f.from} to={f.to} /> },
                  {
                    title: 'Utilisation',
                    key: 'u',
                    width: 100,
                    align: 'right',
                    render: (_v, f) => <UtilisationBar value={f.maxUtilization} bar={false} />,
                  },
                ]}
              />
            </section>
          )}
          <section aria-label="Parse report">
            <Typography.Title level={5}>Parse report</Typography.Title>
            {detail.parseReport.problems.length === 0 ? (
              <Typography.Text type="secondary">
                {detail.parseReport.memberRows} member rows and {detail.parseReport.loadRows} load rows read without a warning.
              </Typography.Text>
            ) : (
              <ProblemsTable problems={detail.parseReport.problems} label="Warnings of the revision" />
            )}
          </section>
        </Flex>
      )}
    </Drawer>
  );
}
