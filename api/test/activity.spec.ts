import type { ActivityEntry, ActivityPerson, FlagDetail, Page } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp } from './support/test-app';

/*
 * The feed of one project, made by real actions (an import, a flag raised,
 * answered and closed, an invitation) plus entries of kinds other areas write
 * (a sign-off, a reviewer assignment, a limit-set change), put in with fixed
 * times so the day filters have something to cut.
 */
describe('the activity feed', () => {
  let t: TestApp;
  let project: TestProject;
  let other: TestProject;
  let checker: TestUser;
  let engineer: TestUser;
  let manager: TestUser;
  let viewer: ApiClient;
  let outsider: ApiClient;
  let flag: FlagDetail;
  let revisionId: number;
  let base: string;

  async function feed(query = ''): Promise<Page<ActivityEntry>> {
    const res = await viewer.get(`${base}${query ? `?${query}` : ''}`);
    expect(res.status).toBe(200);
    return res.body as Page<ActivityEntry>;
  }

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    checker = await make.user({ name: 'Priya Castellanos' });
    engineer = await make.user({ name: 'Tomas Brandvik' });
    manager = await make.user({ name: 'Mireille Fontaine' });
    const viewerUser = await make.user({ name: 'Aldo Viewer' });
    const outsiderUser = await make.user({ name: 'Olga Outside' });
    project = await make.project({
      name: 'Halvercote Yard',
      team: [[checker, 'checker'], [engineer, 'engineer'], [manager, 'manager'], [viewerUser, 'viewer']],
    });
    other = await make.project({ name: 'Other job', team: [[outsiderUser, 'manager'], [checker, 'checker']] });
    base = `/api/projects/${project.id}/activity`;

    const rev = await new MembersFactory(t).revision(project.id, engineer.id, [{ mark: 'B1', I: 20 }, { mark: 'B2', I: 100 }]);
    revisionId = rev.id;
    const c = {
      checker: await ApiClient.signedIn(t.http, checker.email, PASSWORD),
      engineer: await ApiClient.signedIn(t.http, engineer.email, PASSWORD),
      manager: await ApiClient.signedIn(t.http, manager.email, PASSWORD),
    };
    viewer = await ApiClient.signedIn(t.http, viewerUser.email, PASSWORD);
    outsider = await ApiClient.signedIn(t.http, outsiderUser.email, PASSWORD);

    const raised = await c.checker.post(`/api/projects/${project.id}/flags`, { mark: 'B1', assigneeId: engineer.id, comment: 'Too soft for the live load.' });
    expect(raised.status).toBe(201);
    flag = raised.body;
    const answered = await c.engineer.post(`/api/projects/${project.id}/flags/${flag.id}/answer`, { version: flag.version, body: 'Upsized to a deeper section.' });
    expect(answered.status).toBe(200);
    const closed = await c.checker.post(`/api/projects/${project.id}/flags/${flag.id}/close`, { version: answered.body.version });
    expect(closed.status).toBe(200);
    expect((await c.manager.post(`/api/projects/${project.id}/invitations`, { email: 'new.viewer@firm.example', role: 'viewer' })).status).toBe(201);
    await t.outbox.settle();

    // Entries other areas write, on fixed days (the kinds and data keys of common/api-types/activity.ts).
    const level = project.levels[1];
    await t.knex('activity').insert([
      { project_id: project.id, actor_id: manager.id, action: 'reviewer.assigned', summary: `Mireille Fontaine made Priya Castellanos reviewer of ${level.name}`, data: { levelId: level.id, levelName: level.name, userId: checker.id }, created_at: '2026-11-02T09:00:00Z' },
      { project_id: project.id, actor_id: checker.id, action: 'sign_off.signed', summary: `Priya Castellanos signed off ${level.name}`, data: { levelId: level.id, levelName: level.name }, created_at: '2026-11-03T23:59:59Z' },
      { project_id: project.id, actor_id: null, action: 'sign_off.voided', summary: `Revision 2 changed B7 on ${level.name}: its sign-off no longer holds`, data: { levelId: level.id, levelName: level.name, revisionId, revisionNumber: 2, marks: ['B7'] }, created_at: '2026-11-04T00:00:00Z' },
      { project_id: project.id, actor_id: manager.id, action: 'limit_set.applied', summary: 'Mireille Fontaine applied the limit set "Stiffer floors 100% L/480"', data: { limitSetId: 3, limitSetName: 'Stiffer floors 100% L/480' }, created_at: '2026-11-05T12:00:00Z' },
      // Another project's entry never shows here.
      { project_id: other.id, actor_id: checker.id, action: 'sign_off.signed', summary: 'Priya Castellanos signed off L1 of the other job', data: {}, created_at: '2026-11-03T10:00:00Z' },
    ]);
  });
  afterAll(() => t.close());

  it('lists every entry of the project, newest first, with its kind, actor and links', async () => {
    const page = await feed();
    expect(page.total).toBe(9);
    expect(page.items.map((e) => e.action)).toEqual([
      'team.invited', 'flag.closed', 'flag.answered', 'flag.raised', 'import.committed',
      'limit_set.applied', 'sign_off.voided', 'sign_off.signed', 'reviewer.assigned',
    ]);
    const byAction = new Map(page.items.map((e) => [e.action, e]));
    expect(byAction.get('flag.closed')).toEqual({
      id: expect.any(Number), at: expect.any(String), actor: { id: checker.id, name: 'Priya Castellanos' }, action: 'flag.closed', kind: 'flags',
      summary: `Priya Castellanos closed flag ${flag.id} on B1`, refs: { flagIds: [flag.id], marks: ['B1'] },
    });
    // The revision a flag was raised in, named by its number though the entry holds only its id.
    expect(byAction.get('flag.raised')).toMatchObject({ refs: { flagIds: [flag.id], marks: ['B1'], revision: { id: revisionId, number: 1 } } });
    expect(byAction.get('import.committed')).toMatchObject({ kind: 'imports', actor: { id: engineer.id }, refs: { revision: { id: revisionId, number: 1 } } });
    expect(byAction.get('sign_off.voided')).toMatchObject({ kind: 'sign-offs', actor: null, refs: { level: { id: project.levels[1].id, name: 'L2' }, marks: ['B7'], revision: { id: revisionId, number: 2 } } });
    expect(byAction.get('reviewer.assigned')).toMatchObject({ kind: 'assignments', refs: { level: { name: 'L2' }, user: { id: checker.id, name: 'Priya Castellanos' } } });
    expect(byAction.get('limit_set.applied')).toMatchObject({ kind: 'limit-sets', refs: { limitSet: { id: 3, name: 'Stiffer floors 100% L/480' } } });
    expect(page.items.some((e) => e.summary.includes('other job'))).toBe(false);
  });

  it('filters by kind, one or several', async () => {
    expect((await feed('kind=flags')).items.map((e) => e.action)).toEqual(['flag.closed', 'flag.answered', 'flag.raised']);
    expect((await feed('kind=sign-offs')).items.map((e) => e.action)).toEqual(['sign_off.voided', 'sign_off.signed']);
    expect((await feed('kind=imports,assignments')).items.map((e) => e.action)).toEqual(['import.committed', 'reviewer.assigned']);
    expect((await feed('kind=limit-sets&kind=team')).items.map((e) => e.action)).toEqual(['team.invited', 'limit_set.applied']);
  });

  it('filters by person, by days (UTC, both ends included) and by words, combined', async () => {
    expect((await feed(`actorId=${checker.id}`)).items.map((e) => e.action)).toEqual(['flag.closed', 'flag.raised', 'sign_off.signed']);
    expect((await feed('from=2026-11-03&to=2026-11-04')).items.map((e) => e.action)).toEqual(['sign_off.voided', 'sign_off.signed']);
    expect((await feed('to=2026-11-02')).items.map((e) => e.action)).toEqual(['reviewer.assigned']);
    expect((await feed('from=2026-11-05&to=2026-11-05')).items.map((e) => e.action)).toEqual(['limit_set.applied']);
    expect((await feed('q=b1')).items.map((e) => e.action)).toEqual(['flag.closed', 'flag.answered', 'flag.raised']);
    expect((await feed('q=100%25 L')).items.map((e) => e.action)).toEqual(['limit_set.applied']);
    expect((await feed('q=100_')).total).toBe(0);
    expect((await feed(`kind=flags&actorId=${engineer.id}`)).items.map((e) => e.action)).toEqual(['flag.answered']);
  });

  it('pages through the filtered entries', async () => {
    const first = await feed('pageSize=4');
    const second = await feed('pageSize=4&page=2');
    const third = await feed('pageSize=4&page=3');
    expect([first.total, second.total, third.total]).toEqual([9, 9, 9]);
    expect(third.items).toHaveLength(1);
    const ids = [...first.items, ...second.items, ...third.items].map((e) => e.id);
    expect(new Set(ids).size).toBe(9);
    expect((await feed('kind=flags&pageSize=2&page=2')).items.map((e) => e.action)).toEqual(['flag.raised']);
  });

  it('lists the people who appear in the feed, for the person filter', async () => {
    const res = await viewer.get(`${base}/people`);
    expect(res.status).toBe(200);
    expect(res.body as ActivityPerson[]).toEqual([
      { id: manager.id, name: 'Mireille Fontaine' },
      { id: checker.id, name: 'Priya Castellanos' },
      { id: engineer.id, name: 'Tomas Brandvik' },
    ]);
  });

  it('refuses bad filters with a message that says how to fix them, and hides the feed from outsiders', async () => {
    expectError(await viewer.get(`${base}?kind=gossip`), 400, 'VALIDATION_FAILED', /kind.*imports, flags, assignments, sign-offs, limit-sets/);
    expectError(await viewer.get(`${base}?from=2026-13-01`), 400, 'VALIDATION_FAILED', /from.*YYYY-MM-DD/);
    expectError(await viewer.get(`${base}?to=2026-02-29`), 400, 'VALIDATION_FAILED', /query\.to: must be a calendar date/);
    expectError(await viewer.get(`${base}?from=2026-11-05&to=2026-11-01`), 400, 'VALIDATION_FAILED', /query\.to: is 2026-11-01, before the start day 2026-11-05/);
    expectError(await viewer.get(`${base}?actorId=someone`), 400, 'VALIDATION_FAILED', /actorId/);
    expectError(await viewer.get(`${base}?pageSize=500`), 400, 'VALIDATION_FAILED', /pageSize.*at most 100/);
    expectError(await outsider.get(base), 404, 'NOT_FOUND');
    expectError(await outsider.get(`${base}/people`), 404, 'NOT_FOUND');
  });

  it('serves the kind and person filters from indexes', async () => {
    const plan = async (sql: string, bindings: unknown[]) => {
      await t.knex.raw('set enable_seqscan = off');
      const { rows } = await t.knex.raw(`explain ${sql}`, bindings as never);
      await t.knex.raw('set enable_seqscan = on');
      return rows.map((r: { 'QUERY PLAN': string }) => r['QUERY PLAN']).join('\n');
    };
    expect(await plan(`select id from activity where project_id = ? and split_part(action, '.', 1) = any(?) order by created_at desc limit 25`, [project.id, ['flag']])).toMatch(
      /activity_project_kind_created_index/,
    );
    expect(await plan(`select id from activity where project_id = ? and actor_id = ? order by created_at desc limit 25`, [project.id, checker.id])).toMatch(
      /activity_project_actor_created_index/,
    );
  });
});
