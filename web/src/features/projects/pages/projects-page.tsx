import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { App, Button, Card, Empty, Flex, Modal, Typography } from 'antd';
import { PlusOutlined } from '@ant-design/icons';
import { paths } from '@/app/paths';
import { LoadError } from '@/components/load-error';
import { useCurrentUser } from '@/lib/current-user';
import { can } from '@/lib/roles';
import { useProjects } from '../api/get-projects';
import { NewProjectForm } from '../components/new-project-form';
import { ProjectList } from '../components/project-list';

export function ProjectsPage() {
  const me = useCurrentUser();
  const { data: projects, error, isLoading, mutate } = useProjects();
  const [creating, setCreating] = useState(false);
  const navigate = useNavigate();
  const { message } = App.useApp();
  const mayCreate = can.createProject(me);

  return (
    <Flex vertical gap={16}>
      <Flex justify="space-between" align="center" gap={16} wrap>
        <Typography.Title level={2} style={{ margin: 0 }}>
          Projects
        </Typography.Title>
        {mayCreate && (
          <Button type="primary" icon={<PlusOutlined />} onClick={() => setCreating(true)}>
            New project
          </Button>
        )}
      </Flex>

      {error ? (
        <LoadError error={error} what="your projects" onRetry={() => void mutate()} />
      ) : (
        <Card styles={{ body: { padding: 0 } }}>
          {!isLoading && projects?.length === 0 ? (
            <Empty
              image={Empty.PRESENTED_IMAGE_SIMPLE}
              style={{ padding: '48px 24px' }}
              description={
                mayCreate
                  ? 'No projects yet. Create the first one to invite its team and import its member schedule.'
                  : 'You are not on any project yet. A project manager adds you by invitation; the project then appears here.'
              }
            >
              {mayCreate && (
                <Button type="primary" onClick={() => setCreating(true)}>
                  New project
                </Button>
              )}
            </Empty>
          ) : (
            <ProjectList projects={projects ?? []} loading={isLoading} />
          )}
        </Card>
      )}

      <Modal
        title="New project"
        open={creating}
        onCancel={() => setCreating(false)}
        footer={null}
        destroyOnHidden
        width={560}
        styles={{ header: { marginBottom: 20 } }}
      >
        <NewProjectForm
          onCancel={() => setCreating(false)}
          onCreated={(project) => {
            setCreating(false);
            void message.success(`Project ${project.name} created.`);
            navigate(paths.projectTeam.getHref(project.id));
          }}
        />
      </Modal>
    </Flex>
  );
}
