import { createHash } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { MemberSort, UnitSystem, Verdict } from '@sagline/common/api-types';
import type { LimitSet } from '@sagline/common/limits';
import { RESULT_FIELDS, type StoredResultRow } from '../checks/results-table';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';

/** A revision as the members screens name it. */
export interface RevisionRefRow {
  id: number;
  number: number;
  label: string | null;
  created_at: Date;
}

/** What the Members list shows of one member (SI). */
export interface MemberListRow {
  id: number;
  mark: string;
  level_id: number | null;
  level_name: string;
  grid: string | null;
  category: string;
  material: string;
  section: string | null;
  supports: string;
  spans: number[];
  left_overhang: number;
  right_overhang: number;
  length: number;
  governing_check: string | null;
  max_utilization: number | null;
  verdict: Verdict | null;
  required_i: number | null;
  i: number;
  reviewer_id: number | null;
  reviewer_name: string | null;
  reviewer_email: string | null;
  open_flag_count: number;
}

/** Everything stored of one member. */
export interface MemberFullRow extends MemberListRow {
  revision_id: number;
  e: number;
  depth: number | null;
  camber: number | null;
  notes: string | null;
  source_row: number;
}

export interface MemberLoadRow {
  member_id: number;
  position: number;
  case: string;
  kind: 'point' | 'udl' | 'linear' | 'moment';
  x1: number;
  x2: number | null;
  value1: number;
  value2: number | null;
  source_sheet: string;
  source_row: number;
  source_column: string | null;
}

/** The member of one revision in its project's history (null fields: not in that revision). */
export interface MemberHistoryRow {
  revision_id: number;
  number: number;
  label: string | null;
  created_at: Date;
  member: MemberFullRow | null;
}

/** What a flag needs to know of its member. */
export interface MemberBrief {
  id: number;
  mark: string;
  verdict: Verdict | null;
  governing_check: string | null;
  max_utilization: number | null;
}

const BRIEF_COLUMNS = ['m.id', 'm.mark', 'm.verdict', 'm.governing_check', 'm.max_utilization'];

/** One check of a member: its largest utilisation and whether every segment passes. */
export interface MemberCheckRow {
  check_name: string;
  utilization: number;
  pass: boolean;
}

/**
 * The Members filter, parsed (every list is "any of"; lists left out or
 * empty do not filter). `failingChecks`: the member fails one of them.
 */
export interface MemberFilter {
  levelIds?: number[];
  categories?: string[];
  materials?: string[];
  reviewerIds?: number[];
  /** Also (or only) members without a reviewer on the team. */
  reviewerNone?: boolean;
  verdicts?: ('pass' | 'fail' | 'unchecked')[];
  failingChecks?: string[];
  utilMin?: number;
  utilMax?: number;
  /** Text the mark or the grid contains, ignoring case. */
  q?: string;
}

export interface FacetRows {
  totals: { total: number; pass: number; fail: number; unchecked: number };
  levels: { level_id: number | null; level_name: string; count: number; fail_count: number }[];
  categories: { value: string; count: number; fail_count: number }[];
  materials: { value: string; count: number; fail_count: number }[];
  reviewers: { reviewer_id: number | null; reviewer_name: string | null; count: number; fail_count: number }[];
  failingChecks: { check_name: string; fail_count: number }[];
  checkNames: string[];
}

const LIST_COLUMNS = [
  'm.id', 'm.mark', 'm.level_id', 'm.level_name', 'm.grid', 'm.category', 'm.material', 'm.section', 'm.supports', 'm.spans',
  'm.left_overhang', 'm.right_overhang', 'm.length', 'm.governing_check', 'm.max_utilization', 'm.verdict', 'm.required_i', 'm.i',
  'm.reviewer_id', 'u.name as reviewer_name', 'm.reviewer_email',
];

const FULL_COLUMNS = [...LIST_COLUMNS, 'm.revision_id', 'm.e', 'm.depth', 'm.camber', 'm.notes', 'm.source_row'];

/** Natural mark order (collation from migration 20261202160200, index members_revision_mark_natural_index). */
const MARK_ORDER = 'm.mark collate mark_natural';

/**
 * ORDER BY of each sort. Mark last breaks ties (deterministic collations
 * compare bytes when equal, so marks order totally and pages never overlap).
 * `-utilization` reads members_revision_utilization_index forwards and
 * `utilization` backwards (members without a check count as least utilised).
 */
const ORDER: Record<MemberSort, string> = {
  mark: `${MARK_ORDER} asc`,
  '-mark': `${MARK_ORDER} desc`,
  utilization: `m.max_utilization asc nulls first, ${MARK_ORDER}`,
  '-utilization': `m.max_utilization desc nulls last, ${MARK_ORDER}`,
  level: `l.position asc nulls last, ${MARK_ORDER}`,
  '-level': `l.position desc nulls last, ${MARK_ORDER}`,
  category: `m.category asc, ${MARK_ORDER}`,
  '-category': `m.category desc, ${MARK_ORDER}`,
  material: `m.material asc, ${MARK_ORDER}`,
  '-material': `m.material desc, ${MARK_ORDER}`,
  reviewer: `u.name asc nulls last, ${MARK_ORDER}`,
  '-reviewer': `u.name desc nulls last, ${MARK_ORDER}`,
  verdict: `m.verdict asc nulls last, ${MARK_ORDER}`,
  '-verdict': `m.verdict desc nulls last, ${MARK_ORDER}`,
};

/** `%text%` for ILIKE with the user's own % and _ taken literally. */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/**
 * Reads of committed members: the Members list and facets, one member with
 * its loads, results and history. Flags use the lookups by mark. Every list
 * query stays inside one revision, so the (revision_id, …) indexes apply.
 */
@Injectable()
export class MembersRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  // ------------------------------------------------------------------ revisions

  /** The newest revision of a project (revisions_project_number_unique, read backwards). */
  latestRevision(projectId: number, trx?: Trx): Promise<RevisionRefRow | undefined> {
    return (trx ?? this.knex)('revisions').where({ project_id: projectId }).orderBy('number', 'desc').first('id', 'number', 'label', 'created_at');
  }

  findRevision(projectId: number, revisionId: number): Promise<RevisionRefRow | undefined> {
    return this.knex('revisions').where({ project_id: projectId, id: revisionId }).first('id', 'number', 'label', 'created_at');
  }

  /** The copy of the limit set a revision's verdicts came from. */
  async revisionLimitSet(revisionId: number): Promise<LimitSet | undefined> {
    const row = await this.knex('revisions').where({ id: revisionId }).first('limit_set');
    return row?.limit_set;
  }

  /** Every revision of the project, oldest first. */
  revisionsOf(projectId: number): Promise<RevisionRefRow[]> {
    return this.knex('revisions').where({ project_id: projectId }).orderBy('number', 'asc').select('id', 'number', 'label', 'created_at');
  }

  async unitSystem(projectId: number): Promise<UnitSystem> {
    const row = await this.knex('projects').where({ id: projectId }).first('unit_system');
    return row?.unit_system ?? 'SI';
  }

  // ------------------------------------------------------------------ the list

  private filtered(db: Knex | Trx, revisionId: number | Knex.Raw, f: MemberFilter) {
    const q = db('members as m').where('m.revision_id', revisionId);
    if (f.levelIds?.length) q.whereIn('m.level_id', f.levelIds);
    if (f.categories?.length) q.whereIn('m.category', f.categories);
    if (f.materials?.length) q.whereIn('m.material', f.materials);
    if (f.reviewerIds?.length || f.reviewerNone) {
      q.where((w) => {
        if (f.reviewerIds?.length) w.orWhereIn('m.reviewer_id', f.reviewerIds);
        if (f.reviewerNone) w.orWhereNull('m.reviewer_id');
      });
    }
    if (f.verdicts?.length) {
      const known = f.verdicts.filter((v) => v !== 'unchecked');
      const unchecked = f.verdicts.includes('unchecked');
      q.where((w) => {
        if (known.length) w.orWhereIn('m.verdict', known);
        if (unchecked) w.orWhereNull('m.verdict');
      });
    }
    if (f.failingChecks?.length) {
      // The partial index results_revision_failing_check_index holds exactly these rows.
      q.whereIn(
        'm.id',
        db('results as r').where('r.revision_id', revisionId).whereRaw('not r.pass').whereIn('r.check_name', f.failingChecks).select('r.member_id'),
      );
    }
    if (f.utilMin !== undefined) q.where('m.max_utilization', '>=', f.utilMin);
    if (f.utilMax !== undefined) q.where('m.max_utilization', '<=', f.utilMax);
    if (f.q) {
      const like = containsPattern(f.q);
      q.where((w) => w.whereRaw(`m.mark ilike ? escape '\\'`, [like]).orWhereRaw(`m.grid ilike ? escape '\\'`, [like]));
    }
    return q;
  }

  /** One page of a revision's members, filtered and sorted in SQL, with each mark's open flags counted. */
  listPage(projectId: number, revisionId: number, f: MemberFilter, sort: MemberSort, offset: number, limit: number): Promise<MemberListRow[]> {
    return this.filtered(this.knex, revisionId, f)
      .leftJoin('users as u', 'u.id', 'm.reviewer_id')
      .leftJoin('levels as l', 'l.id', 'm.level_id')
      .select(LIST_COLUMNS)
      .select(this.openFlagCount(projectId))
      .orderByRaw(ORDER[sort])
      .offset(offset)
      .limit(limit);
  }

  /**
   * The Members page in one round trip: the revision (`latest` or an id of
   * the project), the page of its members and their total under the filter.
   * The revision is a CTE read through a scalar subquery (an InitPlan, so the
   * (revision_id, …) indexes still give the sort order and stop at the page)
   * and the total another uncorrelated subquery (run once, on the filter's
   * own index: `count(*) over ()` would read every matching row in sort order).
   * No row back (no such revision, no match, or a page past the end): the
   * caller asks for the revision and the count on their own.
   */
  async listPageOfRevision(
    projectId: number,
    revision: 'latest' | number,
    f: MemberFilter,
    sort: MemberSort,
    offset: number,
    limit: number,
  ): Promise<{ revision: RevisionRefRow; rows: MemberListRow[]; total: number } | null> {
    const k = this.knex;
    const rev =
      revision === 'latest'
        ? k('revisions').where({ project_id: projectId }).orderBy('number', 'desc').limit(1).select('id', 'number', 'label', 'created_at')
        : k('revisions').where({ project_id: projectId, id: revision }).select('id', 'number', 'label', 'created_at');
    const revisionId = k.raw('(select id from rev)');
    const total = this.filtered(k, revisionId, f).count('*');
    const query = this.filtered(k, revisionId, f)
      .with('rev', rev)
      .leftJoin('users as u', 'u.id', 'm.reviewer_id')
      .leftJoin('levels as l', 'l.id', 'm.level_id')
      .select(LIST_COLUMNS)
      .select(this.openFlagCount(projectId))
      .select(
        k.raw('(?)::int as total_count', [total]),
        k.raw('(select number from rev) as rev_number'),
        k.raw('(select label from rev) as rev_label'),
        k.raw('(select created_at from rev) as rev_created_at'),
        k.raw('(select id from rev) as rev_id'),
      )
      .orderByRaw(ORDER[sort])
      .offset(offset)
      .limit(limit);
    // A named (prepared) statement: PostgreSQL parses it once per connection and, after a few runs,
    // keeps a generic plan, so the page costs no planning (planning this statement costs more than
    // running it). The name is the statement's text hashed: one text, one name, whatever the values.
    const rows = await query.options({ name: `members-page-${createHash('sha1').update(query.toSQL().sql).digest('base64url')}` });
    if (rows.length === 0) return null;
    const first = rows[0] as MemberListRow & { total_count: number; rev_id: number; rev_number: number; rev_label: string | null; rev_created_at: Date };
    return {
      revision: { id: first.rev_id, number: first.rev_number, label: first.rev_label, created_at: first.rev_created_at },
      rows: rows as MemberListRow[],
      total: first.total_count,
    };
  }

  async count(revisionId: number, f: MemberFilter): Promise<number> {
    const row = await this.filtered(this.knex, revisionId, f).count<{ count: string }[]>('* as count').first();
    return Number(row?.count ?? 0);
  }

  /** The FAILING members matching a filter (bulk flags), at most `limit`, in mark order. */
  async failingMembers(revisionId: number, f: MemberFilter, limit: number, trx?: Trx): Promise<MemberBrief[]> {
    return this.filtered(trx ?? this.knex, revisionId, { ...f, verdicts: ['fail'] })
      .orderByRaw(ORDER.mark)
      .limit(limit)
      .select(BRIEF_COLUMNS);
  }

  /** Flags of the mark still needing action (flags_project_mark_index), evaluated for the rows of the page only. */
  private openFlagCount(projectId: number): Knex.Raw {
    return this.knex.raw(
      `(select count(*)::int from flags f where f.project_id = ? and lower(f.mark) = lower(m.mark) and f.status in ('open', 'answered')) as open_flag_count`,
      [projectId],
    );
  }

  // ------------------------------------------------------------------ facets

  async facets(revisionId: number): Promise<FacetRows> {
    const k = this.knex;
    const failCount = k.raw(`count(*) filter (where m.verdict = 'fail')::int as fail_count`);
    const [totals, levels, categories, materials, reviewers, failingChecks, checkNames] = await Promise.all([
      k('members as m')
        .where('m.revision_id', revisionId)
        .first(
          k.raw('count(*)::int as total'),
          k.raw(`count(*) filter (where m.verdict = 'pass')::int as pass`),
          k.raw(`count(*) filter (where m.verdict = 'fail')::int as fail`),
          k.raw('count(*) filter (where m.verdict is null)::int as unchecked'),
        ),
      k('members as m')
        .leftJoin('levels as l', 'l.id', 'm.level_id')
        .where('m.revision_id', revisionId)
        .groupBy('m.level_id', 'm.level_name', 'l.position')
        .orderByRaw('l.position asc nulls last, m.level_name')
        .select('m.level_id', 'm.level_name', k.raw('count(*)::int as count'), failCount),
      k('members as m').where('m.revision_id', revisionId).groupBy('m.category').orderBy('m.category').select('m.category as value', k.raw('count(*)::int as count'), failCount),
      k('members as m').where('m.revision_id', revisionId).groupBy('m.material').orderBy('m.material').select('m.material as value', k.raw('count(*)::int as count'), failCount),
      k('members as m')
        .leftJoin('users as u', 'u.id', 'm.reviewer_id')
        .where('m.revision_id', revisionId)
        .groupBy('m.reviewer_id', 'u.name')
        .orderByRaw('u.name asc nulls last')
        .select('m.reviewer_id', 'u.name as reviewer_name', k.raw('count(*)::int as count'), failCount),
      k('results as r')
        .where('r.revision_id', revisionId)
        .whereRaw('not r.pass')
        .groupBy('r.check_name')
        .select('r.check_name', k.raw('count(distinct r.member_id)::int as fail_count')),
      // Check names of the revision's own limit-set copy, for the categories the revision has.
      k.raw<{ rows: { name: string }[] }>(
        `select distinct rule->>'check' as name
           from revisions r, jsonb_array_elements(r.limit_set->'rules') as rule
          where r.id = ? and rule->>'category' in (select distinct category from members where revision_id = ?)
          order by 1`,
        [revisionId, revisionId],
      ),
    ]);
    return {
      totals: totals ?? { total: 0, pass: 0, fail: 0, unchecked: 0 },
      levels,
      categories,
      materials,
      reviewers,
      failingChecks,
      checkNames: checkNames.rows.map((r) => r.name),
    };
  }

  // ------------------------------------------------------------------ one member

  /** A member of a revision by mark, ignoring case (members_revision_mark_unique). */
  findByMark(projectId: number, revisionId: number, mark: string, trx?: Trx): Promise<MemberFullRow | undefined> {
    const db = trx ?? this.knex;
    return db('members as m')
      .leftJoin('users as u', 'u.id', 'm.reviewer_id')
      .where('m.revision_id', revisionId)
      .whereRaw('lower(m.mark) = lower(?)', [mark.trim()])
      .first(...FULL_COLUMNS, this.openFlagCount(projectId));
  }

  /** Members of a revision among these marks (ignoring case), in mark order. */
  findByMarks(revisionId: number, marks: string[], trx?: Trx): Promise<MemberBrief[]> {
    if (marks.length === 0) return Promise.resolve([]);
    return (trx ?? this.knex)('members as m')
      .where('m.revision_id', revisionId)
      .whereRaw('lower(m.mark) = any(?)', [marks.map((m) => m.trim().toLowerCase())])
      .orderByRaw(ORDER.mark)
      .select(BRIEF_COLUMNS);
  }

  /** Each check of a member, with its largest utilisation over the segments. */
  checksOf(memberIds: number[], trx?: Trx): Promise<(MemberCheckRow & { member_id: number })[]> {
    if (memberIds.length === 0) return Promise.resolve([]);
    return (trx ?? this.knex)('results')
      .whereIn('member_id', memberIds)
      .groupBy('member_id', 'check_name')
      .orderBy([{ column: 'member_id' }, { column: 'check_name' }])
      .select('member_id', 'check_name', this.knex.raw('max(utilization) as utilization'), this.knex.raw('bool_and(pass) as pass'));
  }

  loadsOf(memberIds: number[]): Promise<MemberLoadRow[]> {
    if (memberIds.length === 0) return Promise.resolve([]);
    return this.knex('member_loads')
      .whereIn('member_id', memberIds)
      .orderBy([{ column: 'member_id' }, { column: 'position' }])
      .select('member_id', 'position', 'case', 'kind', 'x1', 'x2', 'value1', 'value2', 'source_sheet', 'source_row', 'source_column');
  }

  /** Results in the order the engine produced them (check, then segment). */
  resultsOf(memberId: number): Promise<StoredResultRow[]> {
    return this.knex('results').where({ member_id: memberId }).orderBy('id').select(RESULT_FIELDS);
  }

  /** The mark in every revision of the project, oldest first (one index probe per revision). */
  async historyOf(projectId: number, mark: string): Promise<MemberHistoryRow[]> {
    const rows = await this.knex('revisions as r')
      .leftJoin('members as m', (j) => j.on('m.revision_id', 'r.id').andOn(this.knex.raw('lower(m.mark) = lower(?)', [mark.trim()])))
      .leftJoin('users as u', 'u.id', 'm.reviewer_id')
      .where('r.project_id', projectId)
      .orderBy('r.number', 'asc')
      .select('r.id as rev_id', 'r.number as rev_number', 'r.label as rev_label', 'r.created_at as rev_created_at', ...FULL_COLUMNS, this.knex.raw('0 as open_flag_count'));
    return rows.map((r: MemberFullRow & { rev_id: number; rev_number: number; rev_label: string | null; rev_created_at: Date }) => {
      const { rev_id, rev_number, rev_label, rev_created_at, ...member } = r;
      return { revision_id: rev_id, number: rev_number, label: rev_label, created_at: rev_created_at, member: member.id === null ? null : member };
    });
  }
}
