import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { LimitRule, LimitSet, LimitSetNote } from '@sagline/common/limits';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';
import { writeResultRows } from '../imports/imports.repository';
import type { MemberAnalysis } from './member-analysis';

export interface LimitSetRow {
  id: number;
  project_id: number | null;
  name: string;
  description: string;
  source_preset_id: string | null;
  categories: string[];
  rules: LimitRule[];
  notes: LimitSetNote[];
  version: number;
  created_at: Date;
  updated_at: Date;
}

const SET_COLUMNS = ['s.id', 's.project_id', 's.name', 's.description', 's.source_preset_id', 's.categories', 's.rules', 's.notes', 's.version', 's.created_at', 's.updated_at'];

/** The latest revision of a project, with the set its results were computed with. */
export interface LatestRevisionRow {
  id: number;
  number: number;
  member_count: number;
  pass_count: number;
  fail_count: number;
  limit_set_id: number | null;
  limit_set_name: string;
  /** Whether the revision's copy has the active set's current categories and rules. */
  up_to_date: boolean;
}

/** A member's new summary after a recompute. */
export interface MemberSummaryUpdate {
  id: number;
  governingCheck: string | null;
  maxUtilization: number | null;
  verdict: 'pass' | 'fail' | null;
  requiredI: number | null;
}

/** A stored set in the shape common/src/limits works with (its id is the row id as text). */
export function toLimitSet(row: LimitSetRow): LimitSet {
  return { id: String(row.id), name: row.name, description: row.description, categories: row.categories, rules: row.rules, notes: row.notes };
}

@Injectable()
export class LimitSetsRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  /** The set the project points at, or undefined when it has none yet. */
  findForProject(projectId: number, trx?: Trx): Promise<LimitSetRow | undefined> {
    return (trx ?? this.knex)('limit_sets as s')
      .join('projects as p', 'p.limit_set_id', 's.id')
      .where('p.id', projectId)
      .first(SET_COLUMNS);
  }

  /** Locks the project row for the rest of the transaction (one limit-set copy per project, one commit at a time). */
  async lockProject(trx: Trx, projectId: number): Promise<boolean> {
    const row = await trx('projects').where({ id: projectId }).forUpdate().first('id');
    return row !== undefined;
  }

  /** Stores a copy of a preset as the project's set and points the project at it. */
  async insertProjectCopy(trx: Trx, projectId: number, preset: LimitSet): Promise<void> {
    const [row] = await trx('limit_sets')
      .insert({
        project_id: projectId,
        name: preset.name,
        description: preset.description,
        source_preset_id: preset.id,
        categories: JSON.stringify(preset.categories),
        rules: JSON.stringify(preset.rules),
        notes: JSON.stringify(preset.notes),
      })
      .returning('id');
    await trx('projects').where({ id: projectId }).update({ limit_set_id: row.id });
  }
  /** Every set of the project (its own copies), newest first. */
  listForProject(projectId: number): Promise<LimitSetRow[]> {
    return this.knex('limit_sets as s').where('s.project_id', projectId).orderBy('s.id', 'desc').select(SET_COLUMNS);
  }

  /** One of the project's own sets; `lock` takes a row lock for the rest of the transaction. */
  findOwn(projectId: number, setId: number, trx?: Trx, lock = false): Promise<LimitSetRow | undefined> {
    const q = (trx ?? this.knex)('limit_sets as s').where({ 's.project_id': projectId, 's.id': setId }).first(SET_COLUMNS);
    return lock ? q.forUpdate() : q;
  }

  async activeId(projectId: number, trx?: Trx): Promise<number | null> {
    const row = await (trx ?? this.knex)('projects').where({ id: projectId }).first('limit_set_id');
    return row?.limit_set_id ?? null;
  }

  /** A new set of the project (not made active); returns its id. */
  async insertOwn(trx: Trx, projectId: number, set: Omit<LimitSet, 'id'>, sourcePresetId: string | null): Promise<number> {
    const [row] = await trx('limit_sets')
      .insert({
        project_id: projectId,
        name: set.name,
        description: set.description,
        source_preset_id: sourcePresetId,
        categories: JSON.stringify(set.categories),
        rules: JSON.stringify(set.rules),
        notes: JSON.stringify(set.notes),
      })
      .returning('id');
    return row.id;
  }

  /** Stores an edit when the set is still at `version`; false when it moved on (a stale edit). */
  async updateOwn(trx: Trx, setId: number, version: number, set: Pick<LimitSet, 'name' | 'description' | 'categories' | 'rules'>): Promise<boolean> {
    const n = await trx('limit_sets')
      .where({ id: setId, version })
      .update({
        name: set.name,
        description: set.description,
        categories: JSON.stringify(set.categories),
        rules: JSON.stringify(set.rules),
        version: version + 1,
        updated_at: trx.fn.now(),
      });
    return n > 0;
  }

  /**
   * Deletes one of the project's sets. Revisions checked against it keep their own copy of its rules
   * (`revisions.limit_set`; their `limit_set_id` becomes null); an upload still waiting to be committed
   * against it goes with it (`import_drafts` cascade: such a draft could no longer be committed anyway).
   */
  async deleteOwn(trx: Trx, projectId: number, setId: number): Promise<void> {
    await trx('limit_sets').where({ id: setId, project_id: projectId }).delete();
  }

  async setActive(trx: Trx, projectId: number, setId: number): Promise<void> {
    await trx('projects').where({ id: projectId }).update({ limit_set_id: setId });
  }

  /** The project's latest revision and whether its results follow the active set as it stands. */
  async latestRevision(projectId: number, trx?: Trx): Promise<LatestRevisionRow | undefined> {
    const db = trx ?? this.knex;
    const row = await db('revisions as r')
      .join('projects as p', 'p.id', 'r.project_id')
      .leftJoin('limit_sets as s', 's.id', 'p.limit_set_id')
      .where('r.project_id', projectId)
      .orderBy('r.number', 'desc')
      .first(
        'r.id', 'r.number', 'r.member_count', 'r.pass_count', 'r.fail_count', 'r.limit_set_id',
        db.raw(`r.limit_set->>'name' as limit_set_name`),
        db.raw(`(r.limit_set_id is not distinct from p.limit_set_id and r.limit_set->'rules' = s.rules and r.limit_set->'categories' = s.categories) as up_to_date`),
      );
    return row ? { ...row, up_to_date: row.up_to_date === true } : undefined;
  }

  /** Member ids of a revision by lower-case mark (marks are unique per revision, case ignored). */
  async memberIds(trx: Trx, revisionId: number): Promise<Map<string, number>> {
    const rows: { id: number; mark: string }[] = await trx('members').where({ revision_id: revisionId }).select('id', 'mark');
    return new Map(rows.map((r) => [r.mark.toLowerCase(), r.id]));
  }

  /** Drops a revision's results (through the members' index), before the recompute writes new ones. */
  async deleteResults(trx: Trx, revisionId: number): Promise<void> {
    await trx.raw('delete from results where member_id in (select id from members where revision_id = ?)', [revisionId]);
  }

  /** New results of stored members, with the import's writer (COPY, in this transaction). */
  writeResults(trx: Trx, revisionId: number, memberIds: readonly number[], analyses: readonly MemberAnalysis[], onRows?: (rows: number) => void): Promise<void> {
    return writeResultRows(trx, revisionId, memberIds, analyses, onRows);
  }

  /** The members' summary columns (the Members screen filters on them), in one statement. */
  async updateMemberSummaries(trx: Trx, rows: readonly MemberSummaryUpdate[]): Promise<void> {
    if (rows.length === 0) return;
    await trx.raw(
      `update members m set governing_check = t.g, max_utilization = t.u, verdict = t.v, required_i = t.ri
         from unnest(?::int[], ?::text[], ?::float8[], ?::text[], ?::float8[]) as t(id, g, u, v, ri)
        where m.id = t.id`,
      [rows.map((r) => r.id), rows.map((r) => r.governingCheck), rows.map((r) => r.maxUtilization), rows.map((r) => r.verdict), rows.map((r) => r.requiredI)] as unknown as Knex.Value[],
    );
  }

  /** Points the revision at the set its results now come from, with a copy of it and the new counts. */
  async updateRevisionResults(trx: Trx, revisionId: number, setId: number, set: LimitSet, pass: number, fail: number): Promise<void> {
    await trx('revisions')
      .where({ id: revisionId })
      .update({ limit_set_id: setId, limit_set: JSON.stringify(set), pass_count: pass, fail_count: fail });
  }

  async userName(userId: number | null): Promise<string | null> {
    if (userId === null) return null;
    return (await this.knex('users').where({ id: userId }).first('name'))?.name ?? null;
  }
}
