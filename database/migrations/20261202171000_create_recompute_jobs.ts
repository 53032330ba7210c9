import type { Knex } from 'knex';

/**
 * What the client polls while a change of the project's limit set (choosing
 * another set, or editing the active one) and the recompute of the latest
 * revision's results run as one background job (pg-boss's own schema holds
 * the queue). The change itself is in `request` and is applied by the job in
 * the same transaction as the new results, so the stored verdicts always
 * follow the stored set: nothing of the change exists until the job commits.
 * States: queued → running → completed | failed; `attempts` counts starts.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('recompute_jobs')) return;
  await knex.schema.createTable('recompute_jobs', (t) => {
    t.uuid('id').primary();
    t.integer('project_id').notNullable().references('id').inTable('projects').onDelete('CASCADE');
    // The set being chosen or edited; the job fails cleanly if it is gone.
    t.integer('limit_set_id').nullable().references('id').inTable('limit_sets').onDelete('SET NULL');
    t.text('kind').notNullable();
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
    t.check("kind in ('use', 'edit')", [], 'recompute_jobs_kind_known');
    t.check("state in ('queued', 'running', 'completed', 'failed')", [], 'recompute_jobs_state_known');
    t.check('progress >= 0 and progress <= 1', [], 'recompute_jobs_progress_range');
    t.index(['project_id', 'created_at'], 'recompute_jobs_project_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('recompute_jobs');
}
