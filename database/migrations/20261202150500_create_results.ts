import type { Knex } from 'knex';

/**
 * One row per member × check × segment (span or overhang), as the engine's
 * CheckSegmentResult (calc-contract.md), SI units: deflection positive up,
 * effective length twice the overhang on overhangs. `revision_id` is repeated
 * from the member so a revision's results are counted and exported without a
 * join; it has no foreign key of its own (the member's already ties the row
 * to the revision, and deletes cascade through it), which spares every
 * import one key check per result row. Indexes: a member's checks (Member
 * screen), and a revision's failures by check (the "failing check" filter;
 * partial, as most rows pass).
 */
export async function up(knex: Knex): Promise<void> {
  if (await knex.schema.hasTable('results')) return;
  await knex.schema.createTable('results', (t) => {
    t.bigIncrements('id').primary();
    t.integer('member_id').notNullable().references('id').inTable('members').onDelete('CASCADE');
    t.integer('revision_id').notNullable();
    t.text('check_name').notNullable();
    t.text('combination').notNullable();
    // The limit-set rule behind the check (its id within the revision's limit_set copy).
    t.text('rule_id').notNullable();
    t.integer('segment_index').notNullable();
    t.text('segment_kind').notNullable();
    t.double('segment_from').notNullable();
    t.double('segment_to').notNullable();
    t.double('x').notNullable();
    t.double('deflection').notNullable();
    t.double('effective_length').notNullable();
    t.double('span_ratio').nullable();
    t.double('limit_ratio').notNullable();
    t.double('max_abs').nullable();
    t.double('plus').notNullable().defaultTo(0);
    t.double('allowed').notNullable();
    t.text('governing').notNullable();
    t.double('utilization').notNullable();
    t.boolean('pass').notNullable();
    t.double('required_i').notNullable();
    t.check("segment_kind in ('span', 'overhang')", [], 'results_segment_kind_known');
    t.check("governing in ('ratio', 'maxAbs')", [], 'results_governing_known');
    t.index(['member_id'], 'results_member_index');
  });
  await knex.raw('create index if not exists results_revision_failing_check_index on results (revision_id, check_name) where not pass');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('results');
}
