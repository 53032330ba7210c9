import type { ImportPreview } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD, type TestProject } from './support/factories';
import { TestApp } from './support/test-app';
import { uploadFile } from './fixtures/import-client';
import { floorBeams, xlsxOf } from './fixtures/schedule-files';

/**
 * Loads and results have no foreign key to members (migration
 * 20261202178000, for import speed): deleting members, directly or by
 * deleting their revision or project, still deletes their loads and results,
 * and nothing of another revision.
 */
describe('deleting members deletes their loads and results', () => {
  let t: TestApp;
  let project: TestProject;
  let eng: ApiClient;

  beforeAll(async () => {
    t = await TestApp.start();
    const f = new Factories(t.knex);
    const engineer = await f.user({ name: 'Delete Engineer' });
    project = await f.project({ name: 'Delete Yard', levels: ['L1'], team: [[engineer, 'engineer']] });
    eng = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
  });
  afterAll(() => t.close());

  async function commitRevision(n: number): Promise<number> {
    const members = floorBeams(n, { levels: ['L1'], failEvery: 2 });
    const loads = members.map((m) => ({ mark: m.mark, case: 'L', kind: 'point', position: 1, value: 2 }));
    const up = await uploadFile(t, eng, project.id, await xlsxOf(members, { loads }), 'r.xlsx');
    expect(up.status).toBe(201);
    const commit = await eng.post(`/api/projects/${project.id}/imports/${(up.body as ImportPreview).draftId}/commit`, { label: null });
    expect(commit.status).toBe(201);
    return commit.body.revision.id as number;
  }

  const counts = async (revisionId: number) => {
    const { rows } = await t.knex.raw(
      `select (select count(*) from member_loads l where l.member_id in (select id from members where revision_id = ?))::int as loads,
              (select count(*) from results where revision_id = ?)::int as results,
              (select count(*) from member_loads l where not exists (select 1 from members m where m.id = l.member_id))::int as "orphanLoads",
              (select count(*) from results r where not exists (select 1 from members m where m.id = r.member_id))::int as "orphanResults"`,
      [revisionId, revisionId],
    );
    return rows[0] as { loads: number; results: number; orphanLoads: number; orphanResults: number };
  };

  it('by member, by revision and by project', async () => {
    const first = await commitRevision(4);
    const second = await commitRevision(5);
    const before = await counts(second);
    expect(before.loads).toBeGreaterThan(0);
    expect(before.results).toBeGreaterThan(0);

    const [one] = await t.knex('members').where({ revision_id: second }).orderBy('id').limit(1).pluck('id');
    const resultsOfOne = Number((await t.knex('results').where({ member_id: one }).count({ n: '*' }))[0].n);
    const loadsOfOne = Number((await t.knex('member_loads').where({ member_id: one }).count({ n: '*' }))[0].n);
    expect(resultsOfOne).toBeGreaterThan(0);
    expect(loadsOfOne).toBeGreaterThan(0);
    await t.knex('members').where({ id: one }).delete();
    expect(await counts(second)).toEqual({ loads: before.loads - loadsOfOne, results: before.results - resultsOfOne, orphanLoads: 0, orphanResults: 0 });

    const firstBefore = await counts(first);
    await t.knex('revisions').where({ id: second }).delete();
    expect(await counts(second)).toEqual({ loads: 0, results: 0, orphanLoads: 0, orphanResults: 0 });
    expect(await counts(first)).toEqual(firstBefore);

    await t.knex('projects').where({ id: project.id }).delete();
    expect(await counts(first)).toEqual({ loads: 0, results: 0, orphanLoads: 0, orphanResults: 0 });
  });
});
