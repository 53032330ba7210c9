import type { FlagsOverTime, MemberFacets, MembersPage, OverviewLevelRow, OverviewReviewerRow, ProjectOverview } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp } from './support/test-app';

/*
 * Hand-counted fixture (members-factory.ts: I = 20 fails L/360 live and
 * L/240 total, I = 100 passes):
 *
 *   level  mark  verdict  schedule reviewer   flags
 *   L1     B1    fail     Priya               F1 open (L/360 live, overdue), F5 closed (L/240 total)
 *   L1     B2    fail     Priya               F2 answered
 *   L1     B3    pass     Priya
 *   L1     B4    pass     Tomas
 *   L2     C1    fail     Tomas               F3 closed
 *   L2     C2    pass     (none)
 *   L2     C3    fail     not on the team     F4 waived
 *   Roof   —
 *
 * L1: 4 members, 2 pass, 2 fail; flags 1 open, 1 answered, 1 closed → 3, 33.3 % closed, 1 overdue.
 * L2: 3 members, 1 pass, 2 fail; flags 1 closed, 1 waived → 2, 100 %.
 * Priya: 3 members (1 pass, 2 fail), flags 1/1/1/0, 1 overdue; Tomas: 2 (1/1), 1 closed;
 * no reviewer: 2 (1/1), 1 waived. Totals: 7 members, 3 pass, 4 fail; 5 flags, 60 % closed, 1 overdue.
 */
describe('the overview: counts per level and per reviewer, flags over time, reviewer assignment', () => {
  let t: TestApp;
  let project: TestProject;
  let priya: TestUser;
  let tomas: TestUser;
  let engineer: TestUser;
  let viewerC: ApiClient;
  let checkerC: ApiClient;
  let managerC: ApiClient;
  let engineerC: ApiClient;
  let base: string;
  const flagIds: Record<string, number> = {};
  let members: MembersFactory;

  const counts = (r: OverviewLevelRow | OverviewReviewerRow) => [
    r.members, r.pass, r.fail, r.flagsOpen, r.flagsAnswered, r.flagsClosed, r.flagsWaived, r.flagsTotal, r.percentClosed, r.overdue,
  ];

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    priya = await make.user({ name: 'Priya Castellanos' });
    tomas = await make.user({ name: 'Tomas Brandvik' });
    engineer = await make.user({ name: 'Kasimir Oduya' });
    const manager = await make.user({ name: 'Mireille Fontaine' });
    const viewer = await make.user({ name: 'Dalia Stroud' });
    project = await make.project({ name: 'Halvercote Yard', team: [[priya, 'checker'], [tomas, 'checker'], [engineer, 'engineer'], [manager, 'manager'], [viewer, 'viewer']] });
    members = new MembersFactory(t);
    await members.revision(project.id, engineer.id, [
      { mark: 'B1', I: 20, reviewer: priya.email },
      { mark: 'B2', I: 20, reviewer: priya.email },
      { mark: 'B3', I: 100, reviewer: priya.email },
      { mark: 'B4', I: 100, reviewer: tomas.email },
      { mark: 'C1', level: 'L2', I: 20, reviewer: tomas.email },
      { mark: 'C2', level: 'L2', I: 100 },
      { mark: 'C3', level: 'L2', I: 20, reviewer: 'someone@elsewhere.example' },
    ]);
    checkerC = await ApiClient.signedIn(t.http, priya.email, PASSWORD);
    managerC = await ApiClient.signedIn(t.http, manager.email, PASSWORD);
    engineerC = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    viewerC = await ApiClient.signedIn(t.http, viewer.email, PASSWORD);
    base = `/api/projects/${project.id}`;

    const raise = async (name: string, mark: string, checkName: string) => {
      const res = await checkerC.post(`${base}/flags`, { mark, checkName, assigneeId: engineer.id });
      if (res.status !== 201) throw new Error(JSON.stringify(res.body));
      flagIds[name] = res.body.id;
      return res.body as { id: number; version: number };
    };
    await raise('F1', 'B1', 'L/360 live');
    const f2 = await raise('F2', 'B2', 'L/360 live');
    const f3 = await raise('F3', 'C1', 'L/360 live');
    const f4 = await raise('F4', 'C3', 'L/360 live');
    const f5 = await raise('F5', 'B1', 'L/240 total');
    expect((await engineerC.post(`${base}/flags/${f2.id}/answer`, { version: f2.version, body: 'Deeper section next revision.' })).status).toBe(200);
    expect((await checkerC.post(`${base}/flags/${f3.id}/close`, { version: f3.version })).status).toBe(200);
    expect((await checkerC.post(`${base}/flags/${f4.id}/waive`, { version: f4.version, reason: 'Accepted by the engineer of record.' })).status).toBe(200);
    expect((await checkerC.post(`${base}/flags/${f5.id}/close`, { version: f5.version })).status).toBe(200);
    // F1 is overdue: due yesterday (set directly, a raise refuses no date but the screen would not offer it).
    await t.knex('flags').where({ id: flagIds.F1 }).update({ due_date: t.knex.raw(`(now() at time zone 'utc')::date - 1`) });
  });
  afterAll(() => t.close());

  async function overview(c: ApiClient = viewerC): Promise<ProjectOverview> {
    const res = await c.get(`${base}/overview`);
    expect(res.status).toBe(200);
    return res.body;
  }

  it('counts members and flags per level, per reviewer and in total, as counted by hand', async () => {
    const o = await overview();
    expect(o.project).toEqual({ id: project.id, name: 'Halvercote Yard', number: project.number });
    expect(o.latestRevision).toMatchObject({ number: 1, memberCount: 7, uploadedBy: { id: engineer.id, name: 'Kasimir Oduya' }, diff: null, fileName: 'schedule-1.csv' });
    expect(o.levels.map((l) => [l.level?.name, ...counts(l)])).toEqual([
      ['L1', 4, 2, 2, 1, 1, 1, 0, 3, 33.3, 1],
      ['L2', 3, 1, 2, 0, 0, 1, 1, 2, 100, 0],
      ['Roof', 0, 0, 0, 0, 0, 0, 0, 0, null, 0],
    ]);
    expect(o.reviewers.map((r) => [r.reviewer?.name ?? null, r.present, ...counts(r)])).toEqual([
      ['Priya Castellanos', true, 3, 1, 2, 1, 1, 1, 0, 3, 33.3, 1],
      ['Tomas Brandvik', true, 2, 1, 1, 0, 0, 1, 0, 1, 100, 0],
      [null, true, 2, 1, 1, 0, 0, 0, 1, 1, 100, 0],
    ]);
    expect(counts(o.totals as OverviewLevelRow)).toEqual([7, 3, 4, 1, 1, 2, 1, 5, 60, 1]);
    expect(o.levels.every((l) => l.signOff === null && l.assignedReviewer === null)).toBe(true);
    expect(o.today).toMatch(/^\d{4}-\d{2}-\d{2}$/);
  });

  it('answers the same counts as the flags summary and the members facets (one truth)', async () => {
    const summary = (await viewerC.get(`${base}/flags/summary`)).body;
    const o = await overview();
    expect(summary.byStatus).toEqual({ open: o.totals.flagsOpen, answered: o.totals.flagsAnswered, closed: o.totals.flagsClosed, waived: o.totals.flagsWaived });
    expect(summary.overdue).toBe(o.totals.overdue);
    const facets = (await viewerC.get(`${base}/members/facets`)).body as MemberFacets;
    expect(facets.levels.map((l) => [l.name, l.count, l.failCount])).toEqual(o.levels.filter((l) => l.members > 0).map((l) => [l.level!.name, l.members, l.fail]));
  });

  it('moves the counts when a flag is answered and closed, and lists flags of marks that left the schedule apart', async () => {
    const f1 = (await viewerC.get(`${base}/flags/${flagIds.F1}`)).body;
    const answered = await engineerC.post(`${base}/flags/${f1.id}/answer`, { version: f1.version, body: 'Changed to a deeper section.' });
    let o = await overview();
    expect(counts(o.levels[0])).toEqual([4, 2, 2, 0, 1 + 1, 1, 0, 3, 33.3, 1]);
    await checkerC.post(`${base}/flags/${f1.id}/close`, { version: answered.body.version });
    o = await overview();
    expect(counts(o.levels[0])).toEqual([4, 2, 2, 0, 1, 2, 0, 3, 66.7, 0]);
    expect(o.totals.percentClosed).toBe(80);

    // Revision 2 leaves C3 out: its waived flag no longer sits on a level or a reviewer.
    await members.revision(project.id, engineer.id, [
      { mark: 'B1', I: 20, reviewer: priya.email }, { mark: 'B2', I: 20, reviewer: priya.email }, { mark: 'B3', I: 100, reviewer: priya.email },
      { mark: 'B4', I: 100, reviewer: tomas.email }, { mark: 'C1', level: 'L2', I: 20, reviewer: tomas.email }, { mark: 'C2', level: 'L2', I: 100 },
    ], 'C3 deleted');
    o = await overview();
    expect(o.latestRevision).toMatchObject({ number: 2, label: 'C3 deleted', memberCount: 6, diff: { againstNumber: 1, added: 0, removed: 1, changed: 0, flips: 0 } });
    expect(o.levels.map((l) => [l.level?.name ?? null, l.members, l.flagsWaived, l.flagsTotal])).toEqual([
      ['L1', 4, 0, 3], ['L2', 2, 0, 1], ['Roof', 0, 0, 0], [null, 0, 1, 1],
    ]);
    expect(o.reviewers.map((r) => [r.reviewer?.name ?? null, r.present, r.members, r.flagsTotal])).toEqual([
      ['Priya Castellanos', true, 3, 3], ['Tomas Brandvik', true, 2, 1], [null, true, 1, 0], [null, false, 0, 1],
    ]);
    expect(o.totals.members).toBe(6);
    expect(o.totals.flagsTotal).toBe(5);
  });

  it('counts again after a limit-set recompute rewrites verdicts in place (same revision)', async () => {
    const first = await overview();
    // What the recompute does (api/src/checks): members' verdicts and the revision's counts, in one transaction.
    const latest = await t.knex('revisions').where({ project_id: project.id }).orderBy('number', 'desc').first('id');
    await t.knex.transaction(async (trx) => {
      await trx('members').where({ revision_id: latest.id, mark: 'B4' }).update({ verdict: 'fail' });
      await trx('revisions').where({ id: latest.id }).update({ fail_count: trx.raw('fail_count + 1'), pass_count: trx.raw('pass_count - 1') });
    });
    const second = await overview();
    expect(second.totals.fail).toBe(first.totals.fail + 1);
    expect(second.levels[0].fail).toBe(first.levels[0].fail + 1);
    await t.knex.transaction(async (trx) => {
      await trx('members').where({ revision_id: latest.id, mark: 'B4' }).update({ verdict: 'pass' });
      await trx('revisions').where({ id: latest.id }).update({ fail_count: trx.raw('fail_count - 1'), pass_count: trx.raw('pass_count + 1') });
    });
    expect((await overview()).totals.fail).toBe(first.totals.fail);
  });

  it('draws flags over time from the status history, day by day (UTC)', async () => {
    const other = await new Factories(t.knex).project({ team: [[priya, 'checker'], [engineer, 'engineer']] });
    await members.revision(other.id, engineer.id, ['D1', 'D2', 'D3', 'D4', 'D5'].map((mark) => ({ mark, I: 20 })));
    const b = `/api/projects/${other.id}/flags`;
    const ids: Record<string, { id: number; version: number }> = {};
    for (const [name, mark] of [['G1', 'D1'], ['G2', 'D2'], ['G3', 'D3'], ['G4', 'D4'], ['G5', 'D5']]) ids[name] = (await checkerC.post(b, { mark, assigneeId: engineer.id })).body;
    await engineerC.post(`${b}/${ids.G2.id}/answer`, { version: ids.G2.version, body: 'Done.' });
    await checkerC.post(`${b}/${ids.G3.id}/close`, { version: ids.G3.version });
    await checkerC.post(`${b}/${ids.G4.id}/waive`, { version: ids.G4.version, reason: 'Accepted.' });
    await checkerC.post(`${b}/${ids.G5.id}/close`, { version: ids.G5.version });
    // Back-date: G1 and G3 raised 5 days ago, G2 3 days ago, G3 closed 2 days ago (the rest today).
    const back = (id: number, to: string | null, days: number) =>
      t.knex('flag_events').where({ flag_id: id, kind: 'status' }).whereRaw('to_status is not distinct from ?', [to]).update({ created_at: t.knex.raw(`now() - interval '${days} days'`) });
    await back(ids.G1.id, 'open', 5);
    await back(ids.G3.id, 'open', 5);
    await back(ids.G2.id, 'open', 3);
    await back(ids.G3.id, 'closed', 2);

    const res = await checkerC.get(`/api/projects/${other.id}/overview/flags-over-time?days=7`);
    expect(res.status).toBe(200);
    const series = res.body as FlagsOverTime;
    expect(series.points).toHaveLength(7);
    expect(series.to).toBe((await overview()).today);
    expect(series.points.map((p) => [p.open, p.answered, p.closed, p.waived, p.raised])).toEqual([
      [0, 0, 0, 0, 0],
      [2, 0, 0, 0, 2],
      [2, 0, 0, 0, 0],
      [3, 0, 0, 0, 1],
      [2, 0, 1, 0, 0],
      [2, 0, 1, 0, 0],
      [1, 1, 2, 1, 2],
    ]);
    // A shorter window starts from the counts of its first day, not from zero.
    const short = (await checkerC.get(`/api/projects/${other.id}/overview/flags-over-time?days=2`)).body as FlagsOverTime;
    expect(short.points.map((p) => [p.open, p.closed])).toEqual([[2, 1], [1, 2]]);
    expectError(await checkerC.get(`/api/projects/${other.id}/overview/flags-over-time?days=0`), 400, 'VALIDATION_FAILED', /days: must be 1 day or more/);
    expectError(await checkerC.get(`/api/projects/${other.id}/overview/flags-over-time?days=lots`), 400, 'VALIDATION_FAILED', /days: must be a whole number of days/);
    // A project without flags: a flat line of zeros ending today.
    const empty = await new Factories(t.knex).project({ team: [[priya, 'checker']] });
    const flat = (await checkerC.get(`/api/projects/${empty.id}/overview/flags-over-time?days=3`)).body as FlagsOverTime;
    expect(flat.points.map((p) => p.open + p.closed + p.raised)).toEqual([0, 0, 0]);
  });

  describe('reviewer assignment', () => {
    const reviewerOf = async (): Promise<Record<string, string | null>> => {
      const page = (await viewerC.get(`${base}/members?pageSize=100`)).body as MembersPage;
      return Object.fromEntries(page.items.map((m) => [m.mark, m.reviewer?.name ?? null]));
    };
    const L = (name: string) => project.levels.find((l) => l.name === name)!.id;

    it('assigns a checker to a level: its members, the Members filter and facets and the overview follow', async () => {
      const res = await managerC.send('put', `${base}/reviewer-assignments/levels/${L('L2')}`, { reviewerId: priya.id });
      expect(res.status).toBe(200);
      expect(res.body.levels.map((l: { level: { name: string }; reviewer: { name: string } | null }) => [l.level.name, l.reviewer?.name ?? null])).toEqual([
        ['L1', null], ['L2', 'Priya Castellanos'], ['Roof', null],
      ]);
      expect(res.body.candidates.map((c: { name: string }) => c.name)).toEqual(['Priya Castellanos', 'Tomas Brandvik']);
      expect(await reviewerOf()).toEqual({ B1: 'Priya Castellanos', B2: 'Priya Castellanos', B3: 'Priya Castellanos', B4: 'Tomas Brandvik', C1: 'Priya Castellanos', C2: 'Priya Castellanos' });
      const filtered = (await viewerC.get(`${base}/members?reviewer=${priya.id}&level=${L('L2')}`)).body as MembersPage;
      expect(filtered.items.map((m) => m.mark)).toEqual(['C1', 'C2']);
      const facets = (await viewerC.get(`${base}/members/facets`)).body as MemberFacets;
      expect(facets.reviewers.map((r) => [r.name, r.count])).toEqual([['Priya Castellanos', 5], ['Tomas Brandvik', 1]]);
      const o = await overview();
      expect(o.levels.find((l) => l.level?.name === 'L2')!.assignedReviewer).toEqual({ id: priya.id, name: 'Priya Castellanos' });
      expect(o.reviewers.map((r) => [r.reviewer?.name ?? null, r.members])).toEqual([['Priya Castellanos', 5], ['Tomas Brandvik', 1], [null, 0]]);
      const activity = await t.knex('activity').where({ project_id: project.id, action: 'reviewer.assigned' }).pluck('summary');
      expect(activity).toEqual(['Mireille Fontaine assigned Priya Castellanos to review L2']);
    });

    it("lets a member's own assignment beat its level's, and removing the level's brings the schedule's back", async () => {
      const res = await managerC.send('put', `${base}/reviewer-assignments/members`, { marks: ['c2', 'B3'], reviewerId: tomas.id });
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ marks: ['B3', 'C2'], reviewer: { id: tomas.id, name: 'Tomas Brandvik' } });
      expect(await reviewerOf()).toMatchObject({ B3: 'Tomas Brandvik', C1: 'Priya Castellanos', C2: 'Tomas Brandvik' });
      expect((await managerC.send('put', `${base}/reviewer-assignments/levels/${L('L2')}`, { reviewerId: null })).status).toBe(200);
      // C1: the schedule's Tomas again; C2 keeps its own assignment.
      expect(await reviewerOf()).toEqual({ B1: 'Priya Castellanos', B2: 'Priya Castellanos', B3: 'Tomas Brandvik', B4: 'Tomas Brandvik', C1: 'Tomas Brandvik', C2: 'Tomas Brandvik' });
      expect((await managerC.send('put', `${base}/reviewer-assignments/members`, { marks: ['B3'], reviewerId: null })).status).toBe(200);
      expect((await reviewerOf()).B3).toBe('Priya Castellanos');
      const list = (await viewerC.get(`${base}/reviewer-assignments`)).body;
      expect(list.members).toEqual([{ mark: 'C2', reviewer: { id: tomas.id, name: 'Tomas Brandvik' } }]);
    });

    it('carries assignments into the next revision', async () => {
      await managerC.send('put', `${base}/reviewer-assignments/levels/${L('L1')}`, { reviewerId: tomas.id });
      await members.revision(project.id, engineer.id, [
        { mark: 'B1', I: 20, reviewer: priya.email }, { mark: 'B2', I: 20, reviewer: priya.email }, { mark: 'B5', I: 100 },
        { mark: 'C1', level: 'L2', I: 20, reviewer: tomas.email }, { mark: 'C2', level: 'L2', I: 100, reviewer: priya.email },
      ]);
      expect(await reviewerOf()).toEqual({ B1: 'Tomas Brandvik', B2: 'Tomas Brandvik', B5: 'Tomas Brandvik', C1: 'Tomas Brandvik', C2: 'Tomas Brandvik' });
      // Older revisions keep the reviewers they had.
      const rev1 = await t.knex('revisions').where({ project_id: project.id, number: 1 }).first('id');
      const old = (await viewerC.get(`${base}/members?revision=${rev1.id}&pageSize=100`)).body as MembersPage;
      expect(old.items.find((m) => m.mark === 'B1')!.reviewer?.name).toBe('Priya Castellanos');
    });

    it('refuses reviewers who are not checkers, unknown levels and marks, writing nothing', async () => {
      const before = await t.counts(['reviewer_assignments', 'activity']);
      expectError(await managerC.send('put', `${base}/reviewer-assignments/levels/${L('Roof')}`, { reviewerId: engineer.id }), 400, 'VALIDATION_FAILED',
        `body.reviewerId: user ${engineer.id} is not a checker on this project; reviewers are checkers (Priya Castellanos, Tomas Brandvik)`);
      expectError(await managerC.send('put', `${base}/reviewer-assignments/levels/${L('Roof')}`, {}), 400, 'VALIDATION_FAILED', 'Some fields need fixing: body.reviewerId: is required');
      expectError(await managerC.send('put', `${base}/reviewer-assignments/levels/999999`, { reviewerId: priya.id }), 404, 'NOT_FOUND', 'Level 999999 is not a level of this project; the Overview lists the levels there are.');
      const body = expectError(await managerC.send('put', `${base}/reviewer-assignments/members`, { marks: ['B1', 'Z9'], reviewerId: priya.id }), 400, 'VALIDATION_FAILED',
        'Some marks are not in revision 3: Z9. Nothing was assigned; correct or remove them.');
      expect(body.details).toEqual([{ path: 'body.marks[1]', message: 'there is no member "Z9" in revision 3 (the latest)' }]);
      expectError(await managerC.send('put', `${base}/reviewer-assignments/members`, { marks: [], reviewerId: priya.id }), 400, 'VALIDATION_FAILED', /body\.marks: must name at least one mark/);
      expect(await t.counts(['reviewer_assignments', 'activity'])).toEqual(before);
    });
  });
});
