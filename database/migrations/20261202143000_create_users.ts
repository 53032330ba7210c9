import type { Knex } from 'knex';

/**
 * People with an account. `password_hash` stays null until the person accepts
 * their invitation (status "invited"); e-mails are stored lower-cased, and the
 * check keeps it so whatever writes the row.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('users')) return;
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.text('email').notNullable().unique();
    t.text('name').notNullable();
    t.text('password_hash').nullable();
    t.boolean('is_admin').notNullable().defaultTo(false);
    // How often the person gets the e-mail digest of what is theirs.
    t.text('digest').notNullable().defaultTo('daily');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check('email = lower(email)', [], 'users_email_lower_case');
    t.check("digest in ('off', 'daily', 'weekly')", [], 'users_digest_known');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('users');
}
