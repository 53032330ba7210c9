import type { Knex } from 'knex';

/**
 * The limit set a project's members are checked against. Null until the
 * project first needs one: the api then copies the default preset into
 * limit_sets and points here (no backfill migration, because the preset's
 * rules live in common/src/limits and migrations import nothing from there).
 * RESTRICT: a set in use cannot be deleted from under its project.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasColumn('projects', 'limit_set_id')) return;
  await knex.schema.alterTable('projects', (t) => {
    t.integer('limit_set_id').nullable().references('id').inTable('limit_sets').onDelete('RESTRICT');
  });
}

export async function down(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasColumn('projects', 'limit_set_id'))) return;
  await knex.schema.alterTable('projects', (t) => {
    t.dropForeign(['limit_set_id']);
    t.dropColumn('limit_set_id');
  });
}
