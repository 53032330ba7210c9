import type { Knex } from 'knex';

/**
 * What the client polls for a background import (the queue itself is
 * pg-boss's own schema, created by pg-boss on start). The id is also the
 * pg-boss job id. Progress is written outside the job's own transaction, so
 * it is visible while the work runs; the work itself is all or nothing.
 * States: queued → running → completed | failed (running again after a crash:
 * `attempts` counts the starts).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('import_jobs')) return;
  await knex.schema.createTable('import_jobs', (t) => {
    t.uuid('id').primary();
    t.integer('project_id').notNullable().references('id').inTable('projects').onDelete('CASCADE');
    t.text('kind').notNullable();
    // The draft may be gone (committed or expired) while the job row stays for polling.
    t.uuid('draft_id').nullable();
    t.integer('requested_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.jsonb('request').notNullable().defaultTo('{}');
    t.text('state').notNullable().defaultTo('queued');
    t.double('progress').notNullable().defaultTo(0);
    t.text('step').nullable();
    t.integer('attempts').notNullable().defaultTo(0);
    t.jsonb('result').nullable();
    t.jsonb('error').nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("kind in ('commit')", [], 'import_jobs_kind_known');
    t.check("state in ('queued', 'running', 'completed', 'failed')", [], 'import_jobs_state_known');
    t.check('progress >= 0 and progress <= 1', [], 'import_jobs_progress_range');
    t.index(['project_id', 'created_at'], 'import_jobs_project_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('import_jobs');
}
