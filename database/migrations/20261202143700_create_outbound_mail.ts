import type { Knex } from 'knex';

/**
 * The outbox: every e-mail is written here first (in the same transaction as
 * the change it reports), then sent. A failed send stays `queued` with its
 * error and a later `next_attempt_at`; after too many attempts it is `failed`.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('outbound_mail')) return;
  await knex.schema.createTable('outbound_mail', (t) => {
    t.bigIncrements('id').primary();
    t.text('to').notNullable();
    t.text('subject').notNullable();
    t.text('text').notNullable();
    t.text('html').nullable();
    t.text('status').notNullable().defaultTo('queued');
    t.integer('attempts').notNullable().defaultTo(0);
    t.text('last_error').nullable();
    t.timestamp('next_attempt_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('sent_at', { useTz: true }).nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("status in ('queued', 'sent', 'failed')", [], 'outbound_mail_status_known');
    // The retry sweep looks for queued messages that are due.
    t.index(['status', 'next_attempt_at'], 'outbound_mail_status_due_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('outbound_mail');
}
