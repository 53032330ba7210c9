import type { Knex } from 'knex';

/** Building projects. Unit systems as in common/api-types UNIT_SYSTEMS at the time of writing. */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('projects')) return;
  await knex.schema.createTable('projects', (t) => {
    t.increments('id').primary();
    t.text('name').notNullable();
    t.text('number').notNullable();
    t.text('unit_system').notNullable();
    // Keep the project when the person who created it is removed.
    t.integer('created_by').nullable().references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check("unit_system in ('SI', 'US')", [], 'projects_unit_system_known');
    t.index(['name'], 'projects_name_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('projects');
}
