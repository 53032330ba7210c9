import { gunzipSync, gzipSync } from 'node:zlib';
import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { ImportFileType, ImportProblem, UnitSystem } from '@sagline/common/api-types';
import type { ScheduleMember } from '@sagline/common/schedule';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';

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
  members: readonly ScheduleMember[];
  problems: readonly ImportProblem[];
  summary: DraftSummary;
  memberCount: number;
  loadRowCount: number;
  createdAt: Date;
  expiresAt: Date;
}

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
        // Fastest level: the point is to keep PostgreSQL from parsing and compressing 5 MB of JSON.
        members_gz: gzipSync(JSON.stringify(d.members), { level: 1 }),
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
