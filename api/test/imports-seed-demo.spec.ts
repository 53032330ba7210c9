import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { createKnex, DEMO_PROJECT, seedDemo, type Knex } from '@sagline/database';
import { createTestDatabase } from './support/pg-admin';

const ROOT = path.resolve(__dirname, '..', '..');

/** `cli.js seed-demo` as `npm start` runs it, from the sources (no build needed). */
function seedDemoCli(databaseUrl: string): { status: number | null; stderr: string } {
  const r = spawnSync(process.execPath, ['-r', path.join(__dirname, 'fixtures', 'swc-register.js'), path.join(ROOT, 'api', 'src', 'cli.ts'), 'seed-demo'], {
    cwd: ROOT,
    env: { ...process.env, DATABASE_URL: databaseUrl, NODE_ENV: 'test' },
    encoding: 'utf8',
    timeout: 120_000,
  });
  return { status: r.status, stderr: r.stderr };
}

describe('cli seed-demo', () => {
  let db: { url: string; drop(): Promise<void> };
  let knex: Knex;

  beforeAll(async () => {
    db = await createTestDatabase();
    knex = createKnex(db.url, { min: 0, max: 2 });
  });
  afterAll(async () => {
    await knex.destroy();
    await db.drop();
  });

  it('says there is nothing to do before the database seed', () => {
    const r = seedDemoCli(db.url);
    expect(r).toEqual({
      status: 0,
      stderr:
        `[api] seed-demo: no project ${DEMO_PROJECT.number} (run the database seed first): nothing imported\n` +
        `[api] seed-demo: no project ${DEMO_PROJECT.number}: no flags raised\n`,
    });
  });

  it('imports the demo workbook as revision 1 through the import code, then raises flags at every stage, once', async () => {
    await seedDemo(knex);
    const first = seedDemoCli(db.url);
    expect(first.status).toBe(0);
    expect(first.stderr).toMatch(
      new RegExp(
        '^\\[api\\] seed-demo: imported halvercote-yard\\.xlsx into Halvercote Yard as revision 1 \\(uploaded by Kasimir Oduya, dated 25 days ago\\): 391 members, \\d+ failing\n' +
          `\\[api\\] seed-demo: raised 6 demo flags on revision 1 of project ${DEMO_PROJECT.number} \\(open, overdue, answered, closed, waived, unassigned\\), their history dated from 23 to 2 days ago\n$`,
      ),
    );

    const revision = await knex('revisions as r').join('users as u', 'u.id', 'r.uploaded_by').first('r.number', 'r.member_count', 'r.fail_count', 'r.file_name', 'u.email');
    expect(revision).toMatchObject({ number: 1, member_count: 391, file_name: 'halvercote-yard.xlsx', email: 'kasimir.oduya@halvercote.example' });
    // samples/README.md: 28 of the 391 members were sized to fail, and the engine agreed.
    expect(revision.fail_count).toBe(28);
    const counts = await knex('members').count('* as members').countDistinct('reviewer_id as reviewers').first();
    expect(counts).toEqual({ members: '391', reviewers: '3' });
    expect(await knex('activity').where({ action: 'import.committed' }).count('* as n').first()).toEqual({ n: '1' });

    // Flags at every stage, on failing members, with their history (demo-flags.ts).
    const flags = await knex('flags').select('status').count('* as n').groupBy('status').orderBy('status');
    expect(flags).toEqual([
      { status: 'answered', n: '1' },
      { status: 'closed', n: '1' },
      { status: 'open', n: '3' },
      { status: 'waived', n: '1' },
    ]);
    expect(await knex('flags').whereNotNull('due_date').where('due_date', '<', knex.raw('current_date')).whereIn('status', ['open', 'answered']).count('* as n').first()).toEqual({ n: '1' });

    // The story (demo-history.ts): project, then revision 1, then the flags' steps on different days, none today.
    const daysAgo = async (sql: string) => Number((await knex.raw(`select ((now() at time zone 'utc')::date - (${sql})::date) as d`)).rows[0].d);
    expect(await daysAgo(`select created_at at time zone 'utc' from revisions`)).toBe(25);
    expect(await daysAgo(`select created_at at time zone 'utc' from activity where action = 'project.created'`)).toBe(27);
    expect(await daysAgo(`select created_at at time zone 'utc' from activity where action = 'import.committed'`)).toBe(25);
    const stepDays = await knex('flag_events').where({ kind: 'status' }).countDistinct({ n: knex.raw(`(created_at at time zone 'utc')::date`) }).first();
    expect(Number(stepDays?.n)).toBe(10);
    const events = await knex('flag_events').orderBy(['flag_id', 'id']).select('flag_id', 'created_at');
    for (let i = 1; i < events.length; i++) if (events[i].flag_id === events[i - 1].flag_id) expect(events[i].created_at.getTime()).toBeGreaterThan(events[i - 1].created_at.getTime());
    // A flag's dates are those of its history; each activity entry of a flag is dated with its step.
    const off = await knex.raw(
      `select count(*)::int as n from flags f
        where f.created_at <> (select min(e.created_at) from flag_events e where e.flag_id = f.id)
           or f.updated_at <> (select max(e.created_at) from flag_events e where e.flag_id = f.id)`,
    );
    expect(off.rows[0].n).toBe(0);
    const unmatched = await knex.raw(
      `select count(*)::int as n from activity a
        where a.action like 'flag.%' and not exists (select 1 from flag_events e where e.flag_id = (a.data->>'flagId')::int and e.created_at = a.created_at)`,
    );
    expect(unmatched.rows[0].n).toBe(0);
    expect(await knex('activity').where('created_at', '>', knex.raw(`now() - interval '1 day'`)).count('* as n').first()).toEqual({ n: '0' });

    const again = seedDemoCli(db.url);
    expect(again).toEqual({
      status: 0,
      stderr:
        '[api] seed-demo: Halvercote Yard already has a revision: nothing imported\n' +
        `[api] seed-demo: project ${DEMO_PROJECT.number} has flags already: none raised\n`,
    });
    expect(await knex('revisions').count('* as n').first()).toEqual({ n: '1' });
    expect(await knex('flags').count('* as n').first()).toEqual({ n: '6' });
  }, 120_000);
});
