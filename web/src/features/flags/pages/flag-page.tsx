import { useEffect, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { Alert, Button, Card, Col, Divider, Flex, Result, Row, Typography } from 'antd';
import { ArrowLeftOutlined } from '@ant-design/icons';
import type { FlagDetail } from '@sagline/common/api-types';
import { isApiError } from '@/app/api-error';
import { paths } from '@/app/paths';
import { LoadError } from '@/components/load-error';
import { MissingSupport } from '@/components/missing-support';
import { PageLoading } from '@/components/page-loading';
import { RegionBoundary } from '@/components/region-boundary';
import { useCurrentProject } from '@/lib/current-project';
import { useCurrentUser } from '@/lib/current-user';
import { can } from '@/lib/roles';
import { formatDateTime } from '@/lib/format';
import { useFlag } from '../api/get-flag';
import { allowedActions, FlagActions, FlagCommentForm } from '../components/flag-actions';
import { FlagFacts, FlagMemberFacts } from '../components/flag-facts';
import { describeEvent, FlagHistory } from '../components/flag-history';
import { FLAG_STATUS_HINTS, FLAG_STATUS_LABELS, FlagStatusTag } from '../components/flag-status-tag';

interface StaleNotice {
  action: string;
  /** What the person wrote, so nothing typed is lost even when its form is gone. */
  text?: string;
  seenVersion: number;
  current: FlagDetail;
}

/** What the other person did, from the events newer than the version the user saw (the last few). */
function changesSince(notice: StaleNotice): string {
  const last = notice.current.events[notice.current.events.length - 1];
  if (!last) return '';
  const who = last.kind === 'revision' ? '' : `${last.actor?.name ?? 'Someone'} `;
  return `Latest change: ${who}${describeEvent(last)} (${formatDateTime(last.createdAt)}).`;
}

/** One flag: the member, the thread with every change, and what the signed-in person may do. */
export function FlagPage() {
  const project = useCurrentProject();
  const me = useCurrentUser();
  const { flagId = '' } = useParams();
  const { data: flag, error, isLoading, mutate } = useFlag(project.id, flagId);
  const [stale, setStale] = useState<StaleNotice | null>(null);

  useEffect(() => setStale(null), [flagId]);

  const back = (
    <Link to={paths.projectFlags.getHref(project.id)}>
      <ArrowLeftOutlined /> All flags
    </Link>
  );

  if (isLoading) return <PageLoading label="Opening the flag…" />;
  if (error) {
    if (isApiError(error) && (error.statusCode === 404 || error.statusCode === 400)) {
      return (
        <Card>
          <Result
            icon={<MissingSupport />}
            title="Flag not found"
            subTitle={`There is no flag ${flagId} in ${project.name}. It may have been raised on another project.`}
            extra={
              <Link to={paths.projectFlags.getHref(project.id)}>
                <Button type="primary">All flags</Button>
              </Link>
            }
          />
        </Card>
      );
    }
    return <LoadError error={error} what={`flag ${flagId}`} onRetry={() => void mutate()} />;
  }
  if (!flag) return null;
  const actions = allowedActions(flag, me, project.myRole);

  return (
    <Flex vertical gap={16}>
      <div>{back}</div>
      <Flex align="center" gap={12} wrap>
        <Typography.Title level={3} style={{ margin: 0 }}>
          Flag {flag.id}: {flag.title}
        </Typography.Title>
        <FlagStatusTag status={flag.status} />
        {flag.overdue && <Typography.Text type="danger">Overdue</Typography.Text>}
      </Flex>

      {stale && (
        <Alert
          type="warning"
          showIcon
          role="alert"
          title={`Someone changed this flag before your ${stale.action} was saved; it was not saved.`}
          description={
            <>
              You were looking at version {stale.seenVersion}; it is now version {stale.current.version}, status{' '}
              {FLAG_STATUS_LABELS[stale.current.status].toLowerCase()}. {changesSince(stale)} The page now shows the flag as it
              is. Read what changed, then try again if it still applies.
              {stale.text && (
                <Typography.Paragraph style={{ margin: '8px 0 0', whiteSpace: 'pre-wrap' }}>
                  What you wrote: <Typography.Text italic>{stale.text}</Typography.Text>
                </Typography.Paragraph>
              )}
            </>
          }
          closable={{ onClose: () => setStale(null) }}
        />
      )}

      <Row gutter={[16, 16]}>
        <Col xs={24} lg={14}>
          <Flex vertical gap={16}>
            <Card size="small" title={`Member ${flag.mark}`}>
              <RegionBoundary region="the member">
                <FlagMemberFacts flag={flag} />
              </RegionBoundary>
            </Card>
            <Card size="small" title="Thread and history">
              <RegionBoundary region="the history">
                <FlagHistory events={flag.events} />
                {can.commentOnFlags(project.myRole) && (
                  <>
                    <Divider style={{ margin: '0 0 12px' }} />
                    <FlagCommentForm flag={flag} onChanged={() => setStale(null)} />
                  </>
                )}
              </RegionBoundary>
            </Card>
          </Flex>
        </Col>
        <Col xs={24} lg={10}>
          <Flex vertical gap={16}>
            <Card size="small" title="Flag">
              <FlagFacts flag={flag} />
            </Card>
            <Card size="small" title="Actions">
              <RegionBoundary region="the actions">
                <FlagActions
                  flag={flag}
                  onStale={(current, action, text) => setStale({ action, text, seenVersion: flag.version, current })}
                  onChanged={() => setStale(null)}
                />
                {actions.length === 0 && (
                  <Typography.Text type="secondary">
                    {project.myRole === 'viewer'
                      ? 'You can read this flag; viewers do not change flags.'
                      : `Nothing for you to do on this flag now: it is ${FLAG_STATUS_LABELS[flag.status].toLowerCase()}, ${FLAG_STATUS_HINTS[flag.status]}.`}
                  </Typography.Text>
                )}
              </RegionBoundary>
            </Card>
          </Flex>
        </Col>
      </Row>
    </Flex>
  );
}
