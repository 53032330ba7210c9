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
    expect(r).toEqual({ status: 0, stderr: `[api] seed-demo: no project ${DEMO_PROJECT.number} (run the database seed first): nothing imported\n` });
  });

  it('imports the demo workbook as revision 1 through the import code, once', async () => {
    await seedDemo(knex);
    const first = seedDemoCli(db.url);
    expect(first.status).toBe(0);
    expect(first.stderr).toMatch(/^\[api\] seed-demo: imported halvercote-yard\.xlsx into Halvercote Yard as revision 1 \(uploaded by Kasimir Oduya\): 391 members, \d+ failing\n$/);

    const revision = await knex('revisions as r').join('users as u', 'u.id', 'r.uploaded_by').first('r.number', 'r.member_count', 'r.fail_count', 'r.file_name', 'u.email');
    expect(revision).toMatchObject({ number: 1, member_count: 391, file_name: 'halvercote-yard.xlsx', email: 'kasimir.oduya@halvercote.example' });
    // samples/README.md: 28 of the 391 members were sized to fail, and the engine agreed.
    expect(revision.fail_count).toBe(28);
    const counts = await knex('members').count('* as members').countDistinct('reviewer_id as reviewers').first();
    expect(counts).toEqual({ members: '391', reviewers: '3' });
    expect(await knex('activity').where({ action: 'import.committed' }).count('* as n').first()).toEqual({ n: '1' });

    const again = seedDemoCli(db.url);
    expect(again).toEqual({ status: 0, stderr: '[api] seed-demo: Halvercote Yard already has a revision: nothing imported\n' });
    expect(await knex('revisions').count('* as n').first()).toEqual({ n: '1' });
  }, 120_000);
});
