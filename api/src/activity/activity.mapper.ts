import { activityKindOf, type ActivityEntry, type ActivityRefs } from '@sagline/common/api-types';
import type { ActivityRow } from './activity.repository';

const int = (v: unknown): number | null => (typeof v === 'number' && Number.isInteger(v) ? v : typeof v === 'string' && /^\d+$/.test(v) ? Number(v) : null);
const text = (v: unknown): string | null => (typeof v === 'string' && v.trim() !== '' ? v : null);

/** The links an entry's data allows (flag, member mark, revision, level, person, limit set). */
export function activityRefs(action: string, data: Record<string, unknown> | null, subjectName: string | null = null, revisionNumber: number | null = null): ActivityRefs {
  const d = data ?? {};
  const refs: ActivityRefs = {};
  const flagIds = [int(d.flagId), ...(Array.isArray(d.flagIds) ? d.flagIds.map(int) : [])].filter((n): n is number => n !== null);
  if (flagIds.length) refs.flagIds = [...new Set(flagIds)];
  const marks = [text(d.mark), ...(Array.isArray(d.marks) ? d.marks.map(text) : [])].filter((m): m is string => m !== null);
  if (marks.length) refs.marks = [...new Set(marks)];
  const revisionId = int(d.revisionId);
  if (revisionId !== null) refs.revision = { id: revisionId, number: int(d.revisionNumber) ?? (action.startsWith('import.') ? int(d.number) : null) ?? revisionNumber };
  const levelName = text(d.levelName);
  if (levelName !== null) refs.level = { id: int(d.levelId), name: levelName };
  const userId = int(d.userId);
  if (userId !== null) refs.user = { id: userId, name: text(d.userName) ?? subjectName };
  const limitSetId = int(d.limitSetId);
  const limitSetName = text(d.limitSetName);
  if (limitSetId !== null || limitSetName !== null) refs.limitSet = { id: limitSetId, name: limitSetName };
  return refs;
}

export function toActivityEntry(row: ActivityRow): ActivityEntry {
  return {
    id: Number(row.id),
    at: row.created_at.toISOString(),
    actor: row.actor_id !== null ? { id: row.actor_id, name: row.actor_name ?? '' } : null,
    action: row.action,
    kind: activityKindOf(row.action),
    summary: row.summary,
    refs: activityRefs(row.action, row.data, row.subject_name, row.revision_number),
  };
}
