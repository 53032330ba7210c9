import type { Knex } from 'knex';

/**
 * Sign-in sessions, in the layout connect-pg-simple 10 expects
 * (its table.sql: sid, sess json, expire, index on expire), so sessions
 * survive a restart and are shared by several API processes.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('sessions')) return;
  await knex.schema.createTable('sessions', (t) => {
    t.string('sid').notNullable().primary();
    t.json('sess').notNullable();
    t.timestamp('expire', { useTz: false, precision: 6 }).notNullable();
    t.index(['expire'], 'sessions_expire_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('sessions');
}
