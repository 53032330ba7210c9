import { useState } from 'react';
import { Link } from 'react-router-dom';
import { App, Button, Empty, Flex, Modal, Skeleton, Typography } from 'antd';
import { FlagOutlined } from '@ant-design/icons';
import type { Flag } from '@sagline/common/api-types';
import { paths } from '@/app/paths';
import { LoadError } from '@/components/load-error';
import { useCurrentProject } from '@/lib/current-project';
import { can } from '@/lib/roles';
import { useFlags } from '../api/get-flags';
import { DueDate } from './due-date';
import { FlagStatusTag } from './flag-status-tag';
import { RaiseFlagForm } from './raise-flag-form';

/**
 * The flags of one member (by mark, across revisions), each linking to its
 * flag page, and, for checkers, a "Raise flag" button. `checks` are the
 * member's check names in the latest revision (the form offers them).
 */
export function MemberFlags({ projectId, mark, checks }: { projectId: number; mark: string; checks: string[] }) {
  const project = useCurrentProject();
  const { message } = App.useApp();
  const [raising, setRaising] = useState(false);
  // `mark` filters by "contains"; keep this member's own (marks match ignoring case).
  const { data, error, isLoading, mutate } = useFlags(projectId, { mark, sort: '-updated', pageSize: 200 });
  const flags = (data?.items ?? []).filter((f) => f.mark.toLowerCase() === mark.toLowerCase());
  const mayRaise = can.raiseFlags(project.myRole);

  return (
    <Flex vertical gap={12}>
      {error ? (
        <LoadError error={error} what={`the flags of ${mark}`} onRetry={() => void mutate()} />
      ) : (
        <FlagList projectId={projectId} mark={mark} flags={flags} loading={isLoading && !data} />
      )}
      {mayRaise && (
        <div>
          <Button icon={<FlagOutlined />} onClick={() => setRaising(true)}>
            Raise flag
          </Button>
        </div>
      )}
      <Modal
        open={raising}
        title={`Raise a flag on ${mark}`}
        footer={null}
        onCancel={() => setRaising(false)}
        destroyOnHidden
      >
        <RaiseFlagForm
          projectId={projectId}
          mark={mark}
          checks={checks}
          onCancel={() => setRaising(false)}
          onRaised={(flag) => {
            setRaising(false);
            void message.success(`Flag ${flag.id} raised on ${flag.mark}${flag.assignee ? `, assigned to ${flag.assignee.name}` : ''}.`);
            void mutate();
          }}
        />
      </Modal>
    </Flex>
  );
}

/** A plain list (a `ul` with the member's name), one flag per item. */
function FlagList({ projectId, mark, flags, loading }: { projectId: number; mark: string; flags: Flag[]; loading: boolean }) {
  if (loading) return <Skeleton active paragraph={{ rows: 2 }} title={false} />;
  if (flags.length === 0) return <Empty image={Empty.PRESENTED_IMAGE_SIMPLE} description={`No flag on ${mark} yet.`} />;
  return (
    <ul aria-label={`Flags of ${mark}`} style={{ listStyle: 'none', margin: 0, padding: 0 }}>
      {flags.map((f) => (
        <li key={f.id} style={{ padding: '8px 0', borderBottom: '1px solid #eef1f3' }}>
          <Flex vertical gap={2}>
            <Flex gap={8} align="center" wrap>
              <FlagStatusTag status={f.status} />
              <Link to={paths.projectFlag.getHref(projectId, f.id)}>{f.title}</Link>
            </Flex>
            <Typography.Text type="secondary" style={{ fontSize: 13 }}>
              {f.checkName ?? 'Member as a whole'} · {f.assignee ? f.assignee.name : 'unassigned'}
              {f.dueDate && (
                <>
                  {' · due '}
                  <DueDate date={f.dueDate} overdue={f.overdue} />
                </>
              )}
              {' · raised by '}
              {f.raisedBy?.name ?? 'someone no longer on the team'}
            </Typography.Text>
          </Flex>
        </li>
      ))}
    </ul>
  );
}
