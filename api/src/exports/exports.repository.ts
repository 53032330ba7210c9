import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { FlagStatus, UnitSystem, Verdict } from '@sagline/common/api-types';
import type { LimitSet } from '@sagline/common/limits';
import { RESULT_FIELDS, type StoredResultRow } from '../checks/results-table';
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

/** A result of the revision, with its member. */
export type ExportResult = StoredResultRow & { member_id: number };

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
      .select('member_id', ...RESULT_FIELDS);
  }

  /** The project and its latest revision (the member facts and limit sources a flags workbook shows). */
  flagsProject(projectId: number): Promise<FlagsExportProject | undefined> {
    return this.knex('projects as p')
      .leftJoin('revisions as r', (j) =>
        j.on('r.project_id', 'p.id').andOn('r.number', this.knex.raw('(select max(number) from revisions where project_id = p.id)')),
      )
      .where('p.id', projectId)
      .first('p.name as project_name', 'p.number as project_number', 'r.id as revision_id', 'r.number as revision_number', 'r.limit_set');
  }

  /**
   * Every flag of the project with its people, its member as the latest
   * revision has it (matched by mark ignoring case), when it was closed (the
   * last move to closed, while closed), and its last written comment (a
   * comment, or the text of a raise, answer, close, reopen or waive).
   * Overdue flags first, then open, answered, closed, waived; by due date, mark.
   */
  flags(projectId: number, latestRevisionId: number | null): Promise<FlagExportRow[]> {
    const k = this.knex;
    return k('flags as f')
      .leftJoin('users as a', 'a.id', 'f.assignee_id')
      .leftJoin('users as rb', 'rb.id', 'f.raised_by')
      .leftJoin('revisions as rr', 'rr.id', 'f.raised_in_revision_id')
      .leftJoin('members as m', (j) => j.on('m.revision_id', k.raw('?', [latestRevisionId ?? 0])).andOn(k.raw('lower(m.mark) = lower(f.mark)')))
      .joinRaw(
        `left join lateral (select e.created_at from flag_events e
           where e.flag_id = f.id and e.kind = 'status' and e.to_status = 'closed' and f.status = 'closed'
           order by e.id desc limit 1) as closed on true`,
      )
      .joinRaw(
        `left join lateral (select e.body, e.created_at, u.name as actor_name from flag_events e left join users u on u.id = e.actor_id
           where e.flag_id = f.id and e.kind in ('comment', 'status') and e.body is not null
           order by e.id desc limit 1) as lc on true`,
      )
      .where('f.project_id', projectId)
      .orderByRaw(
        `${OVERDUE} desc, array_position(array['open', 'answered', 'closed', 'waived'], f.status), f.due_date nulls last, f.mark, f.id`,
      )
      .select(
        'f.id', 'f.mark', 'f.check_name', 'f.title', 'f.status', k.raw(`to_char(f.due_date, 'YYYY-MM-DD') as due_date`),
        k.raw(`${OVERDUE} as overdue`), k.raw(`case when ${OVERDUE} then (now() at time zone 'utc')::date - f.due_date end as days_overdue`),
        'a.name as assignee_name', 'rb.name as raiser_name', 'f.created_at', 'f.updated_at', 'closed.created_at as closed_at',
        'rr.number as raised_in_revision', 'm.level_name', 'm.category', 'm.material', 'm.verdict', 'm.max_utilization', 'm.governing_check',
        'lc.body as last_comment', 'lc.actor_name as last_comment_by', 'lc.created_at as last_comment_at', 'f.waive_reason',
      );
  }
}

/** Open or answered with a due date before today (UTC), as the Flags screen decides it. */
const OVERDUE = `coalesce(f.status in ('open', 'answered') and f.due_date < (now() at time zone 'utc')::date, false)`;

export interface FlagsExportProject {
  project_name: string;
  project_number: string;
  revision_id: number | null;
  revision_number: number | null;
  limit_set: LimitSet | null;
}

export interface FlagExportRow {
  id: number;
  mark: string;
  check_name: string | null;
  title: string;
  status: FlagStatus;
  due_date: string | null;
  overdue: boolean;
  days_overdue: number | null;
  assignee_name: string | null;
  raiser_name: string | null;
  created_at: Date;
  updated_at: Date;
  closed_at: Date | null;
  raised_in_revision: number | null;
  level_name: string | null;
  category: string | null;
  material: string | null;
  verdict: Verdict | null;
  max_utilization: number | null;
  governing_check: string | null;
  last_comment: string | null;
  last_comment_by: string | null;
  last_comment_at: Date | null;
  waive_reason: string | null;
}
