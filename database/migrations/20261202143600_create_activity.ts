import type { Knex } from 'knex';

/**
 * Who did what, when. `project_id` is null for account-wide events (password
 * changed). Entries outlive the person who acted (actor set to null).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('activity')) return;
  await knex.schema.createTable('activity', (t) => {
    t.bigIncrements('id').primary();
    t.integer('project_id').nullable().references('id').inTable('projects').onDelete('CASCADE');
    t.integer('actor_id').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.text('action').notNullable();
    t.text('summary').notNullable();
    t.jsonb('data').notNullable().defaultTo('{}');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    // The activity screen lists one project's entries, newest first.
    t.index(['project_id', 'created_at'], 'activity_project_created_index');
    t.index(['actor_id'], 'activity_actor_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('activity');
}
