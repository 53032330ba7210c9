import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';

export interface SignOffRow {
  id: number;
  level_id: number;
  level_name: string;
  revision_number: number;
  signed_by: number | null;
  signer_name: string | null;
  comment: string | null;
  created_at: Date;
  voided_at: Date | null;
  voided_in_revision_number: number | null;
  voided_by: number | null;
  voider_name: string | null;
  void_reason: string | null;
}

/** A flag on the level that still needs action (blocks a sign-off). */
export interface LiveFlagRow {
  id: number;
  mark: string;
  status: 'open' | 'answered';
}

@Injectable()
export class SignOffsRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  private rows(db: Knex | Trx) {
    return db('level_sign_offs as s')
      .join('levels as l', 'l.id', 's.level_id')
      .leftJoin('users as su', 'su.id', 's.signed_by')
      .leftJoin('users as vu', 'vu.id', 's.voided_by')
      .leftJoin('revisions as vr', 'vr.id', 's.voided_in_revision_id')
      .select(
        's.id', 's.level_id', 'l.name as level_name', 's.revision_number', 's.signed_by', 'su.name as signer_name', 's.comment', 's.created_at',
        's.voided_at', 'vr.number as voided_in_revision_number', 's.voided_by', 'vu.name as voider_name', 's.void_reason',
      );
  }

  /** The newest sign-off of each level of the project (level_sign_offs_project_level_index). */
  newestPerLevel(projectId: number): Promise<SignOffRow[]> {
    return this.rows(this.knex)
      .where('s.project_id', projectId)
      .whereIn('s.id', this.knex('level_sign_offs').where({ project_id: projectId }).groupBy('level_id').select(this.knex.raw('max(id)')));
  }

  find(id: number, trx?: Trx): Promise<SignOffRow | undefined> {
    return this.rows(trx ?? this.knex).where('s.id', id).first();
  }

  /** The live sign-off of a level, locked until the transaction ends. */
  live(trx: Trx, levelId: number): Promise<{ id: number } | undefined> {
    return trx('level_sign_offs').where({ level_id: levelId }).whereNull('voided_at').forUpdate().first('id');
  }

  /** The level of the project, locked (sign-offs of one level take turns). */
  lockLevel(trx: Trx, projectId: number, levelId: number): Promise<{ id: number; name: string } | undefined> {
    return trx('levels').where({ project_id: projectId, id: levelId }).forUpdate().first('id', 'name');
  }

  /** Flags open or answered whose member sits on the level in the revision, in mark order. */
  liveFlagsOnLevel(trx: Trx, projectId: number, revisionId: number, levelId: number): Promise<LiveFlagRow[]> {
    return trx('flags as f')
      .join('members as m', (j) => j.on('m.revision_id', trx.raw('?', [revisionId])).andOn(trx.raw('lower(m.mark) = lower(f.mark)')))
      .where('f.project_id', projectId)
      .where('m.level_id', levelId)
      .whereIn('f.status', ['open', 'answered'])
      .orderByRaw('f.mark collate mark_natural, f.id')
      .select('f.id', 'f.mark', 'f.status');
  }

  async memberCount(trx: Trx, revisionId: number, levelId: number): Promise<number> {
    const row = await trx('members').where({ revision_id: revisionId, level_id: levelId }).count<{ count: string }[]>('* as count').first();
    return Number(row?.count ?? 0);
  }

  async insert(trx: Trx, s: { projectId: number; levelId: number; revisionId: number; revisionNumber: number; signedBy: number; comment: string | null }): Promise<number> {
    const [row] = await trx('level_sign_offs')
      .insert({ project_id: s.projectId, level_id: s.levelId, revision_id: s.revisionId, revision_number: s.revisionNumber, signed_by: s.signedBy, comment: s.comment })
      .returning('id');
    return row.id;
  }

  async void(trx: Trx, id: number, v: { reason: string; revisionId: number | null; by: number | null }): Promise<void> {
    await trx('level_sign_offs').where({ id }).update({ voided_at: trx.fn.now(), void_reason: v.reason, voided_in_revision_id: v.revisionId, voided_by: v.by });
  }

  /** Live sign-offs of the project on these levels, locked. */
  liveOnLevels(trx: Trx, projectId: number, levelIds: number[]): Promise<{ id: number; level_id: number; level_name: string }[]> {
    if (levelIds.length === 0) return Promise.resolve([]);
    return trx('level_sign_offs as s')
      .join('levels as l', 'l.id', 's.level_id')
      .where('s.project_id', projectId)
      .whereIn('s.level_id', levelIds)
      .whereNull('s.voided_at')
      .orderBy('l.position')
      .forUpdate('s')
      .select('s.id', 's.level_id', 'l.name as level_name');
  }

  /** Level ids of the project by lower-case name. */
  async levelIdsByName(trx: Trx, projectId: number): Promise<Map<string, number>> {
    const rows: { id: number; name: string }[] = await trx('levels').where({ project_id: projectId }).select('id', 'name');
    return new Map(rows.map((r) => [r.name.toLowerCase(), r.id]));
  }
}
