import type { LevelSignOff, OverviewCounts, OverviewRevision } from '@sagline/common/api-types';
import type { CountsRow, LatestRevisionRow } from './overview.repository';
import type { SignOffRow } from './sign-offs.repository';

export const EMPTY_COUNTS: CountsRow = { members: 0, pass: 0, fail: 0, unchecked: 0, open: 0, answered: 0, closed: 0, waived: 0, total_flags: 0, overdue: 0 };

/** Closed and waived (nothing left to do) over all flags, one decimal; null without flags. */
export function percentClosed(closed: number, waived: number, total: number): number | null {
  return total === 0 ? null : Math.round(((closed + waived) * 1000) / total) / 10;
}

export function toCounts(r: CountsRow): OverviewCounts {
  return {
    members: r.members,
    pass: r.pass,
    fail: r.fail,
    unchecked: r.unchecked,
    flagsOpen: r.open,
    flagsAnswered: r.answered,
    flagsClosed: r.closed,
    flagsWaived: r.waived,
    flagsTotal: r.total_flags,
    percentClosed: percentClosed(r.closed, r.waived, r.total_flags),
    overdue: r.overdue,
  };
}

export function toSignOff(r: SignOffRow): LevelSignOff {
  return {
    id: r.id,
    level: { id: r.level_id, name: r.level_name },
    state: r.voided_at ? 'voided' : 'signed',
    signedBy: r.signed_by !== null && r.signer_name !== null ? { id: r.signed_by, name: r.signer_name } : null,
    signedAt: r.created_at.toISOString(),
    revisionNumber: r.revision_number,
    comment: r.comment,
    voidedAt: r.voided_at ? r.voided_at.toISOString() : null,
    voidedInRevisionNumber: r.voided_in_revision_number,
    voidedBy: r.voided_by !== null && r.voider_name !== null ? { id: r.voided_by, name: r.voider_name } : null,
    voidReason: r.void_reason,
  };
}

export function toOverviewRevision(r: LatestRevisionRow): OverviewRevision {
  return {
    id: r.id,
    number: r.number,
    label: r.label,
    createdAt: r.created_at.toISOString(),
    uploadedBy: r.uploaded_by !== null && r.uploader_name !== null ? { id: r.uploaded_by, name: r.uploader_name } : null,
    fileName: r.file_name,
    memberCount: r.member_count,
    diff: r.diff?.against ? { againstNumber: r.diff.against.number, added: r.diff.added, removed: r.diff.removed, changed: r.diff.changed, flips: r.diff.flips } : null,
  };
}
