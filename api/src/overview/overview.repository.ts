import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';

/** Counts of one group, as every overview query selects them. */
export interface CountsRow {
  members: number;
  pass: number;
  fail: number;
  unchecked: number;
  open: number;
  answered: number;
  closed: number;
  waived: number;
  total_flags: number;
  overdue: number;
}

/** One row of the grouped overview query: a level group, a reviewer group, or the totals. */
export interface OverviewGroupRow extends CountsRow {
  /** 'level', 'reviewer' or 'total'. */
  grp: 'level' | 'reviewer' | 'total';
  /** false: flags whose mark is not in the latest revision. */
  present: boolean | null;
  level_id: number | null;
  level_name: string | null;
  reviewer_id: number | null;
  reviewer_name: string | null;
  reviewer_email: string | null;
}

export interface LatestRevisionRow {
  id: number;
  number: number;
  label: string | null;
  created_at: Date;
  file_name: string;
  member_count: number;
  diff: { against: { id: number; number: number } | null; added: number; removed: number; changed: number; flips: number } | null;
  uploaded_by: number | null;
  uploader_name: string | null;
}

export interface DayRow {
  day: string;
  open: number;
  answered: number;
  closed: number;
  waived: number;
  raised: number;
}

/** The day in UTC (flags' due dates are calendar dates; every api process agrees on "today"). */
const TODAY = `(now() at time zone 'utc')::date`;

/**
 * The Overview's reads. Every count is one SQL aggregate: the latest
 * revision's members (members_revision_* indexes, one revision) full-joined
 * to the project's flags counted per mark (flags_project_mark_index), grouped
 * by level, by reviewer and in total in ONE pass (grouping sets).
 */
@Injectable()
export class OverviewRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  project(projectId: number): Promise<{ id: number; name: string; number: string } | undefined> {
    return this.knex('projects').where({ id: projectId }).first('id', 'name', 'number');
  }

  latestRevision(projectId: number): Promise<LatestRevisionRow | undefined> {
    return this.knex('revisions as r')
      .leftJoin('users as u', 'u.id', 'r.uploaded_by')
      .where('r.project_id', projectId)
      .orderBy('r.number', 'desc')
      .first('r.id', 'r.number', 'r.label', 'r.created_at', 'r.file_name', 'r.member_count', 'r.diff', 'r.uploaded_by', 'u.name as uploader_name');
  }

  levels(projectId: number): Promise<{ id: number; name: string; position: number }[]> {
    return this.knex('levels').where({ project_id: projectId }).orderBy('position').select('id', 'name', 'position');
  }

  async today(): Promise<string> {
    const { rows } = await this.knex.raw<{ rows: { today: string }[] }>(`select to_char(${TODAY}, 'YYYY-MM-DD') as today`);
    return rows[0].today;
  }

  /**
   * Members and flags counted per level, per reviewer and in total, in two
   * aggregates run side by side: the revision's members grouped three ways
   * in one pass (grouping sets, members_revision_* index), and the project's
   * flags counted per mark, each mark looked up in the revision through
   * members_revision_mark_unique (one index probe per flagged mark: cheaper
   * than hashing every member's mark), grouped the same three ways. A flag
   * counts on its member's level and reviewer in `revisionId`; flags of marks
   * not in it make the `present = false` groups. Revision 0 (none yet): no
   * members, every flag absent. The service joins the two by group.
   */
  async grouped(projectId: number, revisionId: number | null): Promise<OverviewGroupRow[]> {
    const [members, flags] = await Promise.all([
      this.knex.raw<{ rows: OverviewGroupRow[] }>(
        `select g.*, u.name as reviewer_name, u.email as reviewer_email from (
         select case when grouping(m.reviewer_id) = 1 and grouping(m.level_id) = 0 then 'level'
                     when grouping(m.reviewer_id) = 0 then 'reviewer' else 'total' end as grp,
                true as present, m.level_id, m.level_name, m.reviewer_id,
                count(*)::int as members,
                count(*) filter (where m.verdict = 'pass')::int as pass,
                count(*) filter (where m.verdict = 'fail')::int as fail,
                count(*) filter (where m.verdict is null)::int as unchecked,
                0 as open, 0 as answered, 0 as closed, 0 as waived, 0 as total_flags, 0 as overdue
           from members m
          where m.revision_id = ?
          group by grouping sets ((m.level_id, m.level_name), (m.reviewer_id), ())
         ) g left join users u on u.id = g.reviewer_id`,
        [revisionId ?? 0],
      ),
      this.knex.raw<{ rows: OverviewGroupRow[] }>(
        `with fl as (
           select lower(f.mark) as k,
                  count(*) filter (where f.status = 'open') as open,
                  count(*) filter (where f.status = 'answered') as answered,
                  count(*) filter (where f.status = 'closed') as closed,
                  count(*) filter (where f.status = 'waived') as waived,
                  count(*) filter (where f.status in ('open', 'answered') and f.due_date < ${TODAY}) as overdue
             from flags f
            where f.project_id = ?
            group by lower(f.mark)
         )
         select case when grouping(j.present) = 1 then 'total' when grouping(j.reviewer_id) = 1 then 'level' else 'reviewer' end as grp,
                j.present, j.level_id, j.level_name, j.reviewer_id, null as reviewer_name, null as reviewer_email,
                0 as members, 0 as pass, 0 as fail, 0 as unchecked,
                sum(j.open)::int as open, sum(j.answered)::int as answered, sum(j.closed)::int as closed, sum(j.waived)::int as waived,
                sum(j.open + j.answered + j.closed + j.waived)::int as total_flags, sum(j.overdue)::int as overdue
           from (
             select (m.k is not null) as present, m.level_id, m.level_name, m.reviewer_id, fl.open, fl.answered, fl.closed, fl.waived, fl.overdue
               from fl
               -- limit 1 keeps the lookup a per-mark index probe (the mark is unique per revision anyway).
               left join lateral (
                 select lower(m.mark) as k, m.level_id, m.level_name, m.reviewer_id
                   from members m
                  where m.revision_id = ? and lower(m.mark) = fl.k
                  limit 1
               ) m on true
           ) j
          group by grouping sets ((j.present, j.level_id, j.level_name), (j.present, j.reviewer_id), ())
         having count(*) > 0`,
        [projectId, revisionId ?? 0],
      ),
    ]);
    return [...members.rows, ...flags.rows];
  }

  /**
   * How many flags were in each status at the end of each day (UTC), from
   * `from` to today: every status event moves one flag from its old status to
   * its new one, so a running sum of those moves per day is the count. Days
   * before `from` are summed too (they give the starting counts).
   */
  async flagsOverTime(projectId: number, days: number): Promise<DayRow[]> {
    const { rows } = await this.knex.raw<{ rows: DayRow[] }>(
      `with ev as (
         select (e.created_at at time zone 'utc')::date as day, e.from_status, e.to_status
           from flags f
           join flag_events e on e.flag_id = f.id
          where f.project_id = ? and e.kind = 'status'
       ),
       moves as (
         select day, to_status as status, 1 as delta, (from_status is null)::int as raised from ev where to_status is not null
         union all
         select day, from_status, -1, 0 from ev where from_status is not null
       ),
       per_day as (
         select day,
                coalesce(sum(delta) filter (where status = 'open'), 0) as open,
                coalesce(sum(delta) filter (where status = 'answered'), 0) as answered,
                coalesce(sum(delta) filter (where status = 'closed'), 0) as closed,
                coalesce(sum(delta) filter (where status = 'waived'), 0) as waived,
                sum(raised) as raised
           from moves
          group by day
       ),
       series as (
         select s.day::date as day
           from generate_series(least((select min(day) from ev), ${TODAY} - ?::int), ${TODAY}, interval '1 day') as s(day)
       ),
       running as (
         select s.day,
                sum(coalesce(p.open, 0)) over w as open,
                sum(coalesce(p.answered, 0)) over w as answered,
                sum(coalesce(p.closed, 0)) over w as closed,
                sum(coalesce(p.waived, 0)) over w as waived,
                coalesce(p.raised, 0) as raised
           from series s left join per_day p on p.day = s.day
         window w as (order by s.day)
       )
       select to_char(day, 'YYYY-MM-DD') as day, open::int, answered::int, closed::int, waived::int, raised::int
         from running
        where day > ${TODAY} - ?::int
        order by day`,
      [projectId, days, days],
    );
    return rows;
  }
}
