import type { Knex } from 'knex';

/**
 * The Activity screen filters a project's feed by kind, newest first. A kind
 * is the action's prefix before the first dot (`flag.closed` → `flag`), so the
 * index is on that expression; the api's filter uses the same expression
 * (split_part(action, '.', 1)), or the index would not serve it.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(
    "create index if not exists activity_project_kind_created_index on activity (project_id, (split_part(action, '.', 1)), created_at desc)",
  );
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop index if exists activity_project_kind_created_index');
}
