import { Inject, Injectable } from '@nestjs/common';
import type { ProjectRole, UnitSystem } from '@sagline/common/api-types';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';

export interface ProjectRow {
  id: number;
  name: string;
  number: string;
  unit_system: UnitSystem;
  created_by: number | null;
  created_at: Date;
  updated_at: Date;
}

export interface LevelRow {
  id: number;
  name: string;
  position: number;
}

@Injectable()
export class ProjectsRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  /** The person's projects with their role; every project for an admin (role null where they hold none). */
  listForUser(userId: number, includeAll: boolean): Promise<(ProjectRow & { role: ProjectRole | null })[]> {
    const q = this.knex('projects as p')
      .leftJoin('project_roles as r', (j) => j.on('r.project_id', 'p.id').andOn('r.user_id', this.knex.raw('?', [userId])))
      .select('p.*', 'r.role')
      .orderBy([{ column: 'p.name' }, { column: 'p.id' }]);
    if (!includeAll) q.whereNotNull('r.role');
    return q;
  }

  findById(id: number, trx?: Trx): Promise<ProjectRow | undefined> {
    return (trx ?? this.knex)<ProjectRow>('projects').where({ id }).first();
  }

  levels(projectId: number, trx?: Trx): Promise<LevelRow[]> {
    return (trx ?? this.knex)('levels').where({ project_id: projectId }).orderBy('position').select<LevelRow[]>('id', 'name', 'position');
  }

  async insert(trx: Trx, p: { name: string; number: string; unitSystem: UnitSystem; createdBy: number }): Promise<ProjectRow> {
    const [row] = await trx<ProjectRow>('projects')
      .insert({ name: p.name, number: p.number, unit_system: p.unitSystem, created_by: p.createdBy })
      .returning('*');
    return row;
  }

  async update(trx: Trx, id: number, fields: { name?: string; number?: string; unitSystem?: UnitSystem }): Promise<void> {
    await trx('projects')
      .where({ id })
      .update({
        ...(fields.name !== undefined ? { name: fields.name } : {}),
        ...(fields.number !== undefined ? { number: fields.number } : {}),
        ...(fields.unitSystem !== undefined ? { unit_system: fields.unitSystem } : {}),
        updated_at: trx.fn.now(),
      });
  }

  /**
   * Makes the project's levels exactly `names`, bottom to top: levels kept by
   * name keep their id (what refers to them stays attached), the rest are
   * added or removed. Positions are unique only at commit (deferred), so the
   * reorder can pass through duplicates.
   */
  async replaceLevels(trx: Trx, projectId: number, names: string[]): Promise<void> {
    const existing = await trx('levels').where({ project_id: projectId }).select<LevelRow[]>('id', 'name', 'position');
    const byName = new Map(existing.map((l) => [l.name, l]));
    const keep = new Set(names);
    const gone = existing.filter((l) => !keep.has(l.name)).map((l) => l.id);
    if (gone.length) await trx('levels').whereIn('id', gone).delete();
    for (const [position, name] of names.entries()) {
      const level = byName.get(name);
      if (!level) await trx('levels').insert({ project_id: projectId, name, position });
      else if (level.position !== position) await trx('levels').where({ id: level.id }).update({ position });
    }
  }
}
