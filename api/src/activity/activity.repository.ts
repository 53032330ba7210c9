import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { ActivityPerson } from '@sagline/common/api-types';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';

export interface NewActivity {
  projectId: number | null;
  actorId: number | null;
  /** `<prefix>.<verb>`, see ACTIVITY_ACTIONS in common/src/api-types/activity.ts. */
  action: string;
  summary: string;
  data?: Record<string, unknown>;
}

export interface ActivityRow {
  id: string;
  created_at: Date;
  action: string;
  summary: string;
  data: Record<string, unknown> | null;
  actor_id: number | null;
  actor_name: string | null;
  /** The name of the person `data.userId` names (a reviewer given a level, someone added to the team). */
  subject_name: string | null;
  /** The number of the revision `data.revisionId` names, when it still exists. */
  revision_number: number | null;
}

/** The feed's filters, already checked (ListActivityQuery). */
export interface ActivityFilter {
  /** Action prefixes (`flag`, `import` …), from the kinds asked for. */
  prefixes?: string[];
  actorId?: number;
  /** UTC calendar days, both included. */
  from?: string;
  to?: string;
  q?: string;
}

/** `%`, `_` and `\` taken literally in ILIKE. */
function likeText(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
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

  private filtered(projectId: number, f: ActivityFilter): Knex.QueryBuilder {
    const q = this.knex('activity as a').where('a.project_id', projectId);
    if (f.prefixes?.length) {
      // split_part(action, '.', 1) = prefix: one expression the kind filter and its index share.
      q.whereRaw(`split_part(a.action, '.', 1) = any(?)`, [f.prefixes]);
    }
    if (f.actorId !== undefined) q.where('a.actor_id', f.actorId);
    // Days are UTC: from 00:00 of `from` up to (not including) 00:00 after `to`.
    if (f.from) q.whereRaw(`a.created_at >= (?::date)::timestamp at time zone 'UTC'`, [f.from]);
    if (f.to) q.whereRaw(`a.created_at < (?::date + 1)::timestamp at time zone 'UTC'`, [f.to]);
    if (f.q) q.whereRaw(`a.summary ilike ? escape '\\'`, [likeText(f.q)]);
    return q;
  }

  /** One page of a project's entries, newest first (activity_project_created_index, or the kind / actor indexes). */
  list(projectId: number, f: ActivityFilter, offset: number, limit: number): Promise<ActivityRow[]> {
    return this.filtered(projectId, f)
      .leftJoin('users as u', 'u.id', 'a.actor_id')
      .leftJoin('users as su', 'su.id', this.knex.raw(`case when a.data->>'userId' ~ '^[0-9]{1,9}$' then (a.data->>'userId')::int end`))
      .leftJoin('revisions as rv', (j) =>
        j
          .on('rv.id', this.knex.raw(`case when a.data->>'revisionId' ~ '^[0-9]{1,9}$' then (a.data->>'revisionId')::int end`))
          .andOn('rv.project_id', 'a.project_id'),
      )
      .orderBy([{ column: 'a.created_at', order: 'desc' }, { column: 'a.id', order: 'desc' }])
      .offset(offset)
      .limit(limit)
      .select('a.id', 'a.created_at', 'a.action', 'a.summary', 'a.data', 'a.actor_id', 'u.name as actor_name', 'su.name as subject_name', 'rv.number as revision_number');
  }

  async count(projectId: number, f: ActivityFilter): Promise<number> {
    const row = await this.filtered(projectId, f).count<{ count: string }[]>('* as count').first();
    return Number(row?.count ?? 0);
  }

  /** Everyone who acted in the project's feed, by name. */
  async people(projectId: number): Promise<ActivityPerson[]> {
    const rows: { id: number; name: string }[] = await this.knex('users as u')
      .whereExists(this.knex('activity as a').where('a.project_id', projectId).whereRaw('a.actor_id = u.id'))
      .orderBy([{ column: 'u.name' }, { column: 'u.id' }])
      .select('u.id', 'u.name');
    return rows.map((r) => ({ id: r.id, name: r.name }));
  }
}
