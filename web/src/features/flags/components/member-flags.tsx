import { useState } from 'react';
import { Link } from 'react-router-dom';
import { App, Button, Empty, Flex, List, Modal, Typography } from 'antd';
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
        <List<Flag>
          size="small"
          loading={isLoading}
          dataSource={flags}
          aria-label={`Flags of ${mark}`}
          locale={{ emptyText: <Empty image={Empty.PRESENTED_IMAGE_SIMPLE} description={`No flag on ${mark} yet.`} /> }}
          renderItem={(f) => (
            <List.Item>
              <Flex vertical gap={2} style={{ width: '100%' }}>
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
            </List.Item>
          )}
        />
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
