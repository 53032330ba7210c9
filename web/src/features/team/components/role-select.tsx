import type { CSSProperties } from 'react';
import { Select, Typography } from 'antd';
import { PROJECT_ROLES, type ProjectRole } from '@sagline/common/api-types';
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from '@/lib/roles';

export const roleOptions = PROJECT_ROLES.map((r) => ({
  value: r,
  label: ROLE_LABELS[r],
  description: ROLE_DESCRIPTIONS[r],
}));

export function RoleSelect(props: {
  value?: ProjectRole;
  onChange?: (role: ProjectRole) => void;
  disabled?: boolean;
  loading?: boolean;
  'aria-label'?: string;
  style?: CSSProperties;
}) {
  return (
    <Select<ProjectRole>
      {...props}
      options={roleOptions}
      popupMatchSelectWidth={false}
      optionRender={(o) => (
        <div>
          <div>{o.data.label}</div>
          <Typography.Text type="secondary" style={{ fontSize: 12 }}>
            {o.data.description}
          </Typography.Text>
        </div>
      )}
    />
  );
}
