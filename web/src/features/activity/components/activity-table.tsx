import { Button, Flex, Table, Tag, Typography } from 'antd';
import { ACTIVITY_KIND_LABELS, type ActivityEntry, type ActivityKind, type Page } from '@sagline/common/api-types';
import { formatDateTime } from '@/lib/format';
import { ActivityRefs } from './activity-refs';
import { ACTIVITY_PAGE_SIZES } from './activity-view';

const KIND_COLORS: Record<ActivityKind, string> = {
  imports: 'geekblue',
  flags: 'volcano',
  assignments: 'cyan',
  'sign-offs': 'green',
  'limit-sets': 'purple',
  team: 'default',
  project: 'default',
};

/** The feed, newest first: when, who (a click shows only their entries), what, and links to what it concerns. */
export function ActivityTable({
  projectId,
  page,
  loading,
  emptyText,
  onPage,
  onPerson,
}: {
  projectId: number | string;
  page: Page<ActivityEntry> | undefined;
  loading: boolean;
  emptyText: React.ReactNode;
  onPage: (page: number, pageSize: number) => void;
  onPerson: (actorId: number) => void;
}) {
  return (
    <Table<ActivityEntry>
      rowKey="id"
      size="middle"
      loading={loading}
      dataSource={page?.items ?? []}
      locale={{ emptyText }}
      scroll={{ x: 760 }}
      pagination={{
        current: page?.page ?? 1,
        pageSize: page?.pageSize ?? ACTIVITY_PAGE_SIZES[0],
        total: page?.total ?? 0,
        showSizeChanger: true,
        pageSizeOptions: ACTIVITY_PAGE_SIZES.map(String),
        showTotal: (total, [a, b]) => `${a}–${b} of ${total} entries`,
        onChange: onPage,
      }}
      columns={[
        {
          title: 'When',
          dataIndex: 'at',
          width: 170,
          render: (at: string) => (
            <time dateTime={at} style={{ whiteSpace: 'nowrap' }}>
              {formatDateTime(at)}
            </time>
          ),
        },
        {
          title: 'Who',
          dataIndex: 'actor',
          width: 180,
          render: (actor: ActivityEntry['actor']) =>
            actor ? (
              <Button type="link" size="small" style={{ padding: 0, height: 'auto' }} onClick={() => onPerson(actor.id)} title={`Show only ${actor.name}'s entries`}>
                {actor.name}
              </Button>
            ) : (
              <Typography.Text type="secondary">Sagline (automatic)</Typography.Text>
            ),
        },
        {
          title: 'What',
          key: 'what',
          render: (_: unknown, e: ActivityEntry) => (
            <Flex vertical gap={2}>
              <span>
                {e.kind && (
                  <Tag color={KIND_COLORS[e.kind]} style={{ marginInlineEnd: 8 }}>
                    {ACTIVITY_KIND_LABELS[e.kind]}
                  </Tag>
                )}
                {e.summary}
              </span>
              <ActivityRefs projectId={projectId} refs={e.refs} />
            </Flex>
          ),
        },
      ]}
    />
  );
}
