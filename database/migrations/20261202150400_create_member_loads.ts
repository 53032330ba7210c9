import type { Knex } from 'knex';

/**
 * The loads of a member in the engine's shape (calc-contract.md), SI units,
 * positive downward (moments counter-clockwise), x from the member's left end:
 * - point:  x1 = x, value1 = P (N)
 * - moment: x1 = x, value1 = M (N·m)
 * - udl:    x1..x2, value1 = w (N/m)
 * - linear: x1..x2, value1 = w1, value2 = w2 (N/m)
 * `position` keeps the load order the engine saw (contributions refer to it);
 * source_* say where in the workbook the load came from.
 * Kinds as in common/src/schedule LOAD_KINDS at the time of writing.
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('member_loads')) return;
  await knex.schema.createTable('member_loads', (t) => {
    t.bigIncrements('id').primary();
    t.integer('member_id').notNullable().references('id').inTable('members').onDelete('CASCADE');
    t.integer('position').notNullable();
    t.text('case').notNullable();
    t.text('kind').notNullable();
    t.double('x1').notNullable();
    t.double('x2').nullable();
    t.double('value1').notNullable();
    t.double('value2').nullable();
    t.text('source_sheet').notNullable();
    t.integer('source_row').notNullable();
    t.text('source_column').nullable();
    t.unique(['member_id', 'position'], { indexName: 'member_loads_member_position_unique' });
    t.check("kind in ('point', 'udl', 'linear', 'moment')", [], 'member_loads_kind_known');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('member_loads');
}
