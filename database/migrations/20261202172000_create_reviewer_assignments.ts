import type { Knex } from 'knex';

/**
 * Reviewers a manager assigned, per level or per member (journey 3). A row
 * names EITHER a level (every member on it) OR a mark (one member, matched
 * ignoring case, as flags match marks: members are rewritten on every
 * commit, a mark outlives them). The effective reviewer of a member is its
 * mark's assignment, else its level's, else the schedule's Reviewer column;
 * it is written into members.reviewer_id of the latest revision (see
 * api/src/overview/README.md). One assignment per level and per mark.
 * The level and the reviewer belong to the row (CASCADE: removing either
 * removes the assignment); who assigned is authorship (SET NULL).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('reviewer_assignments')) return;
  await knex.schema.createTable('reviewer_assignments', (t) => {
    t.increments('id').primary();
    t.integer('project_id').notNullable().references('id').inTable('projects').onDelete('CASCADE');
    t.integer('level_id').nullable().references('id').inTable('levels').onDelete('CASCADE');
    t.text('mark').nullable();
    t.integer('reviewer_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.integer('assigned_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check('(level_id is null) <> (mark is null)', [], 'reviewer_assignments_level_or_mark');
  });
  await knex.raw('create unique index if not exists reviewer_assignments_level_unique on reviewer_assignments (project_id, level_id) where level_id is not null');
  await knex.raw('create unique index if not exists reviewer_assignments_mark_unique on reviewer_assignments (project_id, lower(mark)) where mark is not null');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('reviewer_assignments');
}
