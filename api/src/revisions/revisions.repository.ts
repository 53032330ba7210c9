import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { ImportFileType, ImportProblem, Verdict } from '@sagline/common/api-types';
import type { LimitSet } from '@sagline/common/limits';
import type { ScheduleLoad, ScheduleMember } from '@sagline/common/schedule';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';
import type { MemberAnalysis } from '../checks/member-analysis';

export interface RevisionRow {
  id: number;
  project_id: number;
  number: number;
  label: string | null;
  uploaded_by: number | null;
  uploader_name: string | null;
  created_at: Date;
  file_name: string;
  file_type: ImportFileType;
  file_size: number;
  member_count: number;
  pass_count: number;
  fail_count: number;
  status: 'committed';
  limit_set_id: number | null;
}

export interface RevisionDetailRow extends RevisionRow {
  parse_report: { problems: ImportProblem[]; memberRows: number; loadRows: number };
  diff: StoredDiff;
  limit_set: LimitSet;
}

/** The diff kept with a revision: counts, and the marks that flipped. */
export interface StoredDiff {
  against: { id: number; number: number } | null;
  added: number;
  removed: number;
  changed: number;
  flips: number;
  flipped: { mark: string; level: string; from: Verdict; to: Verdict; governingCheck: string | null; maxUtilization: number | null }[];
}

export interface NewRevision {
  projectId: number;
  number: number;
  label: string | null;
  uploadedBy: number;
  fileName: string;
  fileType: ImportFileType;
  fileBytes: Buffer;
  parseReport: RevisionDetailRow['parse_report'];
  diff: StoredDiff;
  limitSetId: number;
  limitSet: LimitSet;
  memberCount: number;
  passCount: number;
  failCount: number;
  sourceDraftId: string;
}

/** A member of a stored revision in the parser's shape, with its verdict (for diffs). */
export interface StoredMember {
  member: ScheduleMember;
  verdict: Verdict | null;
  governingCheck: string | null;
  maxUtilization: number | null;
}

/** Members to write: what the parser read, its level and reviewer ids, and the engine's results. */
export interface MemberToWrite {
  member: ScheduleMember;
  levelId: number | null;
  reviewerId: number | null;
  analysis: MemberAnalysis;
}

const REVISION_COLUMNS = [
  'r.id', 'r.project_id', 'r.number', 'r.label', 'r.uploaded_by', 'u.name as uploader_name', 'r.created_at', 'r.file_name',
  'r.file_type', 'r.file_size', 'r.member_count', 'r.pass_count', 'r.fail_count', 'r.status', 'r.limit_set_id',
];

@Injectable()
export class RevisionsRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  // ------------------------------------------------------------------ reads

  listByProject(projectId: number): Promise<RevisionRow[]> {
    return this.knex('revisions as r')
      .leftJoin('users as u', 'u.id', 'r.uploaded_by')
      .where('r.project_id', projectId)
      .orderBy('r.number', 'desc')
      .select(REVISION_COLUMNS);
  }

  find(projectId: number, revisionId: number, trx?: Trx): Promise<RevisionDetailRow | undefined> {
    return (trx ?? this.knex)('revisions as r')
      .leftJoin('users as u', 'u.id', 'r.uploaded_by')
      .where({ 'r.project_id': projectId, 'r.id': revisionId })
      .first([...REVISION_COLUMNS, 'r.parse_report', 'r.diff', 'r.limit_set']);
  }

  findFile(projectId: number, revisionId: number): Promise<{ file_name: string; file_type: ImportFileType; file_bytes: Buffer } | undefined> {
    return this.knex('revisions').where({ project_id: projectId, id: revisionId }).first('file_name', 'file_type', 'file_bytes');
  }

  /** The revision a draft became, if its commit already happened (a retried job). */
  findBySourceDraft(trx: Trx | undefined, draftId: string): Promise<RevisionRow | undefined> {
    return (trx ?? this.knex)('revisions as r').leftJoin('users as u', 'u.id', 'r.uploaded_by').where('r.source_draft_id', draftId).first(REVISION_COLUMNS);
  }

  latest(projectId: number, trx?: Trx): Promise<{ id: number; number: number; label: string | null } | undefined> {
    return (trx ?? this.knex)('revisions').where({ project_id: projectId }).orderBy('number', 'desc').first('id', 'number', 'label');
  }

  /** Every member of a revision with its loads, in the parser's shape (for diffs), in sheet order. */
  async membersOf(revisionId: number, trx?: Trx): Promise<StoredMember[]> {
    const db = trx ?? this.knex;
    const rows = await db('members').where({ revision_id: revisionId }).orderBy('source_row').select(
      'id', 'mark', 'level_name', 'grid', 'category', 'material', 'section', 'spans', 'left_overhang', 'right_overhang', 'supports',
      'e', 'i', 'depth', 'camber', 'reviewer_email', 'notes', 'source_row', 'verdict', 'governing_check', 'max_utilization',
    );
    const loads = await db('member_loads as l')
      .join('members as m', 'm.id', 'l.member_id')
      .where('m.revision_id', revisionId)
      .orderBy([{ column: 'l.member_id' }, { column: 'l.position' }])
      .select('l.member_id', 'l.case', 'l.kind', 'l.x1', 'l.x2', 'l.value1', 'l.value2', 'l.source_sheet', 'l.source_row', 'l.source_column');
    const byMember = new Map<number, ScheduleLoad[]>();
    for (const l of loads) {
      const origin = { sheet: l.source_sheet, row: l.source_row, ...(l.source_column ? { column: l.source_column } : {}) };
      const load: ScheduleLoad =
        l.kind === 'point' ? { case: l.case, kind: 'point', x: l.x1, P: l.value1, origin }
        : l.kind === 'moment' ? { case: l.case, kind: 'moment', x: l.x1, M: l.value1, origin }
        : l.kind === 'udl' ? { case: l.case, kind: 'udl', x1: l.x1, x2: l.x2, w: l.value1, origin }
        : { case: l.case, kind: 'linear', x1: l.x1, x2: l.x2, w1: l.value1, w2: l.value2, origin };
      const list = byMember.get(l.member_id);
      if (list) list.push(load);
      else byMember.set(l.member_id, [load]);
    }
    return rows.map((r) => ({
      member: {
        mark: r.mark,
        level: r.level_name,
        grid: r.grid,
        category: r.category,
        material: r.material,
        section: r.section,
        spans: r.spans,
        leftOverhang: r.left_overhang,
        rightOverhang: r.right_overhang,
        supports: r.supports,
        E: r.e,
        I: r.i,
        depth: r.depth,
        camber: r.camber,
        loads: byMember.get(r.id) ?? [],
        reviewerEmail: r.reviewer_email,
        notes: r.notes,
        sourceRow: r.source_row,
      },
      verdict: r.verdict,
      governingCheck: r.governing_check,
      maxUtilization: r.max_utilization,
    }));
  }

  // ------------------------------------------------------------------ writes (inside the commit's transaction)

  /** Locks the project row: commits of one project take turns, so revision numbers are consecutive. */
  async lockProject(trx: Trx, projectId: number): Promise<boolean> {
    return (await trx('projects').where({ id: projectId }).forUpdate().first('id')) !== undefined;
  }

  async nextNumber(trx: Trx, projectId: number): Promise<number> {
    const row = await trx('revisions').where({ project_id: projectId }).max<{ max: number | null }>('number as max').first();
    return (row?.max ?? 0) + 1;
  }

  async insertRevision(trx: Trx, r: NewRevision): Promise<number> {
    const [row] = await trx('revisions')
      .insert({
        project_id: r.projectId,
        number: r.number,
        label: r.label,
        uploaded_by: r.uploadedBy,
        file_name: r.fileName,
        file_type: r.fileType,
        file_size: r.fileBytes.length,
        file_bytes: r.fileBytes,
        parse_report: JSON.stringify(r.parseReport),
        diff: JSON.stringify(r.diff),
        limit_set_id: r.limitSetId,
        limit_set: JSON.stringify(r.limitSet),
        member_count: r.memberCount,
        pass_count: r.passCount,
        fail_count: r.failCount,
        source_draft_id: r.sourceDraftId,
      })
      .returning('id');
    return row.id;
  }
}
