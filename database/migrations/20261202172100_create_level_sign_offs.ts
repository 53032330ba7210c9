import type { Knex } from 'knex';

/**
 * A checker's sign-off of a level: "every member on this floor is reviewed
 * and no flag on it needs action", given against the revision that was
 * latest (`revision_id`). A later revision that adds, removes or changes a
 * member on the level voids it: `voided_at` with the reason, and the revision
 * that did it (`voided_in_revision_id`); a checker withdrawing it voids it too
 * (no revision). Rows are never deleted, so the overview can say what
 * happened to the last sign-off. At most one live (not voided) sign-off per
 * level. Rows belong to their level and project (CASCADE); people and
 * revisions are history (SET NULL).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('level_sign_offs')) return;
  await knex.schema.createTable('level_sign_offs', (t) => {
    t.increments('id').primary();
    t.integer('project_id').notNullable().references('id').inTable('projects').onDelete('CASCADE');
    t.integer('level_id').notNullable().references('id').inTable('levels').onDelete('CASCADE');
    t.integer('revision_id').nullable().references('id').inTable('revisions').onDelete('SET NULL');
    t.integer('revision_number').notNullable();
    t.integer('signed_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.text('comment').nullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('voided_at', { useTz: true }).nullable();
    t.integer('voided_in_revision_id').nullable().references('id').inTable('revisions').onDelete('SET NULL');
    t.integer('voided_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.text('void_reason').nullable();
    t.check('(voided_at is null) = (void_reason is null)', [], 'level_sign_offs_void_reason_with_voided');
    // The overview reads the newest sign-off of each level of a project.
    t.index(['project_id', 'level_id', 'id'], 'level_sign_offs_project_level_index');
  });
  await knex.raw('create unique index if not exists level_sign_offs_live_unique on level_sign_offs (level_id) where voided_at is null');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('level_sign_offs');
}
