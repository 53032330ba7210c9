import { Card, Flex, Typography } from 'antd';
import { LoadError } from '@/components/load-error';
import { RegionBoundary } from '@/components/region-boundary';
import { useCurrentProject } from '@/lib/current-project';
import { useCurrentUser } from '@/lib/current-user';
import { can } from '@/lib/roles';
import { useTeam } from '../api/get-team';
import { InviteForm } from '../components/invite-form';
import { TeamTable } from '../components/team-table';

export function TeamPage() {
  const me = useCurrentUser();
  const project = useCurrentProject();
  const { data: team, error, isLoading, mutate } = useTeam(project.id);
  const manages = can.manageTeam(me, project.myRole);

  return (
    <Flex vertical gap={16}>
      {manages && (
        <Card title="Invite someone" size="small">
          <RegionBoundary region="the invitation form">
            <InviteForm projectId={project.id} />
          </RegionBoundary>
        </Card>
      )}
      <Card
        title="Team"
        size="small"
        extra={
          !manages && (
            <Typography.Text type="secondary" style={{ fontSize: 13 }}>
              Managers invite people and change roles.
            </Typography.Text>
          )
        }
        styles={{ body: { padding: 0 } }}
      >
        <RegionBoundary region="the team table">
          {error ? (
            <div style={{ padding: 16 }}>
              <LoadError error={error} what="the team" onRetry={() => void mutate()} />
            </div>
          ) : (
            <TeamTable
              projectId={project.id}
              team={team ?? []}
              loading={isLoading}
              editable={manages}
              myUserId={me.id}
            />
          )}
        </RegionBoundary>
      </Card>
    </Flex>
  );
}
