import type { Knex } from 'knex';

/**
 * Invitations by e-mail. Only the SHA-256 of the token is stored: the raw
 * token exists in the e-mailed link alone, so a copy of the database cannot be
 * used to accept invitations.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('invitations')) return;
  await knex.schema.createTable('invitations', (t) => {
    t.increments('id').primary();
    t.text('token_hash').notNullable().unique();
    t.text('email').notNullable();
    t.text('name').nullable();
    // The account created for the invitee (without a password until accepted).
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.integer('project_id').nullable().references('id').inTable('projects').onDelete('CASCADE');
    t.text('role').nullable();
    t.integer('invited_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true }).nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['user_id'], 'invitations_user_index');
    t.index(['project_id'], 'invitations_project_index');
    t.check("role is null or role in ('manager', 'engineer', 'checker', 'viewer')", [], 'invitations_role_known');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('invitations');
}
