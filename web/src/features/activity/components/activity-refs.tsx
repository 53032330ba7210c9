import { Space, Typography } from 'antd';
import { Link } from 'react-router-dom';
import type { ActivityRefs as Refs } from '@sagline/common/api-types';
import { paths } from '@/app/paths';

const SHOWN = 6;

/** The things an entry is about, as links: flags, members, the revision, the level, the person, the limit set. */
export function ActivityRefs({ projectId, refs }: { projectId: number | string; refs: Refs }) {
  const links: { key: string; node: React.ReactNode }[] = [];
  const flagIds = refs.flagIds ?? [];
  for (const id of flagIds.slice(0, SHOWN)) links.push({ key: `f${id}`, node: <Link to={paths.projectFlag.getHref(projectId, id)}>Flag {id}</Link> });
  if (flagIds.length > SHOWN) links.push({ key: 'f+', node: <Link to={paths.projectFlags.getHref(projectId)}>{flagIds.length - SHOWN} more flags</Link> });
  const marks = refs.marks ?? [];
  for (const mark of marks.slice(0, SHOWN)) links.push({ key: `m${mark}`, node: <Link to={paths.projectMember.getHref(projectId, mark)}>Member {mark}</Link> });
  if (marks.length > SHOWN) links.push({ key: 'm+', node: <Typography.Text type="secondary">{marks.length - SHOWN} more members</Typography.Text> });
  if (refs.revision) {
    links.push({
      key: 'r',
      node: <Link to={paths.projectImports.getHref(projectId)}>{refs.revision.number !== null ? `Revision ${refs.revision.number}` : 'The revision'}</Link>,
    });
  }
  if (refs.level) {
    links.push({
      key: 'l',
      node:
        refs.level.id !== null ? (
          <Link to={paths.projectMembers.getHref(projectId, { level: String(refs.level.id) })}>Level {refs.level.name}</Link>
        ) : (
          <span>Level {refs.level.name}</span>
        ),
    });
  }
  if (refs.user) links.push({ key: 'u', node: <Link to={paths.projectTeam.getHref(projectId)}>{refs.user.name ?? `Person ${refs.user.id}`}</Link> });
  if (refs.limitSet) links.push({ key: 's', node: <Link to={paths.projectLimitSets.getHref(projectId)}>Limit set{refs.limitSet.name ? ` ${refs.limitSet.name}` : ''}</Link> });
  if (!links.length) return null;
  return (
    <Space size={[12, 0]} wrap style={{ fontSize: 13 }} aria-label="Links">
      {links.map((l) => (
        <span key={l.key}>{l.node}</span>
      ))}
    </Space>
  );
}
