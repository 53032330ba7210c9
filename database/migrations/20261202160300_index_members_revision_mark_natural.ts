import type { Knex } from 'knex';

/**
 * The Members screen's default order: one revision's members by mark, in
 * natural order (collation mark_natural), a page at a time. With this index a
 * page is read in order instead of sorting the whole revision (10,000 members
 * and more) for every page. Built concurrently: members is the busiest table.
 */
export const config = { transaction: false };

export async function up(knex: Knex): Promise<void> {
  await knex.raw('create index concurrently if not exists members_revision_mark_natural_index on members (revision_id, mark collate mark_natural)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop index concurrently if exists members_revision_mark_natural_index');
}
