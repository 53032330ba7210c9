import type { Knex } from 'knex';

/**
 * The Members screen's "most utilised first" order and its utilisation range
 * filter, within one revision. Descending with nulls (members no check
 * applies to) last; read backwards it gives the ascending order with those
 * members first. Built concurrently: members is the busiest table.
 */
export const config = { transaction: false };

export async function up(knex: Knex): Promise<void> {
  await knex.raw('create index concurrently if not exists members_revision_utilization_index on members (revision_id, max_utilization desc nulls last)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop index concurrently if exists members_revision_utilization_index');
}
