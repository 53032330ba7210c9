import type { Knex } from 'knex';

/**
 * A collation that orders digits by their numeric value ("B2" before "B10"),
 * so the Members screen lists marks as people number them. ICU's `kn`
 * (numeric ordering) keyword, Unicode Technical Standard #35 (LDML), part 5
 * "Collation", BCP 47 key `kn`; PostgreSQL 15 docs §24.2.2.3.2 ("ICU Collations")
 * give `und-u-kn-true` as the example. Debian's PostgreSQL is built with ICU.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`create collation if not exists mark_natural (provider = icu, locale = 'und-u-kn-true')`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('drop collation if exists mark_natural');
}
