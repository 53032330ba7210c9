import { Inject, Injectable } from '@nestjs/common';
import type { ProjectRole } from '@sagline/common/api-types';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';

export interface MemberRow {
  user_id: number;
  name: string;
  email: string;
  role: ProjectRole;
  has_password: boolean;
}


@Injectable()
export class TeamRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  private members(db: Knex | Trx, projectId: number) {
    return db('project_roles as r')
      .join('users as u', 'u.id', 'r.user_id')
      .where('r.project_id', projectId)
      .select('r.user_id', 'u.name', 'u.email', 'r.role', db.raw('u.password_hash is not null as has_password'));
  }

  list(projectId: number): Promise<MemberRow[]> {
    return this.members(this.knex, projectId).orderBy([{ column: 'u.name' }, { column: 'r.user_id' }]);
  }

  /** One member, row-locked so two managers editing at once are serialised. */
  findMember(trx: Trx, projectId: number, userId: number): Promise<MemberRow | undefined> {
    return this.members(trx, projectId).where('r.user_id', userId).forUpdate('r').first();
  }

  async projectName(projectId: number): Promise<string> {
    const row = await this.knex('projects').where({ id: projectId }).first('name');
    return row?.name ?? '';
  }

  async insertRole(trx: Trx, projectId: number, userId: number, role: ProjectRole): Promise<void> {
    await trx('project_roles').insert({ project_id: projectId, user_id: userId, role });
  }

  async updateRole(trx: Trx, projectId: number, userId: number, role: ProjectRole): Promise<void> {
    await trx('project_roles').where({ project_id: projectId, user_id: userId }).update({ role, updated_at: trx.fn.now() });
  }

  async deleteRole(trx: Trx, projectId: number, userId: number): Promise<void> {
    await trx('project_roles').where({ project_id: projectId, user_id: userId }).delete();
  }

  /** Managers of the project, locked until commit (the "last manager" rule must not race). */
  async lockManagers(trx: Trx, projectId: number): Promise<number[]> {
    const rows = await trx('project_roles').where({ project_id: projectId, role: 'manager' }).forUpdate().select('user_id');
    return rows.map((r: { user_id: number }) => r.user_id);
  }
}

