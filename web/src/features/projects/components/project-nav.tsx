import { Menu } from 'antd';
import { Link, useLocation } from 'react-router-dom';
import { paths } from '@/app/paths';

const SECTIONS = [
  { key: 'overview', label: 'Overview', href: paths.projectOverview.getHref },
  { key: 'members', label: 'Members', href: paths.projectMembers.getHref },
  { key: 'imports', label: 'Imports', href: paths.projectImports.getHref },
  { key: 'flags', label: 'Flags', href: paths.projectFlags.getHref },
  { key: 'limit-sets', label: 'Limit sets', href: paths.projectLimitSets.getHref },
  { key: 'activity', label: 'Activity', href: paths.projectActivity.getHref },
  { key: 'team', label: 'Team', href: paths.projectTeam.getHref },
] as const;

export function ProjectNav({ projectId }: { projectId: number | string }) {
  const { pathname } = useLocation();
  const current = SECTIONS.find((s) => pathname.startsWith(s.href(projectId)))?.key;
  return (
    <Menu
      mode="horizontal"
      aria-label="Project sections"
      selectedKeys={current ? [current] : []}
      style={{ background: 'transparent', borderBottomColor: '#d9e0e4' }}
      items={SECTIONS.map((s) => ({ key: s.key, label: <Link to={s.href(projectId)}>{s.label}</Link> }))}
    />
  );
}
