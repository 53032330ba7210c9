import type { Knex } from 'knex';

/**
 * The Activity screen's person filter: one person's entries in one project,
 * newest first (activity_actor_index alone would read that person's entries
 * of every project).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw('create index if not exists activity_project_actor_created_index on activity (project_id, actor_id, created_at desc)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop index if exists activity_project_actor_created_index');
}
