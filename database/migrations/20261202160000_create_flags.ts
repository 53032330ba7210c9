import type { Knex } from 'knex';

/**
 * Flags: a member (and optionally one of its checks) raised for action by a
 * checker. A flag names its member by MARK, not by the member row of one
 * revision, so it follows the member from revision to revision (members are
 * rewritten on every commit). `raised_in_revision_id` remembers which revision
 * was latest when it was raised; SET NULL so deleting a revision keeps the flag.
 * People are authorship (SET NULL): a flag outlives whoever raised or holds it.
 * `version` counts changes, for optimistic concurrency (a stale write is 409).
 * Statuses as in common/api-types FLAG_STATUSES at the time of writing; a
 * waive always carries its reason, and only a waived flag has one.
 * Indexes: the Flags screen filters a project's flags by status and by
 * assignee; the Members screen counts each mark's open flags, and marks match
 * ignoring case (as the schedule parser matches them), hence lower(mark).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('flags')) return;
  await knex.schema.createTable('flags', (t) => {
    t.increments('id').primary();
    // A project's flags go with it.
    t.integer('project_id').notNullable().references('id').inTable('projects').onDelete('CASCADE');
    t.text('mark').notNullable();
    t.text('check_name').nullable();
    t.integer('raised_in_revision_id').nullable().references('id').inTable('revisions').onDelete('SET NULL');
    t.text('status').notNullable().defaultTo('open');
    t.text('title').notNullable();
    t.text('comment').nullable();
    t.integer('assignee_id').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.integer('raised_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.date('due_date').nullable();
    t.text('waive_reason').nullable();
    t.integer('version').notNullable().defaultTo(1);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("status in ('open', 'answered', 'closed', 'waived')", [], 'flags_status_known');
    t.check("(status = 'waived') = (waive_reason is not null)", [], 'flags_waive_reason_with_waived');
    t.check('version >= 1', [], 'flags_version_positive');
    t.index(['project_id', 'status'], 'flags_project_status_index');
    t.index(['project_id', 'assignee_id'], 'flags_project_assignee_index');
  });
  await knex.raw('create index if not exists flags_project_mark_index on flags (project_id, lower(mark))');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('flags');
}
