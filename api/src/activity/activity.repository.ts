import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';

export interface NewActivity {
  projectId: number | null;
  actorId: number | null;
  action: string;
  summary: string;
  data?: Record<string, unknown>;
}

export interface ActivityRow {
  id: string;
  created_at: Date;
  action: string;
  summary: string;
  actor_id: number | null;
  actor_name: string | null;
}

@Injectable()
export class ActivityRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  async insert(trx: Trx, entry: NewActivity): Promise<void> {
    await trx('activity').insert({
      project_id: entry.projectId,
      actor_id: entry.actorId,
      action: entry.action,
      summary: entry.summary,
      data: JSON.stringify(entry.data ?? {}),
    });
  }

  /** One page of a project's entries, newest first (served by activity_project_created_index). */
  listByProject(projectId: number, offset: number, limit: number): Promise<ActivityRow[]> {
    return this.knex('activity as a')
      .leftJoin('users as u', 'u.id', 'a.actor_id')
      .where('a.project_id', projectId)
      .orderBy([{ column: 'a.created_at', order: 'desc' }, { column: 'a.id', order: 'desc' }])
      .offset(offset)
      .limit(limit)
      .select('a.id', 'a.created_at', 'a.action', 'a.summary', 'a.actor_id', 'u.name as actor_name');
  }

  async countByProject(projectId: number): Promise<number> {
    const row = await this.knex('activity').where({ project_id: projectId }).count<{ count: string }[]>('* as count').first();
    return Number(row?.count ?? 0);
  }
}
