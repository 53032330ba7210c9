import type { Knex } from 'knex';

/**
 * Counters of the sign-in rate limiter, one row per key (IP + e-mail) and
 * window, kept in PostgreSQL so every API process counts the same attempts.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('rate_limit_hits')) return;
  await knex.schema.createTable('rate_limit_hits', (t) => {
    t.text('key').notNullable().primary();
    t.integer('hits').notNullable();
    t.timestamp('reset_at', { useTz: true }).notNullable();
    t.index(['reset_at'], 'rate_limit_hits_reset_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('rate_limit_hits');
}
