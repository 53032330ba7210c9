import type { Knex } from 'knex';

/**
 * The history of a flag, oldest first: status changes (raise, answer, close,
 * reopen, waive, each with its comment, answer or reason), comments,
 * assignments, due-date changes, and automatic notes when a new revision
 * changes the member or leaves it out (`actor_id` null). Entries belong to
 * their flag (CASCADE) and outlive the person who wrote them (SET NULL).
 * Kinds and statuses as in common/api-types FLAG_EVENT_KINDS / FLAG_STATUSES
 * at the time of writing. The index serves "a flag's history in order".
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('flag_events')) return;
  await knex.schema.createTable('flag_events', (t) => {
    t.bigIncrements('id').primary();
    t.integer('flag_id').notNullable().references('id').inTable('flags').onDelete('CASCADE');
    t.integer('actor_id').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.text('kind').notNullable();
    t.text('from_status').nullable();
    t.text('to_status').nullable();
    t.text('body').nullable();
    t.jsonb('data').notNullable().defaultTo('{}');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("kind in ('comment', 'status', 'assign', 'due', 'revision')", [], 'flag_events_kind_known');
    t.check("from_status is null or from_status in ('open', 'answered', 'closed', 'waived')", [], 'flag_events_from_status_known');
    t.check("to_status is null or to_status in ('open', 'answered', 'closed', 'waived')", [], 'flag_events_to_status_known');
    t.index(['flag_id', 'id'], 'flag_events_flag_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('flag_events');
}
