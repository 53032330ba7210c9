import type { Knex } from 'knex';

/**
 * Who holds which role on which project (one role per person and project).
 * The role list is written out, not imported, so this migration keeps its
 * meaning when the list in common/api-types grows (a later migration widens it).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('project_roles')) return;
  await knex.schema.createTable('project_roles', (t) => {
    t.increments('id').primary();
    t.integer('project_id').notNullable().references('id').inTable('projects').onDelete('CASCADE');
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('role').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['project_id', 'user_id'], { indexName: 'project_roles_project_user_unique' });
    // "Which projects is this person on?" runs on every request of the project list.
    t.index(['user_id'], 'project_roles_user_index');
    t.check("role in ('manager', 'engineer', 'checker', 'viewer')", [], 'project_roles_role_known');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('project_roles');
}
