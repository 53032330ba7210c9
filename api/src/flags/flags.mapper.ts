import type { Flag, FlagDetail, FlagEvent, FlagSummary } from '@sagline/common/api-types';
import type { FlagEventRow, FlagRow, SummaryRows } from './flags.repository';

export function toFlag(row: FlagRow): Flag {
  return {
    id: row.id,
    projectId: row.project_id,
    mark: row.mark,
    checkName: row.check_name,
    title: row.title,
    comment: row.comment,
    status: row.status,
    assignee: row.assignee_id !== null ? { id: row.assignee_id, name: row.assignee_name ?? '' } : null,
    raisedBy: row.raised_by !== null ? { id: row.raised_by, name: row.raiser_name ?? '' } : null,
    dueDate: row.due_date,
    overdue: row.overdue,
    waiveReason: row.waive_reason,
    raisedInRevision: row.raised_in_revision_id !== null ? { id: row.raised_in_revision_id, number: row.raised_in_revision_number ?? 0 } : null,
    member:
      row.m_id === null
        ? null
        : {
            level: { id: row.m_level_id, name: row.m_level_name ?? '' },
            category: row.m_category ?? '',
            verdict: row.m_verdict,
            governingCheck: row.m_governing_check,
            maxUtilization: row.m_max_utilization,
            reviewer: row.m_reviewer_id !== null ? { id: row.m_reviewer_id, name: row.m_reviewer_name ?? '' } : null,
          },
    version: row.version,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
}

export function toFlagEvent(row: FlagEventRow): FlagEvent {
  return {
    id: Number(row.id),
    kind: row.kind,
    actor: row.actor_id !== null ? { id: row.actor_id, name: row.actor_name ?? '' } : null,
    fromStatus: row.from_status,
    toStatus: row.to_status,
    body: row.body,
    data: row.data,
    createdAt: row.created_at.toISOString(),
  };
}

export function toFlagDetail(row: FlagRow, events: FlagEventRow[]): FlagDetail {
  return { ...toFlag(row), events: events.map(toFlagEvent) };
}

export function toFlagSummary(rows: SummaryRows): FlagSummary {
  const { total, overdue, open, answered, closed, waived } = rows.totals;
  return {
    total,
    byStatus: { open, answered, closed, waived },
    overdue,
    byLevel: rows.byLevel.map((r) => ({
      level: r.present ? { id: r.level_id, name: r.level_name ?? '' } : null,
      open: r.open,
      answered: r.answered,
      closed: r.closed,
      waived: r.waived,
    })),
    byAssignee: rows.byAssignee.map((r) => ({
      assignee: r.assignee_id !== null ? { id: r.assignee_id, name: r.assignee_name ?? '' } : null,
      open: r.open,
      answered: r.answered,
      closed: r.closed,
      waived: r.waived,
      overdue: r.overdue,
    })),
  };
}
