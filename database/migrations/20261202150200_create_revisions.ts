import type { Knex } from 'knex';

/**
 * One committed member schedule of a project: numbered 1, 2, 3 … per
 * project in commit order, with the original file (downloadable later, byte
 * for byte), its parse report (the warnings it was committed with), the diff
 * to the revision before, and a copy of the limit set its verdicts came from
 * (so a verdict still traces to its rule after the set is edited).
 * `source_draft_id` makes a commit idempotent: a retried commit job finds the
 * revision its first attempt wrote instead of writing a second one.
 * File types as in common/api-types IMPORT_FILE_TYPES at the time of writing.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('revisions')) return;
  await knex.schema.createTable('revisions', (t) => {
    t.increments('id').primary();
    t.integer('project_id').notNullable().references('id').inTable('projects').onDelete('CASCADE');
    t.integer('number').notNullable();
    t.text('label').nullable();
    // Keep the revision when the person who uploaded it is removed.
    t.integer('uploaded_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.text('file_name').notNullable();
    t.text('file_type').notNullable();
    t.integer('file_size').notNullable();
    t.binary('file_bytes').notNullable();
    t.jsonb('parse_report').notNullable();
    t.jsonb('diff').notNullable();
    t.integer('limit_set_id').nullable().references('id').inTable('limit_sets').onDelete('SET NULL');
    t.jsonb('limit_set').notNullable();
    t.integer('member_count').notNullable();
    t.integer('pass_count').notNullable();
    t.integer('fail_count').notNullable();
    t.text('status').notNullable().defaultTo('committed');
    t.uuid('source_draft_id').nullable();
    t.unique(['project_id', 'number'], { indexName: 'revisions_project_number_unique' });
    t.unique(['source_draft_id'], { indexName: 'revisions_source_draft_unique' });
    t.check('number >= 1', [], 'revisions_number_positive');
    t.check("file_type in ('xlsx', 'csv')", [], 'revisions_file_type_known');
    t.check("status in ('committed')", [], 'revisions_status_known');
    t.check('member_count >= 0 and pass_count >= 0 and fail_count >= 0', [], 'revisions_counts_not_negative');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('revisions');
}
