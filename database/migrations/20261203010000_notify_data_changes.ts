import type { Knex } from 'knex';

/** The tables whose rows the api's answers are made of (not mail, jobs, drafts or rate-limit counts). */
const WATCHED_TABLES = [
  'users',
  'projects',
  'levels',
  'project_roles',
  'invitations',
  'limit_sets',
  'revisions',
  'members',
  'member_loads',
  'results',
  'flags',
  'flag_events',
  'reviewer_assignments',
  'level_sign_offs',
  'activity',
] as const;

/** The channel the api listens on: DATA_CHANGED_CHANNEL in database/index.ts (a migration keeps its own copy). */
const CHANNEL = 'sagline_data_changed';

/**
 * Every statement that writes a watched table, and every change of a
 * session's contents (a sign-in, a sign-out, a new CSRF token; not the
 * once-a-minute expiry update), sends a NOTIFY on `sagline_data_changed`.
 * PostgreSQL delivers it when the transaction commits (never for a rolled-
 * back one) and folds repeats within a transaction into one. Each api
 * process listens and drops what it has cached from older data, so an
 * answer kept in memory is never older than the last committed change by
 * anyone: another api process, a background job, the command line, psql.
 * Statement triggers: one notification per statement, not per row (an
 * import's COPY of 40,000 rows sends one).
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    create or replace function notify_data_changed() returns trigger language plpgsql as $$
    begin
      perform pg_notify('${CHANNEL}', tg_table_name);
      return null;
    end
    $$`);
  for (const table of WATCHED_TABLES) {
    await knex.raw(`drop trigger if exists ${table}_notify_data_changed on ${table}`);
    await knex.raw(`
      create trigger ${table}_notify_data_changed after insert or update or delete or truncate on ${table}
      for each statement execute function notify_data_changed()`);
  }
  await knex.raw('drop trigger if exists sessions_notify_data_changed on sessions');
  await knex.raw(`
    create trigger sessions_notify_data_changed after insert or update of sess or delete or truncate on sessions
    for each statement execute function notify_data_changed()`);
}

export async function down(knex: Knex): Promise<void> {
  for (const table of [...WATCHED_TABLES, 'sessions']) await knex.raw(`drop trigger if exists ${table}_notify_data_changed on ${table}`);
  await knex.raw('drop function if exists notify_data_changed()');
}
