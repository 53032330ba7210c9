import type { Knex } from 'knex';

/**
 * One row per person and day a digest was written for: the primary key is
 * what makes the daily digest idempotent (a second run, a second api process
 * or a retried job finds the row and writes nothing). The row and the
 * digest's outbox message are written in one transaction. `mail_id` is the
 * message (SET NULL: pruning old mail keeps the record that the day is done).
 * Rows belong to their person (CASCADE).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('digest_log')) return;
  await knex.schema.createTable('digest_log', (t) => {
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.date('day').notNullable();
    t.bigInteger('mail_id').nullable().references('id').inTable('outbound_mail').onDelete('SET NULL');
    t.integer('items').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['user_id', 'day']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('digest_log');
}
