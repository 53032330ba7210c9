import type { LevelSignOff, OverviewLevelRow, OverviewReviewerRow } from '@sagline/common/api-types';
import { paths } from '@/app/paths';
import { formatDateTime } from '@/lib/format';

type Id = number | string;

/** Names of the rows that are not one level or one reviewer. */
export const levelName = (row: OverviewLevelRow) => (row.level === null ? 'Not in the latest revision' : row.level.name);

export const reviewerName = (row: OverviewReviewerRow) =>
  row.reviewer ? row.reviewer.name : row.present ? 'No reviewer on the team' : 'Not in the latest revision';

export const percentText = (p: number | null) => (p === null ? '—' : `${p.toLocaleString('en-GB', { maximumFractionDigits: 1 })} %`);

/** Links of a level row (Members and Flags with the API's own filter names); null where no filtered view exists. */
export function levelLinks(projectId: Id, row: OverviewLevelRow) {
  const id = row.level?.id;
  if (id === null || id === undefined) return null;
  const level = String(id);
  return {
    members: paths.projectMembers.getHref(projectId, { level }),
    pass: paths.projectMembers.getHref(projectId, { level, verdict: 'pass' }),
    fail: paths.projectMembers.getHref(projectId, { level, verdict: 'fail' }),
    open: paths.projectFlags.getHref(projectId, { status: 'open', level }),
    answered: paths.projectFlags.getHref(projectId, { status: 'answered', level }),
    closed: paths.projectFlags.getHref(projectId, { status: 'closed', level }),
    waived: paths.projectFlags.getHref(projectId, { status: 'waived', level }),
    total: paths.projectFlags.getHref(projectId, { level }),
    overdue: paths.projectFlags.getHref(projectId, { overdue: 'true', level }),
  };
}

/** Links of a reviewer row: the Members view of the reviewer (the Flags list has no reviewer filter). */
export function reviewerLinks(projectId: Id, row: OverviewReviewerRow) {
  if (!row.present) return null;
  const reviewer = row.reviewer ? String(row.reviewer.id) : 'none';
  return {
    members: paths.projectMembers.getHref(projectId, { reviewer }),
    pass: paths.projectMembers.getHref(projectId, { reviewer, verdict: 'pass' }),
    fail: paths.projectMembers.getHref(projectId, { reviewer, verdict: 'fail' }),
  };
}

/** One line on a sign-off: "Signed off by Ines Okafor, 2 Dec 2026, 19:40 (revision 3)" or why it no longer holds. */
export function signOffText(s: LevelSignOff): string {
  const by = s.signedBy ? ` by ${s.signedBy.name}` : '';
  if (s.state === 'signed') return `Signed off${by}, ${formatDateTime(s.signedAt)} (revision ${s.revisionNumber})`;
  return `Sign-off void: ${s.voidReason ?? 'no reason recorded'}${s.voidedAt ? ` (${formatDateTime(s.voidedAt)})` : ''}. It was signed${by} at revision ${s.revisionNumber}.`;
}
