import { promisify } from 'node:util';
import { gunzipSync, gzip } from 'node:zlib';
import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { ImportFileType, ImportProblem, UnitSystem } from '@sagline/common/api-types';
import type { ScheduleMember } from '@sagline/common/schedule';
import { RESULT_FIELDS, resultValues } from '../checks/results-table';
import { copyRows } from '../db/copy-rows';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';
import type { MemberToWrite } from '../revisions/revisions.repository';

const gzipAsync = promisify(gzip);

/**
 * A draft's members as its `members_gz`: JSON, gzip at the fastest level (the
 * point is to keep PostgreSQL from parsing and compressing 5 MB of JSON). The
 * compression runs on libuv's thread pool, so the preview starts it before
 * the engine runs and it goes on on another core meanwhile.
 */
export function packMembers(members: readonly ScheduleMember[]): Promise<Buffer> {
  return gzipAsync(JSON.stringify(members), { level: 1 });
}

export interface ProjectContext {
  id: number;
  name: string;
  unitSystem: UnitSystem;
  levels: { id: number; name: string }[];
  /** Team members by lower-case e-mail (reviewers are matched against them). */
  team: Map<string, number>;
}

export interface DraftHeader {
  id: string;
  project_id: number;
  uploaded_by: number;
  file_name: string;
  file_type: ImportFileType;
  file_size: number;
  unit_system: UnitSystem;
  limit_set_id: number;
  limit_set_version: number;
  member_count: number;
  load_row_count: number;
  created_at: Date;
  expires_at: Date;
}

/** What the preview showed, in counts (kept with the draft for the record). */
export interface DraftSummary {
  pass: number;
  fail: number;
  unchecked: number;
  against: number | null;
  added: number;
  removed: number;
  changed: number;
  flips: number;
}

export interface Draft extends DraftHeader {
  file_bytes: Buffer;
  problems: ImportProblem[];
  summary: DraftSummary;
}

export interface NewDraft {
  id: string;
  projectId: number;
  uploadedBy: number;
  fileName: string;
  fileType: ImportFileType;
  fileBytes: Buffer;
  unitSystem: UnitSystem;
  limitSetId: number;
  limitSetVersion: number;
  /** The parsed members, packed by `packMembers`. */
  membersGz: Buffer;
  problems: readonly ImportProblem[];
  summary: DraftSummary;
  memberCount: number;
  loadRowCount: number;
  createdAt: Date;
  expiresAt: Date;
}

const MEMBER_COLUMNS = [
  'id', 'revision_id', 'mark', 'level_id', 'level_name', 'grid', 'category', 'material', 'section', 'spans', 'left_overhang', 'right_overhang',
  'supports', 'e', 'i', 'depth', 'camber', 'length', 'reviewer_id', 'reviewer_email', 'notes', 'source_row', 'governing_check', 'max_utilization',
  'verdict', 'required_i',
];
const LOAD_COLUMNS = ['member_id', 'position', 'case', 'kind', 'x1', 'x2', 'value1', 'value2', 'source_sheet', 'source_row', 'source_column'];
const RESULT_COLUMNS = ['member_id', 'revision_id', ...RESULT_FIELDS];

const HEADER = ['id', 'project_id', 'uploaded_by', 'file_name', 'file_type', 'file_size', 'unit_system', 'limit_set_id', 'limit_set_version', 'member_count', 'load_row_count', 'created_at', 'expires_at'];

@Injectable()
export class ImportsRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  /** What an import needs to know about its project: unit system, levels, team e-mails. */
  async projectContext(projectId: number): Promise<ProjectContext | undefined> {
    const project = await this.knex('projects').where({ id: projectId }).first('id', 'name', 'unit_system');
    if (!project) return undefined;
    const [levels, team] = await Promise.all([
      this.knex('levels').where({ project_id: projectId }).orderBy('position').select('id', 'name'),
      this.knex('project_roles as r').join('users as u', 'u.id', 'r.user_id').where('r.project_id', projectId).select('u.id', 'u.email'),
    ]);
    return {
      id: project.id,
      name: project.name,
      unitSystem: project.unit_system,
      levels,
      team: new Map(team.map((t: { id: number; email: string }) => [t.email.toLowerCase(), t.id])),
    };
  }

  async insertDraft(d: NewDraft): Promise<void> {
    await this.knex('import_drafts')
      .insert({
        id: d.id,
        project_id: d.projectId,
        uploaded_by: d.uploadedBy,
        file_name: d.fileName,
        file_type: d.fileType,
        file_size: d.fileBytes.length,
        file_bytes: d.fileBytes,
        unit_system: d.unitSystem,
        limit_set_id: d.limitSetId,
        limit_set_version: d.limitSetVersion,
        members_gz: d.membersGz,
        problems: JSON.stringify(d.problems),
        summary: JSON.stringify(d.summary),
        member_count: d.memberCount,
        load_row_count: d.loadRowCount,
        created_at: d.createdAt,
        expires_at: d.expiresAt,
      });
  }

  /** A live (not expired) draft's header, without its file and members. */
  findHeader(projectId: number, draftId: string): Promise<DraftHeader | undefined> {
    return this.knex('import_drafts').where({ project_id: projectId, id: draftId }).where('expires_at', '>', this.knex.fn.now()).first(HEADER);
  }

  /** The draft without its members (see `members`). */
  find(projectId: number, draftId: string): Promise<Draft | undefined> {
    return this.knex('import_drafts')
      .where({ project_id: projectId, id: draftId })
      .where('expires_at', '>', this.knex.fn.now())
      .first([...HEADER, 'file_bytes', 'problems', 'summary']);
  }

  /** The parsed members of a draft (SI), in sheet order. */
  async members(draftId: string): Promise<ScheduleMember[]> {
    const row = await this.knex('import_drafts').where({ id: draftId }).first('members_gz');
    return row ? (JSON.parse(gunzipSync(row.members_gz).toString('utf8')) as ScheduleMember[]) : [];
  }

  /**
   * Takes the draft in the commit's transaction: deleted now, gone for good
   * when the transaction commits, back if it rolls back. A second commit of
   * the same draft waits for the first, then finds nothing.
   */
  async take(trx: Trx, projectId: number, draftId: string): Promise<boolean> {
    const n = await trx('import_drafts').where({ project_id: projectId, id: draftId }).delete();
    return n > 0;
  }

  /**
   * A committed draft's members, their loads and their results, inside the
   * commit's transaction, with COPY (copy-rows.ts): for 10,000 members about
   * 50,000 rows, streamed while PostgreSQL takes them. Member ids are taken
   * from the sequence first, so loads and results refer to them without
   * reading anything back. `onRows(rowsWritten, rowsTotal)` as it goes.
   */
  async writeMembers(trx: Trx, revisionId: number, list: readonly MemberToWrite[], onRows?: (done: number, total: number) => void): Promise<void> {
    if (list.length === 0) return;
    const ids: number[] = (await trx.raw(`select nextval('members_id_seq')::int as id from generate_series(1, ?)`, [list.length])).rows.map((r: { id: number }) => r.id);
    const loads: { k: number; position: number; load: ScheduleMember['loads'][number] }[] = [];
    list.forEach((w, k) => w.member.loads.forEach((load, position) => loads.push({ k, position, load })));
    const total = list.length + loads.length + list.reduce((n, w) => n + w.analysis.results.length, 0);
    let done = 0;
    const step = (n: number) => {
      done += n;
      onRows?.(done, total);
    };

    await copyRows(trx, 'members', MEMBER_COLUMNS, list.length, (k) => {
      const { member: m, analysis: a, levelId, reviewerId } = list[k];
      return [
        ids[k], revisionId, m.mark, levelId, m.level, m.grid, m.category, m.material, m.section, JSON.stringify(m.spans),
        m.leftOverhang, m.rightOverhang, m.supports, m.E, m.I, m.depth, m.camber, a.length, reviewerId, m.reviewerEmail, m.notes,
        m.sourceRow, a.governingCheck, a.maxUtilization, a.verdict, a.requiredI,
      ];
    }, step);
    await copyRows(trx, 'member_loads', LOAD_COLUMNS, loads.length, (i) => {
      const { k, position, load: l } = loads[i];
      const [x1, x2, v1, v2] =
        l.kind === 'point' ? [l.x, null, l.P, null]
        : l.kind === 'moment' ? [l.x, null, l.M, null]
        : l.kind === 'udl' ? [l.x1, l.x2, l.w, null]
        : [l.x1, l.x2, l.w1, l.w2];
      return [ids[k], position, l.case, l.kind, x1, x2, v1, v2, l.origin.sheet, l.origin.row, l.origin.column ?? null];
    }, step);
    await writeResultRows(trx, revisionId, ids, list.map((w) => w.analysis), step);
  }

  async discard(projectId: number, draftId: string): Promise<boolean> {
    return (await this.knex('import_drafts').where({ project_id: projectId, id: draftId }).delete()) > 0;
  }

  /** Ids by natural key, for the demo seed. */
  async projectIdByNumber(number: string): Promise<number | undefined> {
    return (await this.knex('projects').where({ number }).first('id'))?.id;
  }

  async userIdByEmail(email: string): Promise<number | undefined> {
    return (await this.knex('users').where({ email: email.toLowerCase() }).first('id'))?.id;
  }

  async revisionCount(projectId: number): Promise<number> {
    const row = await this.knex('revisions').where({ project_id: projectId }).count<{ n: string }[]>('* as n').first();
    return Number(row?.n ?? 0);
  }

  /** Drops drafts past their expiry. */
  async deleteExpired(): Promise<number> {
    return this.knex('import_drafts').where('expires_at', '<=', this.knex.fn.now()).delete();
  }
}

/**
 * Results of members already stored (`memberIds[k]` is the member of
 * `analyses[k]`), with COPY in the caller's transaction: the same columns
 * and values as writeMembers writes for an import. Used by a limit-set
 * recompute (checks/limit-set-changes.service.ts), which replaces the
 * results of the latest revision. `onRows(rows)` after each chunk.
 */
export async function writeResultRows(
  trx: Trx,
  revisionId: number,
  memberIds: readonly number[],
  analyses: readonly MemberToWrite['analysis'][],
  onRows?: (rows: number) => void,
): Promise<void> {
  const results: { k: number; result: MemberToWrite['analysis']['results'][number] }[] = [];
  analyses.forEach((a, k) => {
    for (const result of a.results) results.push({ k, result });
  });
  await copyRows(trx, 'results', RESULT_COLUMNS, results.length, (i) => {
    const { k, result: r } = results[i];
    return [memberIds[k], revisionId, ...resultValues(r)];
  }, onRows);
}
