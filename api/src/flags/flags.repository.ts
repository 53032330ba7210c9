import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { FlagEventKind, FlagSort, FlagStatus, Verdict } from '@sagline/common/api-types';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';
import { containsPattern } from '../members/members.repository';

/** A flag with the people's names and its member in the latest revision (m_* null when the mark is not in it). */
export interface FlagRow {
  id: number;
  project_id: number;
  mark: string;
  check_name: string | null;
  raised_in_revision_id: number | null;
  raised_in_revision_number: number | null;
  status: FlagStatus;
  title: string;
  comment: string | null;
  assignee_id: number | null;
  assignee_name: string | null;
  assignee_email: string | null;
  raised_by: number | null;
  raiser_name: string | null;
  raiser_email: string | null;
  /** "YYYY-MM-DD" (read as text: a `date` has no time zone to shift). */
  due_date: string | null;
  overdue: boolean;
  waive_reason: string | null;
  version: number;
  created_at: Date;
  updated_at: Date;
  m_id: number | null;
  m_level_id: number | null;
  m_level_name: string | null;
  m_category: string | null;
  m_verdict: Verdict | null;
  m_governing_check: string | null;
  m_max_utilization: number | null;
  m_reviewer_id: number | null;
  m_reviewer_name: string | null;
}

export interface FlagEventRow {
  id: string;
  kind: FlagEventKind;
  actor_id: number | null;
  actor_name: string | null;
  from_status: FlagStatus | null;
  to_status: FlagStatus | null;
  body: string | null;
  data: Record<string, unknown>;
  created_at: Date;
}

export interface NewFlag {
  projectId: number;
  mark: string;
  checkName: string | null;
  raisedInRevisionId: number | null;
  title: string;
  comment: string | null;
  assigneeId: number | null;
  raisedBy: number;
  dueDate: string | null;
}

export interface NewFlagEvent {
  flagId: number;
  actorId: number | null;
  kind: FlagEventKind;
  fromStatus?: FlagStatus | null;
  toStatus?: FlagStatus | null;
  body?: string | null;
  data?: Record<string, unknown>;
}

/** Columns a change may set; the version always goes up by one with it. */
export interface FlagChange {
  status?: FlagStatus;
  assigneeId?: number | null;
  dueDate?: string | null;
  waiveReason?: string | null;
}

/** The list filter, parsed. Lists are "any of". */
export interface FlagFilter {
  statuses?: FlagStatus[];
  assigneeIds?: number[];
  unassigned?: boolean;
  /** Level ids of the member in the latest revision. */
  levelIds?: number[];
  /** Text the mark contains, ignoring case. */
  markContains?: string;
  /** The mark exactly, ignoring case (the Member screen's flags). */
  mark?: string;
  checks?: string[];
  overdue?: boolean;
  ids?: number[];
}

export interface PersonRow {
  id: number;
  name: string;
  email: string;
}

/** First key of the advisory lock of flag raises (second key: the project id). Any fixed number; "FLAG" in ASCII. */
const RAISE_LOCK = 0x464c4147;

/** Counts by status, as every summary query selects them. */
const STATUS_COUNTS = [
  `count(*) filter (where f.status = 'open')::int as open`,
  `count(*) filter (where f.status = 'answered')::int as answered`,
  `count(*) filter (where f.status = 'closed')::int as closed`,
  `count(*) filter (where f.status = 'waived')::int as waived`,
];

/** The day in UTC: due dates are calendar dates, and every api process must agree on "today". */
const TODAY = `(now() at time zone 'utc')::date`;
// coalesce: without a due date the comparison is null, and `not null` would drop the flag from "not overdue" too.
const OVERDUE = `coalesce(f.status in ('open', 'answered') and f.due_date < ${TODAY}, false)`;

const ORDER: Record<FlagSort, string> = {
  created: 'f.created_at asc, f.id asc',
  '-created': 'f.created_at desc, f.id desc',
  updated: 'f.updated_at asc, f.id asc',
  '-updated': 'f.updated_at desc, f.id desc',
  due: 'f.due_date asc nulls last, f.id asc',
  '-due': 'f.due_date desc nulls last, f.id desc',
  mark: 'f.mark collate mark_natural asc, f.id asc',
  '-mark': 'f.mark collate mark_natural desc, f.id desc',
  status: `array_position(array['open', 'answered', 'closed', 'waived'], f.status) asc, f.id asc`,
  '-status': `array_position(array['open', 'answered', 'closed', 'waived'], f.status) desc, f.id desc`,
};

export interface SummaryRows {
  totals: { total: number; open: number; answered: number; closed: number; waived: number; overdue: number };
  byLevel: { present: boolean; level_id: number | null; level_name: string | null; open: number; answered: number; closed: number; waived: number }[];
  byAssignee: { assignee_id: number | null; assignee_name: string | null; open: number; answered: number; closed: number; waived: number; overdue: number }[];
}

/** A flag that still follows its member (not closed), with its assignee's address, for automatic notes. */
export interface OpenOrWaivedFlagRow {
  id: number;
  mark: string;
  status: FlagStatus;
  title: string;
  assignee_id: number | null;
  assignee_email: string | null;
}

@Injectable()
export class FlagsRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  /**
   * Flags of a project with people and their member in the latest revision
   * (joined through members_revision_mark_unique; revision 0 matches nothing
   * when there is no revision yet).
   */
  private flags(db: Knex | Trx, projectId: number, latestRevisionId: number | null) {
    const k = this.knex;
    return db('flags as f')
      .leftJoin('members as m', (j) => j.on('m.revision_id', k.raw('?', [latestRevisionId ?? 0])).andOn(k.raw('lower(m.mark) = lower(f.mark)')))
      .where('f.project_id', projectId);
  }

  private withColumns(q: Knex.QueryBuilder): Knex.QueryBuilder {
    const k = this.knex;
    return q
      .leftJoin('users as a', 'a.id', 'f.assignee_id')
      .leftJoin('users as rb', 'rb.id', 'f.raised_by')
      .leftJoin('revisions as rv', 'rv.id', 'f.raised_in_revision_id')
      .leftJoin('users as mr', 'mr.id', 'm.reviewer_id')
      .select(
        'f.id', 'f.project_id', 'f.mark', 'f.check_name', 'f.raised_in_revision_id', 'rv.number as raised_in_revision_number', 'f.status', 'f.title',
        'f.comment', 'f.assignee_id', 'a.name as assignee_name', 'a.email as assignee_email', 'f.raised_by', 'rb.name as raiser_name',
        'rb.email as raiser_email', k.raw(`to_char(f.due_date, 'YYYY-MM-DD') as due_date`), k.raw(`${OVERDUE} as overdue`), 'f.waive_reason',
        'f.version', 'f.created_at', 'f.updated_at', 'm.id as m_id', 'm.level_id as m_level_id', 'm.level_name as m_level_name',
        'm.category as m_category', 'm.verdict as m_verdict', 'm.governing_check as m_governing_check',
        'm.max_utilization as m_max_utilization', 'm.reviewer_id as m_reviewer_id', 'mr.name as m_reviewer_name',
      );
  }

  private filtered(db: Knex | Trx, projectId: number, latestRevisionId: number | null, f: FlagFilter) {
    const q = this.flags(db, projectId, latestRevisionId);
    if (f.statuses?.length) q.whereIn('f.status', f.statuses);
    if (f.assigneeIds?.length || f.unassigned) {
      q.where((w) => {
        if (f.assigneeIds?.length) w.orWhereIn('f.assignee_id', f.assigneeIds);
        if (f.unassigned) w.orWhereNull('f.assignee_id');
      });
    }
    if (f.levelIds?.length) q.whereIn('m.level_id', f.levelIds);
    if (f.markContains) q.whereRaw(`f.mark ilike ? escape '\\'`, [containsPattern(f.markContains)]);
    if (f.mark) q.whereRaw('lower(f.mark) = lower(?)', [f.mark.trim()]);
    if (f.checks?.length) q.whereIn('f.check_name', f.checks);
    if (f.overdue !== undefined) q.whereRaw(f.overdue ? OVERDUE : `not ${OVERDUE}`);
    if (f.ids) q.whereIn('f.id', f.ids);
    return q;
  }

  list(projectId: number, latestRevisionId: number | null, f: FlagFilter, sort: FlagSort, offset: number, limit: number, trx?: Trx): Promise<FlagRow[]> {
    return this.withColumns(this.filtered(trx ?? this.knex, projectId, latestRevisionId, f)).orderByRaw(ORDER[sort]).offset(offset).limit(limit);
  }

  async count(projectId: number, latestRevisionId: number | null, f: FlagFilter): Promise<number> {
    const row = await this.filtered(this.knex, projectId, latestRevisionId, f).count<{ count: string }[]>('* as count').first();
    return Number(row?.count ?? 0);
  }

  /** One flag; `lock` holds its row until the transaction ends (changes take turns). */
  async find(projectId: number, flagId: number, latestRevisionId: number | null, options: { trx?: Trx; lock?: boolean } = {}): Promise<FlagRow | undefined> {
    const q = this.withColumns(this.flags(options.trx ?? this.knex, projectId, latestRevisionId).where('f.id', flagId));
    if (options.lock) q.forUpdate('f');
    return q.first();
  }

  /** Several flags by id, locked, in id order (a fixed order, so two bulk changes cannot deadlock). */
  findMany(trx: Trx, projectId: number, latestRevisionId: number | null, ids: number[]): Promise<FlagRow[]> {
    return this.withColumns(this.flags(trx, projectId, latestRevisionId).whereIn('f.id', ids)).orderBy('f.id').forUpdate('f');
  }

  events(flagId: number, trx?: Trx): Promise<FlagEventRow[]> {
    return (trx ?? this.knex)('flag_events as e')
      .leftJoin('users as u', 'u.id', 'e.actor_id')
      .where('e.flag_id', flagId)
      .orderBy('e.id')
      .select('e.id', 'e.kind', 'e.actor_id', 'u.name as actor_name', 'e.from_status', 'e.to_status', 'e.body', 'e.data', 'e.created_at');
  }

  async summary(projectId: number, latestRevisionId: number | null): Promise<SummaryRows> {
    const k = this.knex;
    const [totals, byLevel, byAssignee] = await Promise.all([
      this.flags(k, projectId, null).first(k.raw('count(*)::int as total'), ...STATUS_COUNTS.map((c) => k.raw(c)), k.raw(`count(*) filter (where ${OVERDUE})::int as overdue`)),
      this.flags(k, projectId, latestRevisionId)
        .leftJoin('levels as l', 'l.id', 'm.level_id')
        .groupBy('m.level_id', 'm.level_name', 'l.position')
        .orderByRaw('l.position asc nulls last, m.level_name asc nulls last')
        .select(k.raw('(m.level_name is not null) as present'), 'm.level_id', 'm.level_name', ...STATUS_COUNTS.map((c) => k.raw(c))),
      this.flags(k, projectId, null)
        .leftJoin('users as a', 'a.id', 'f.assignee_id')
        .groupBy('f.assignee_id', 'a.name')
        .orderByRaw('a.name asc nulls last, f.assignee_id')
        .select('f.assignee_id', 'a.name as assignee_name', ...STATUS_COUNTS.map((c) => k.raw(c)), k.raw(`count(*) filter (where ${OVERDUE})::int as overdue`)),
    ]);
    return { totals: totals ?? { total: 0, open: 0, answered: 0, closed: 0, waived: 0, overdue: 0 }, byLevel, byAssignee };
  }

  /** Flags still needing action on these marks (lower-case) with this check (null matches null). */
  liveFlagsFor(trx: Trx, projectId: number, markKeys: string[], checkName: string | null): Promise<{ id: number; mark: string }[]> {
    if (markKeys.length === 0) return Promise.resolve([]);
    return trx('flags')
      .where({ project_id: projectId })
      .whereIn('status', ['open', 'answered'])
      .whereRaw('lower(mark) = any(?)', [markKeys])
      .whereRaw('check_name is not distinct from ?', [checkName])
      .orderBy('id')
      .select('id', 'mark');
  }

  /** Flags on these marks (lower-case) that are not closed, locked: the ones a new revision notes. */
  openOrWaivedFor(trx: Trx, projectId: number, markKeys: string[]): Promise<OpenOrWaivedFlagRow[]> {
    if (markKeys.length === 0) return Promise.resolve([]);
    return trx('flags as f')
      .leftJoin('users as a', 'a.id', 'f.assignee_id')
      .where('f.project_id', projectId)
      .whereNot('f.status', 'closed')
      .whereRaw('lower(f.mark) = any(?)', [markKeys])
      .orderBy('f.id')
      .forUpdate('f')
      .select('f.id', 'f.mark', 'f.status', 'f.title', 'f.assignee_id', 'a.email as assignee_email');
  }

  // ------------------------------------------------------------------ writes

  /**
   * Raises of one project take turns (a transaction-scoped advisory lock), so
   * two checkers raising the same mark and check at once make one flag, not
   * two. Not the project row: an import commit holds that for its whole run.
   */
  async lockRaising(trx: Trx, projectId: number): Promise<void> {
    await trx.raw('select pg_advisory_xact_lock(?, ?)', [RAISE_LOCK, projectId]);
  }

  async insertFlags(trx: Trx, flags: NewFlag[]): Promise<number[]> {
    if (flags.length === 0) return [];
    const rows = await trx('flags')
      .insert(
        flags.map((f) => ({
          project_id: f.projectId,
          mark: f.mark,
          check_name: f.checkName,
          raised_in_revision_id: f.raisedInRevisionId,
          title: f.title,
          comment: f.comment,
          assignee_id: f.assigneeId,
          raised_by: f.raisedBy,
          due_date: f.dueDate,
        })),
      )
      .returning('id');
    return rows.map((r: { id: number }) => r.id);
  }

  async insertEvents(trx: Trx, events: NewFlagEvent[]): Promise<void> {
    if (events.length === 0) return;
    await trx('flag_events').insert(
      events.map((e) => ({
        flag_id: e.flagId,
        actor_id: e.actorId,
        kind: e.kind,
        from_status: e.fromStatus ?? null,
        to_status: e.toStatus ?? null,
        body: e.body ?? null,
        data: JSON.stringify(e.data ?? {}),
      })),
    );
  }

  /** Applies a change and moves the version on by one. */
  async update(trx: Trx, flagIds: number[], change: FlagChange): Promise<void> {
    const set: Record<string, unknown> = { version: trx.raw('version + 1'), updated_at: trx.fn.now() };
    if (change.status !== undefined) set.status = change.status;
    if (change.assigneeId !== undefined) set.assignee_id = change.assigneeId;
    if (change.dueDate !== undefined) set.due_date = change.dueDate;
    if (change.waiveReason !== undefined) set.waive_reason = change.waiveReason;
    await trx('flags').whereIn('id', flagIds).update(set);
  }

  // ------------------------------------------------------------------ people and project

  /** The person, when they hold the engineer role on the project (flags are assigned to engineers). */
  engineer(trx: Trx, projectId: number, userId: number): Promise<PersonRow | undefined> {
    return trx('project_roles as r')
      .join('users as u', 'u.id', 'r.user_id')
      .where({ 'r.project_id': projectId, 'r.user_id': userId, 'r.role': 'engineer' })
      .first('u.id', 'u.name', 'u.email');
  }

  async projectName(projectId: number, trx?: Trx): Promise<string> {
    const row = await (trx ?? this.knex)('projects').where({ id: projectId }).first('name');
    return row?.name ?? '';
  }

  // ------------------------------------------------------------------ demo

  async projectIdByNumber(number: string): Promise<number | undefined> {
    return (await this.knex('projects').where({ number }).orderBy('id').first('id'))?.id;
  }

  async hasFlags(projectId: number): Promise<boolean> {
    return (await this.knex('flags').where({ project_id: projectId }).first('id')) !== undefined;
  }

  /** The team with roles, by name: who the demo flags are raised by and assigned to. */
  team(projectId: number): Promise<(PersonRow & { role: string })[]> {
    return this.knex('project_roles as r').join('users as u', 'u.id', 'r.user_id').where('r.project_id', projectId).orderBy('u.name').select('u.id', 'u.name', 'u.email', 'r.role');
  }

  revision(trx: Trx, revisionId: number): Promise<{ id: number; number: number; project_id: number } | undefined> {
    return trx('revisions').where({ id: revisionId }).first('id', 'number', 'project_id');
  }
}
