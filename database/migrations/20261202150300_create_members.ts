import type { Knex } from 'knex';

/**
 * The members of one revision, in SI units (m, Pa, m^4), as the schedule
 * parser read them, with the per-member summary of their results (governing
 * check, largest utilisation, verdict, the I at which every check passes) so
 * the Members screen filters and sorts without touching `results`.
 * Marks are unique per revision ignoring case (the parser matches them so).
 * Indexes: the Members screen filters one revision by verdict, level and
 * reviewer (each index costs every import a write per member, so only these).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('members')) return;
  await knex.schema.createTable('members', (t) => {
    t.increments('id').primary();
    t.integer('revision_id').notNullable().references('id').inTable('revisions').onDelete('CASCADE');
    t.text('mark').notNullable();
    // Keep the member (and its level's name) when a level is removed from the project.
    t.integer('level_id').nullable().references('id').inTable('levels').onDelete('SET NULL');
    t.text('level_name').notNullable();
    t.text('grid').nullable();
    t.text('category').notNullable();
    t.text('material').notNullable();
    t.text('section').nullable();
    t.jsonb('spans').notNullable();
    t.double('left_overhang').notNullable().defaultTo(0);
    t.double('right_overhang').notNullable().defaultTo(0);
    t.text('supports').notNullable();
    t.double('e').notNullable();
    t.double('i').notNullable();
    t.double('depth').nullable();
    t.double('camber').nullable();
    t.double('length').notNullable();
    // Keep the member when its reviewer leaves; the e-mail as written stays.
    t.integer('reviewer_id').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.text('reviewer_email').nullable();
    t.text('notes').nullable();
    t.integer('source_row').notNullable();
    t.text('governing_check').nullable();
    t.double('max_utilization').nullable();
    t.text('verdict').nullable();
    t.double('required_i').nullable();
    t.check("verdict in ('pass', 'fail')", [], 'members_verdict_known');
    t.check('e > 0 and i > 0 and length > 0', [], 'members_stiffness_positive');
  });
  await knex.raw('create unique index if not exists members_revision_mark_unique on members (revision_id, lower(mark))');
  await knex.raw('create index if not exists members_revision_verdict_index on members (revision_id, verdict)');
  await knex.raw('create index if not exists members_revision_level_index on members (revision_id, level_id)');
  await knex.raw('create index if not exists members_revision_reviewer_index on members (revision_id, reviewer_id)');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('members');
}
