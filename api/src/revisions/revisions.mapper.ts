import type { RevisionDetail, RevisionSummary } from '@sagline/common/api-types';
import type { RevisionDetailRow, RevisionRow } from './revisions.repository';

export function toRevisionSummary(row: RevisionRow): RevisionSummary {
  return {
    id: row.id,
    number: row.number,
    label: row.label,
    uploadedBy: row.uploaded_by !== null ? { id: row.uploaded_by, name: row.uploader_name ?? '' } : null,
    createdAt: row.created_at.toISOString(),
    fileName: row.file_name,
    fileType: row.file_type,
    fileSize: row.file_size,
    memberCount: row.member_count,
    passCount: row.pass_count,
    failCount: row.fail_count,
    status: row.status,
  };
}

export function toRevisionDetail(row: RevisionDetailRow): RevisionDetail {
  const { flipped, ...counts } = row.diff;
  return {
    ...toRevisionSummary(row),
    parseReport: row.parse_report,
    diff: { ...counts, flipped },
    limitSet: { id: row.limit_set_id ?? 0, name: row.limit_set.name },
  };
}
