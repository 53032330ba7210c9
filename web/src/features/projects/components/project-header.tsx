import { Flex, Tag, Typography } from 'antd';
import { Link } from 'react-router-dom';
import type { Project } from '@sagline/common/api-types';
import { paths } from '@/app/paths';
import { RoleTag } from '@/components/role-tag';

export function ProjectHeader({ project }: { project: Project }) {
  return (
    <Flex vertical gap={4}>
      <Link to={paths.projects.getHref()} style={{ fontSize: 13, width: 'fit-content' }}>
        ← All projects
      </Link>
      <Flex align="baseline" gap={16} wrap style={{ rowGap: 4 }}>
        <Typography.Title level={2} style={{ margin: 0, minWidth: 0, maxWidth: '100%' }} ellipsis={{ tooltip: project.name }}>
          {project.name}
        </Typography.Title>
        <Flex align="center" gap={8} wrap>
          <Typography.Text type="secondary">No. {project.number}</Typography.Text>
          <Tag>{project.unitSystem === 'SI' ? 'SI' : 'US customary'}</Tag>
          <Typography.Text type="secondary">My role</Typography.Text>
          <RoleTag role={project.myRole} />
        </Flex>
      </Flex>
    </Flex>
  );
}
