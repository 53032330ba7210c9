import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { UnitSystem, Verdict } from '@sagline/common/api-types';
import type { LimitSet } from '@sagline/common/limits';
import { KNEX } from '../db/db.tokens';

export interface ExportRevision {
  id: number;
  number: number;
  label: string | null;
  created_at: Date;
  file_name: string;
  uploader_name: string | null;
  member_count: number;
  pass_count: number;
  fail_count: number;
  limit_set: LimitSet;
  project_name: string;
  project_number: string;
  unit_system: UnitSystem;
}

export interface ExportMember {
  id: number;
  mark: string;
  level_name: string;
  grid: string | null;
  category: string;
  material: string;
  section: string | null;
  i: number;
  reviewer_email: string | null;
  governing_check: string | null;
  max_utilization: number | null;
  verdict: Verdict | null;
  required_i: number | null;
}

export interface ExportResult {
  member_id: number;
  check_name: string;
  combination: string;
  rule_id: string;
  segment_index: number;
  segment_kind: 'span' | 'overhang';
  segment_from: number;
  segment_to: number;
  x: number;
  deflection: number;
  effective_length: number;
  span_ratio: number | null;
  limit_ratio: number;
  max_abs: number | null;
  plus: number;
  allowed: number;
  utilization: number;
  pass: boolean;
  required_i: number;
}

@Injectable()
export class ExportsRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  revision(projectId: number, revisionId: number): Promise<ExportRevision | undefined> {
    return this.knex('revisions as r')
      .join('projects as p', 'p.id', 'r.project_id')
      .leftJoin('users as u', 'u.id', 'r.uploaded_by')
      .where({ 'r.project_id': projectId, 'r.id': revisionId })
      .first(
        'r.id', 'r.number', 'r.label', 'r.created_at', 'r.file_name', 'u.name as uploader_name', 'r.member_count', 'r.pass_count',
        'r.fail_count', 'r.limit_set', 'p.name as project_name', 'p.number as project_number', 'p.unit_system',
      );
  }

  /** Members bottom level first (by the project's level order), then by mark. */
  members(revisionId: number): Promise<ExportMember[]> {
    return this.knex('members as m')
      .leftJoin('levels as l', 'l.id', 'm.level_id')
      .where('m.revision_id', revisionId)
      .orderByRaw('l.position nulls last, m.level_name, m.mark')
      .select(
        'm.id', 'm.mark', 'm.level_name', 'm.grid', 'm.category', 'm.material', 'm.section', 'm.i', 'm.reviewer_email',
        'm.governing_check', 'm.max_utilization', 'm.verdict', 'm.required_i',
      );
  }

  /** Every result of the revision, by member, check order (as computed) and segment. */
  results(revisionId: number): Promise<ExportResult[]> {
    return this.knex('results')
      .where({ revision_id: revisionId })
      .orderBy([{ column: 'member_id' }, { column: 'id' }])
      .select(
        'member_id', 'check_name', 'combination', 'rule_id', 'segment_index', 'segment_kind', 'segment_from', 'segment_to', 'x', 'deflection',
        'effective_length', 'span_ratio', 'limit_ratio', 'max_abs', 'plus', 'allowed', 'utilization', 'pass', 'required_i',
      );
  }
}
