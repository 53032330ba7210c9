import { Tag } from 'antd';
import type { ProjectRole } from '@sagline/common/api-types';
import { ROLE_LABELS } from '@/lib/roles';

const ROLE_COLORS: Record<ProjectRole | 'admin', string> = {
  admin: 'purple',
  manager: 'geekblue',
  engineer: 'cyan',
  checker: 'gold',
  viewer: 'default',
};

export function RoleTag({ role }: { role: ProjectRole | 'admin' }) {
  return (
    <Tag color={ROLE_COLORS[role]} variant="outlined">
      {ROLE_LABELS[role]}
    </Tag>
  );
}
