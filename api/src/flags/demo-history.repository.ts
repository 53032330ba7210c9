import type { Knex } from '@sagline/database';

/**
 * The newest row id of each table a demo step writes dated rows to: the rows
 * one step wrote are those between the watermark before it and the one after
 * it (ids grow with every insert; the seed runs its steps one after another).
 */
export interface DemoWatermark {
  activity: number;
  flagEvent: number;
  flag: number;
  revision: number;
}

/** One step of the demo's story: the rows written between two watermarks, and when the story says it happened. */
export interface DemoStep {
  at: Date;
  before: DemoWatermark;
  after: DemoWatermark;
}

/**
 * The demo seed's own writes (demo-history.ts): it reads watermarks between
 * the seed's steps and then moves the dates of what each step wrote, in one
 * transaction. Nothing else writes dates in the past. Built by hand by the
 * seed (not a provider of the running api).
 */
export class DemoHistoryRepository {
  constructor(private readonly knex: Knex) {}

  async watermark(): Promise<DemoWatermark> {
    const { rows } = await this.knex.raw<{ rows: { activity: string; flag_event: string; flag: string; revision: string }[] }>(
      `select (select coalesce(max(id), 0) from activity)::text as activity,
              (select coalesce(max(id), 0) from flag_events)::text as flag_event,
              (select coalesce(max(id), 0) from flags)::text as flag,
              (select coalesce(max(id), 0) from revisions)::text as revision`,
    );
    const r = rows[0];
    return { activity: Number(r.activity), flagEvent: Number(r.flag_event), flag: Number(r.flag), revision: Number(r.revision) };
  }

  /**
   * In one transaction: the project's activity entries, flag events, flags
   * and revisions that each step wrote are dated at the step's moment; each
   * flag a step changed is then "updated" at its last event. `projectCreatedAt`
   * moves the project's creation (its row and its `project.created` entry)
   * back to that moment, never forward.
   */
  async backdate(projectId: number, steps: DemoStep[], projectCreatedAt?: Date): Promise<void> {
    await this.knex.transaction(async (trx) => {
      const projectFlags = trx('flags').select('id').where('project_id', projectId);
      const touched = new Set<number>();
      for (const { at, before, after } of steps) {
        const between = (column: string, from: number, to: number) => (q: Knex.QueryBuilder) => q.where(column, '>', from).where(column, '<=', to);
        await trx('activity').where('project_id', projectId).modify(between('id', before.activity, after.activity)).update({ created_at: at });
        const moved: { flag_id: number }[] = await trx('flag_events')
          .whereIn('flag_id', projectFlags.clone())
          .modify(between('id', before.flagEvent, after.flagEvent))
          .update({ created_at: at })
          .returning('flag_id');
        for (const m of moved) touched.add(m.flag_id);
        await trx('flags').where('project_id', projectId).modify(between('id', before.flag, after.flag)).update({ created_at: at });
        await trx('revisions').where('project_id', projectId).modify(between('id', before.revision, after.revision)).update({ created_at: at });
      }
      if (touched.size) {
        await trx.raw(
          `update flags f set updated_at = (select max(e.created_at) from flag_events e where e.flag_id = f.id)
            where f.project_id = ? and f.id = any(?)`,
          [projectId, [...touched]],
        );
      }
      if (projectCreatedAt) {
        await trx('projects').where('id', projectId).update({ created_at: trx.raw('least(created_at, ?)', [projectCreatedAt]) });
        await trx('activity').where({ project_id: projectId, action: 'project.created' }).update({ created_at: trx.raw('least(created_at, ?)', [projectCreatedAt]) });
      }
    });
  }
}
