import { Timeline, Typography } from 'antd';
import type { FlagEvent, FlagPerson, FlagStatus } from '@sagline/common/api-types';
import { formatDateTime } from '@/lib/format';
import { formatDueDate } from './due-date';
import { FLAG_STATUS_LABELS } from './flag-status-tag';

const person = (p: unknown) => (p && typeof p === 'object' && 'name' in p ? (p as FlagPerson).name : null);
const day = (d: unknown) => (typeof d === 'string' && d ? formatDueDate(d) : null);

/** What happened, in words: "answered", "reassigned from A to B", "Revision 3 changed this member…". */
export function describeEvent(e: FlagEvent): string {
  switch (e.kind) {
    case 'status':
      return statusWords(e.fromStatus, e.toStatus);
    case 'comment':
      return 'commented';
    case 'assign': {
      const from = person(e.data.fromAssignee);
      const to = person(e.data.toAssignee);
      if (!to) return from ? `unassigned it (was ${from})` : 'left it unassigned';
      return from ? `reassigned it from ${from} to ${to}` : `assigned it to ${to}`;
    }
    case 'due': {
      const from = day(e.data.from);
      const to = day(e.data.to);
      if (!to) return from ? `removed the due date (was ${from})` : 'left it without a due date';
      return from ? `moved the due date from ${from} to ${to}` : `set the due date to ${to}`;
    }
    case 'revision':
      return typeof e.data.revisionNumber === 'number' ? `Automatic note, revision ${e.data.revisionNumber}` : 'Automatic note';
  }
}

function statusWords(from: FlagStatus | null, to: FlagStatus | null): string {
  if (!from && to === 'open') return 'raised the flag';
  if (to === 'answered') return 'answered';
  if (to === 'closed') return 'closed the flag';
  if (to === 'waived') return 'waived the flag';
  if (to === 'open') return `reopened the flag (it was ${from ? FLAG_STATUS_LABELS[from].toLowerCase() : 'closed'})`;
  return `changed the status to ${to ?? 'unknown'}`;
}

const COLORS: Partial<Record<string, string>> = { closed: 'green', waived: 'gray', answered: 'blue', open: 'orange' };

/** Every change of a flag, oldest first, with who and when. */
export function FlagHistory({ events }: { events: FlagEvent[] }) {
  return (
    <Timeline
      aria-label="History of the flag"
      items={events.map((e) => ({
        key: e.id,
        color: e.kind === 'revision' ? 'purple' : e.kind === 'status' ? COLORS[e.toStatus ?? ''] ?? 'blue' : 'gray',
        content: (
          <div data-testid={`flag-event-${e.id}`}>
            <div>
              {e.kind === 'revision' ? (
                <Typography.Text strong>{describeEvent(e)}</Typography.Text>
              ) : (
                <>
                  <Typography.Text strong>{e.actor?.name ?? 'Someone no longer on the team'}</Typography.Text> {describeEvent(e)}
                </>
              )}
              <Typography.Text type="secondary" style={{ fontSize: 12 }}>
                {' · '}
                {formatDateTime(e.createdAt)}
              </Typography.Text>
            </div>
            {e.body && (
              <Typography.Paragraph style={{ whiteSpace: 'pre-wrap', marginBottom: 0, marginTop: 2 }}>{e.body}</Typography.Paragraph>
            )}
          </div>
        ),
      }))}
    />
  );
}
