import type { Knex } from 'knex';

/**
 * A validated upload waiting for its commit: the file, the parsed members
 * (SI, common/src/schedule ScheduleMember[] as gzip-compressed JSON: a
 * 10,000-member schedule is 5 MB of JSON, which as jsonb costs more to write
 * than the whole rest of the draft, and is only ever read back whole), the
 * warnings and the counts of the preview shown to the engineer. Written only when the upload had no fatal
 * problem; deleted by its commit (in the commit's transaction) or after
 * `expires_at`. `limit_set_version` is the version of the project's limit set
 * the preview's verdicts came from: a commit after the set changed is refused.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('import_drafts')) return;
  await knex.schema.createTable('import_drafts', (t) => {
    t.uuid('id').primary().defaultTo(knex.raw('gen_random_uuid()'));
    t.integer('project_id').notNullable().references('id').inTable('projects').onDelete('CASCADE');
    // A draft is its uploader's unfinished work: it goes with them.
    t.integer('uploaded_by').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('file_name').notNullable();
    t.text('file_type').notNullable();
    t.integer('file_size').notNullable();
    t.binary('file_bytes').notNullable();
    t.text('unit_system').notNullable();
    t.integer('limit_set_id').notNullable().references('id').inTable('limit_sets').onDelete('CASCADE');
    t.integer('limit_set_version').notNullable();
    t.binary('members_gz').notNullable();
    t.jsonb('problems').notNullable();
    // Counts of the preview's diff and verdicts (the member lists are recomputed on commit).
    t.jsonb('summary').notNullable();
    t.integer('member_count').notNullable();
    t.integer('load_row_count').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.check("file_type in ('xlsx', 'csv')", [], 'import_drafts_file_type_known');
    t.index(['project_id'], 'import_drafts_project_index');
    // The sweep that discards old drafts.
    t.index(['expires_at'], 'import_drafts_expires_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('import_drafts');
}
