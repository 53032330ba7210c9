import type { Knex } from 'knex';

/**
 * Limit sets: the serviceability rules members are checked against
 * (member category × check, each with its source). A project works on its own
 * copy of a preset (common/src/limits), so editing it never changes another
 * project or the shipped preset; `project_id` null is a firm-wide library set
 * (the admin's library, a later screen). Rules, categories and notes are kept
 * as JSON in the shape of common/src/limits LimitSet, since they are always
 * read and written as one document. `version` counts edits: a draft import
 * remembers the version its verdicts came from.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('limit_sets')) return;
  await knex.schema.createTable('limit_sets', (t) => {
    t.increments('id').primary();
    // A project's copy goes with the project.
    t.integer('project_id').nullable().references('id').inTable('projects').onDelete('CASCADE');
    t.text('name').notNullable();
    t.text('description').notNullable().defaultTo('');
    // The preset id it was copied from (e.g. 'us-ibc-2021-aci-318-19'), null for a set of its own.
    t.text('source_preset_id').nullable();
    t.jsonb('categories').notNullable().defaultTo('[]');
    t.jsonb('rules').notNullable().defaultTo('[]');
    t.jsonb('notes').notNullable().defaultTo('[]');
    t.integer('version').notNullable().defaultTo(1);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['project_id'], 'limit_sets_project_index');
    t.check('version >= 1', [], 'limit_sets_version_positive');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('limit_sets');
}
