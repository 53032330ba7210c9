import type { ActivityEntry } from '@sagline/common/api-types';
import type { ActivityRow } from './activity.repository';

export function toActivityEntry(row: ActivityRow): ActivityEntry {
  return {
    id: Number(row.id),
    at: row.created_at.toISOString(),
    actor: row.actor_id !== null ? { id: row.actor_id, name: row.actor_name ?? '' } : null,
    action: row.action,
    summary: row.summary,
  };
}
