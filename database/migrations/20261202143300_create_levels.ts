import type { Knex } from 'knex';

/**
 * Floors of a project, ordered bottom (position 0) to top. The position
 * constraint is deferred to commit time so a reorder can swap positions
 * inside one transaction.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('levels')) return;
  await knex.schema.createTable('levels', (t) => {
    t.increments('id').primary();
    t.integer('project_id').notNullable().references('id').inTable('projects').onDelete('CASCADE');
    t.text('name').notNullable();
    t.integer('position').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['project_id', 'name'], { indexName: 'levels_project_name_unique' });
    t.unique(['project_id', 'position'], { indexName: 'levels_project_position_unique', deferrable: 'deferred' });
    t.check('position >= 0', [], 'levels_position_not_negative');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('levels');
}
