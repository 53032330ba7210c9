import type { Knex } from 'knex';

/**
 * member_loads and results lose their foreign keys to members; a statement
 * trigger on members deletes the loads and results of deleted members
 * instead, so deleting a revision or a project (members go by cascade from
 * revisions) still removes everything under it, in the same statement.
 *
 * Why: an import writes about 40,000 load and result rows for 10,000
 * members, and each foreign-key check locks its member row (SELECT … FOR
 * KEY SHARE, a WAL record each): measured about 4.5 µs a row, nearly half of
 * PostgreSQL's time in an import commit. The only writers of these rows are
 * the import commit and the limit-set recompute (api/src/imports/
 * imports.repository.ts), which write them in the same transaction as the
 * members they take the ids from (ids from the sequence, or read from
 * members), so the key checks caught nothing a test does not.
 * Indexes on member_id stay (a member's loads and results, and this delete).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw('alter table member_loads drop constraint if exists member_loads_member_id_foreign');
  await knex.raw('alter table results drop constraint if exists results_member_id_foreign');
  await knex.raw(`
    create or replace function members_delete_their_rows() returns trigger language plpgsql as $$
    begin
      delete from member_loads l using deleted_members d where l.member_id = d.id;
      delete from results r using deleted_members d where r.member_id = d.id;
      return null;
    end
    $$`);
  await knex.raw('drop trigger if exists members_delete_their_rows on members');
  await knex.raw(`
    create trigger members_delete_their_rows after delete on members
    referencing old table as deleted_members
    for each statement execute function members_delete_their_rows()`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop trigger if exists members_delete_their_rows on members');
  await knex.raw('drop function if exists members_delete_their_rows()');
  await knex.raw('delete from member_loads l where not exists (select 1 from members m where m.id = l.member_id)');
  await knex.raw('delete from results r where not exists (select 1 from members m where m.id = r.member_id)');
  await knex.raw('alter table member_loads add constraint member_loads_member_id_foreign foreign key (member_id) references members (id) on delete cascade');
  await knex.raw('alter table results add constraint results_member_id_foreign foreign key (member_id) references members (id) on delete cascade');
}
