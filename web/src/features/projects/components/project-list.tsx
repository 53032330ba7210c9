import { Table, Tag, Typography } from 'antd';
import { Link } from 'react-router-dom';
import type { ProjectSummary } from '@sagline/common/api-types';
import { paths } from '@/app/paths';
import { RoleTag } from '@/components/role-tag';

export function ProjectList({ projects, loading }: { projects: ProjectSummary[]; loading?: boolean }) {
  return (
    <Table<ProjectSummary>
      rowKey="id"
      loading={loading}
      dataSource={projects}
      pagination={projects.length > 20 ? { pageSize: 20, showSizeChanger: false } : false}
      columns={[
        {
          title: 'Project',
          dataIndex: 'name',
          sorter: (a, b) => a.name.localeCompare(b.name),
          render: (_v, p) => (
            <Link to={paths.projectOverview.getHref(p.id)}>
              <Typography.Text strong style={{ color: 'inherit' }} ellipsis={{ tooltip: p.name }}>
                {p.name}
              </Typography.Text>
            </Link>
          ),
        },
        { title: 'Number', dataIndex: 'number', width: 160, render: (v: string) => <Typography.Text code>{v}</Typography.Text> },
        { title: 'Units', dataIndex: 'unitSystem', width: 120, render: (v: string) => <Tag>{v === 'SI' ? 'SI' : 'US customary'}</Tag> },
        { title: 'My role', dataIndex: 'myRole', width: 140, render: (_v, p) => <RoleTag role={p.myRole} /> },
      ]}
    />
  );
}
