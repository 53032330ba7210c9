import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { LimitRule, LimitSet, LimitSetNote } from '@sagline/common/limits';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';

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
  updated_at: Date;
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
      .first('s.id', 's.project_id', 's.name', 's.description', 's.source_preset_id', 's.categories', 's.rules', 's.notes', 's.version', 's.updated_at');
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
}
