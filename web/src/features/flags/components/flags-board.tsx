import { Link } from 'react-router-dom';
import { Card, Col, Empty, Flex, Row, Skeleton, Typography } from 'antd';
import { FLAG_STATUSES, type Flag, type FlagStatus } from '@sagline/common/api-types';
import { paths } from '@/app/paths';
import { LoadError } from '@/components/load-error';
import { useFlags } from '../api/get-flags';
import { DueDate } from './due-date';
import { boardQuery, flagsSearchParams, type FlagsView } from './flag-query';
import { FLAG_STATUS_HINTS, FLAG_STATUS_LABELS } from './flag-status-tag';

const ACCENT: Record<FlagStatus, string> = { open: '#d46b08', answered: '#1d5fa8', closed: '#389e0d', waived: '#8c8c8c' };

function FlagCard({ projectId, flag }: { projectId: number; flag: Flag }) {
  return (
    <Card size="small" styles={{ body: { padding: '8px 10px' } }} data-testid={`board-flag-${flag.id}`}>
      <Flex vertical gap={2}>
        <Link to={paths.projectFlag.getHref(projectId, flag.id)} style={{ fontWeight: 500 }}>
          {flag.title}
        </Link>
        <Typography.Text type="secondary" style={{ fontSize: 12 }}>
          {flag.mark}
          {flag.member ? ` · ${flag.member.level.name}` : ' · no longer in the schedule'} · {flag.assignee?.name ?? 'nobody'}
        </Typography.Text>
        {flag.dueDate && (
          <Typography.Text style={{ fontSize: 12 }}>
            Due <DueDate date={flag.dueDate} overdue={flag.overdue} />
          </Typography.Text>
        )}
      </Flex>
    </Card>
  );
}

function BoardColumn({ projectId, view, status }: { projectId: number; view: FlagsView; status: FlagStatus }) {
  const query = boardQuery(view, status);
  const { data, error, isLoading, mutate } = useFlags(projectId, query);
  const items = data?.items ?? [];
  const more = (data?.total ?? 0) - items.length;
  const tableHref = `${paths.projectFlags.getHref(projectId)}?${flagsSearchParams({ ...view, status: [status], board: false }).toString()}`;
  return (
    <section aria-label={`${FLAG_STATUS_LABELS[status]} flags`} style={{ height: '100%' }}>
      <Card
        size="small"
        style={{ background: '#f6f8f9', borderTop: `3px solid ${ACCENT[status]}`, height: '100%' }}
        title={
          <Flex vertical>
            <span>
              {FLAG_STATUS_LABELS[status]} <Typography.Text type="secondary">({data ? data.total : '…'})</Typography.Text>
            </span>
            <Typography.Text type="secondary" style={{ fontSize: 12, fontWeight: 400 }}>
              {FLAG_STATUS_HINTS[status]}
            </Typography.Text>
          </Flex>
        }
      >
        {error ? (
          <LoadError error={error} what={`the ${status} flags`} onRetry={() => void mutate()} />
        ) : isLoading && !data ? (
          <Skeleton active paragraph={{ rows: 3 }} />
        ) : items.length === 0 ? (
          <Empty image={Empty.PRESENTED_IMAGE_SIMPLE} description="None" />
        ) : (
          <Flex vertical gap={8}>
            {items.map((f) => (
              <FlagCard key={f.id} projectId={projectId} flag={f} />
            ))}
            {more > 0 && <Link to={tableHref}>and {more} more in the table</Link>}
          </Flex>
        )}
      </Card>
    </section>
  );
}

/**
 * The status board: a column per status (open, answered, closed, waived),
 * each with the flags of the current filters, soonest due first. A status
 * filter leaves only its columns.
 */
export function FlagsBoard({ projectId, view }: { projectId: number; view: FlagsView }) {
  const statuses = view.status.length ? FLAG_STATUSES.filter((s) => view.status.includes(s)) : FLAG_STATUSES;
  return (
    <Row gutter={[12, 12]} aria-label="Status board">
      {statuses.map((s) => (
        <Col key={s} xs={24} sm={12} xl={Math.floor(24 / statuses.length)}>
          <BoardColumn projectId={projectId} view={view} status={s} />
        </Col>
      ))}
    </Row>
  );
}
