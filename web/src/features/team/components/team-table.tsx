import { App, Button, Popconfirm, Table, Tag, Typography } from 'antd';
import type { ProjectRole, TeamMember } from '@sagline/common/api-types';
import { errorMessage } from '@/app/api-error';
import { RoleTag } from '@/components/role-tag';
import { ROLE_LABELS } from '@/lib/roles';
import { useChangeRole } from '../api/change-role';
import { useRemoveMember } from '../api/remove-member';
import { RoleSelect } from './role-select';

export function TeamTable({
  projectId,
  team,
  loading,
  editable,
  myUserId,
}: {
  projectId: number | string;
  team: TeamMember[];
  loading?: boolean;
  /** Managers and admins change roles and remove people; others only read. */
  editable: boolean;
  myUserId: number;
}) {
  const { message } = App.useApp();
  const changeRole = useChangeRole(projectId);
  const remove = useRemoveMember(projectId);

  const onRole = async (m: TeamMember, role: ProjectRole) => {
    try {
      await changeRole.trigger({ userId: m.userId, role });
      void message.success(`${m.name || m.email} is now ${ROLE_LABELS[role].toLowerCase()}.`);
    } catch (e) {
      void message.error(errorMessage(e));
    }
  };

  const onRemove = async (m: TeamMember) => {
    try {
      await remove.trigger({ userId: m.userId });
      void message.success(`${m.name || m.email} was removed from the project.`);
    } catch (e) {
      void message.error(errorMessage(e));
    }
  };

  const sorted = [...team].sort((a, b) => (a.name || a.email).localeCompare(b.name || b.email));

  return (
    <Table<TeamMember>
      rowKey="userId"
      loading={loading}
      dataSource={sorted}
      pagination={false}
      locale={{ emptyText: 'No one is on this project yet.' }}
      scroll={{ x: 720 }}
      columns={[
        {
          title: 'Name',
          dataIndex: 'name',
          ellipsis: true,
          render: (_v, m) => (
            <>
              {m.name ? m.name : <Typography.Text type="secondary">(not set yet)</Typography.Text>}
              {m.userId === myUserId && <Typography.Text type="secondary"> (you)</Typography.Text>}
            </>
          ),
        },
        { title: 'E-mail', dataIndex: 'email', ellipsis: true },
        {
          title: 'Role',
          dataIndex: 'role',
          width: 180,
          render: (_v, m) =>
            editable && m.userId !== myUserId ? (
              <RoleSelect
                aria-label={`Role of ${m.name || m.email}`}
                value={m.role}
                onChange={(role) => void onRole(m, role)}
                style={{ width: 150 }}
              />
            ) : (
              <RoleTag role={m.role} />
            ),
        },
        {
          title: 'Status',
          dataIndex: 'status',
          width: 110,
          render: (_v, m) =>
            m.status === 'active' ? <Tag color="green">Active</Tag> : <Tag color="gold">Invited</Tag>,
        },
        ...(editable
          ? [
              {
                title: '',
                key: 'actions',
                width: 100,
                align: 'right' as const,
                render: (_v: unknown, m: TeamMember) =>
                  m.userId === myUserId ? null : (
                    <Popconfirm
                      title={`Remove ${m.name || m.email} from the project?`}
                      description="They lose access to it; their past work stays in the history."
                      okText="Remove"
                      okButtonProps={{ danger: true }}
                      onConfirm={() => onRemove(m)}
                    >
                      <Button type="link" danger size="small">
                        Remove
                      </Button>
                    </Popconfirm>
                  ),
              },
            ]
          : []),
      ]}
    />
  );
}
