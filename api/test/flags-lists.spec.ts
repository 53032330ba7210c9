import type { BulkRaiseFlagsResponse, Flag } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp } from './support/test-app';

/*
 * Revision 1: failing steel floor beams (I = 20 ×10⁶ mm⁴, utilisation 1.52
 * under L/360 live, members-factory.ts) on L1 and L2, and passing ones
 * (I = 100). Reviewers are on the team so the summary can group by them.
 */
describe('flags in bulk, the flag list and its summary', () => {
  let t: TestApp;
  let make: Factories;
  let project: TestProject;
  let checker: TestUser;
  let engineer: TestUser;
  let engineer2: TestUser;
  let checkerC: ApiClient;
  let engineerC: ApiClient;
  let managerC: ApiClient;
  let base: string;

  beforeAll(async () => {
    t = await TestApp.start();
    make = new Factories(t.knex);
    checker = await make.user({ name: 'Priya Castellanos' });
    engineer = await make.user({ name: 'Tomas Brandvik' });
    engineer2 = await make.user({ name: 'Ines Okafor' });
    const manager = await make.user({ name: 'Mireille Fontaine' });
    project = await make.project({ name: 'Halvercote Yard', team: [[checker, 'checker'], [engineer, 'engineer'], [engineer2, 'engineer'], [manager, 'manager']] });
    await new MembersFactory(t).revision(project.id, engineer.id, [
      { mark: 'B1', I: 20 }, { mark: 'B2', I: 20 }, { mark: 'B10', I: 20 }, { mark: 'B11', I: 100 },
      { mark: 'C1', level: 'L2', I: 20 }, { mark: 'C2', level: 'L2', I: 20 }, { mark: 'C3', level: 'L2', I: 100 }, { mark: 'C4', level: 'L2', I: 20, grid: 'D/4-5' },
      { mark: 'R1', level: 'Roof', I: 20 },
    ]);
    checkerC = await ApiClient.signedIn(t.http, checker.email, PASSWORD);
    engineerC = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    managerC = await ApiClient.signedIn(t.http, manager.email, PASSWORD);
    base = `/api/projects/${project.id}/flags`;
  });
  afterAll(() => t.close());

  const marks = (flags: Flag[]) => flags.map((f) => f.mark);

  it('raises one flag per listed mark, skipping marks that already have an open flag of the same check, with one e-mail', async () => {
    expect((await checkerC.post(base, { mark: 'B2', checkName: 'L/360 live' })).status).toBe(201);
    const res = await checkerC.post(`${base}/bulk`, { marks: ['b1', 'B2', 'B10', 'B1'], checkName: 'L/360 live', assigneeId: engineer.id, dueDate: '2027-02-01', comment: 'Floor 1 live-load failures.' });
    expect(res.status).toBe(201);
    const body = res.body as BulkRaiseFlagsResponse;
    expect(marks(body.created)).toEqual(['B1', 'B10']);
    expect(body).toMatchObject({ skipped: 1, skippedMarks: ['B2'] });
    expect(body.created[0]).toMatchObject({ title: 'B1 fails L/360 live (utilisation 1.52)', assignee: { id: engineer.id, name: 'Tomas Brandvik' }, dueDate: '2027-02-01', comment: 'Floor 1 live-load failures.', status: 'open', version: 1 });

    const mails = (await t.mailbox()).filter((m) => m.to.includes(engineer.email));
    expect(mails.map((m) => m.subject)).toEqual(['2 flags assigned to you (Halvercote Yard)']);
    expect(mails[0].text).toContain('Priya Castellanos raised 2 flags in Halvercote Yard and assigned them to you:');
    expect(mails[0].text).toContain(`B10: B10 fails L/360 live (utilisation 1.52) (due 2027-02-01)\n  http://sagline.test/projects/${project.id}/flags/${body.created[1].id}`);
    const activity = await t.knex('activity').where({ project_id: project.id, action: 'flag.bulk_raised' }).pluck('summary');
    expect(activity).toEqual(['Priya Castellanos raised 2 flags for L/360 live on B1, B10, assigned to Tomas Brandvik (1 skipped: already flagged)']);

    // Again: everything is skipped now, and nothing is written or sent.
    const again = await checkerC.post(`${base}/bulk`, { marks: ['B1', 'B10'], checkName: 'L/360 live' });
    expect(again.body).toEqual({ created: [], skipped: 2, skippedMarks: ['B1', 'B10'] });
  });

  it('raises flags on every failing member of a Members filter', async () => {
    const res = await checkerC.post(`${base}/bulk`, { filter: { level: String(project.levels[1].id) }, assigneeId: engineer2.id });
    expect(res.status).toBe(201);
    expect(marks(res.body.created)).toEqual(['C1', 'C2', 'C4']);
    expect(res.body.created.every((f: Flag) => f.checkName === null && f.member?.level.name === 'L2')).toBe(true);
    // With checkName, the filter's members are those failing that check; q narrows by mark or grid.
    const byCheck = await checkerC.post(`${base}/bulk`, { filter: { q: 'd/4' }, checkName: 'L/240 total' });
    expect(marks(byCheck.body.created)).toEqual(['C4']);
    expectError(await checkerC.post(`${base}/bulk`, { filter: { check: 'L/360 live' }, checkName: 'L/240 total' }), 400, 'VALIDATION_FAILED', 'body.filter.check: leave it out when checkName is given: the flags go on the members failing checkName');
  });

  it('refuses a bulk raise with unknown marks, or without exactly one of marks and filter, writing nothing', async () => {
    const before = await t.counts(['flags', 'flag_events', 'activity', 'outbound_mail']);
    const res = await checkerC.post(`${base}/bulk`, { marks: ['R1', 'Z9', 'B1', 'Q7'] });
    const body = expectError(res, 400, 'VALIDATION_FAILED', 'Some marks are not in revision 1: Z9, Q7. Nothing was raised; correct or remove them.');
    expect(body.details).toEqual([
      { path: 'body.marks[1]', message: 'there is no member "Z9" in revision 1 (the latest)' },
      { path: 'body.marks[3]', message: 'there is no member "Q7" in revision 1 (the latest)' },
    ]);
    expectError(await checkerC.post(`${base}/bulk`, {}), 400, 'VALIDATION_FAILED', 'body: send marks (a list of marks) or filter (the Members filter of the failing members to flag)');
    expectError(await checkerC.post(`${base}/bulk`, { marks: ['R1'], filter: {} }), 400, 'VALIDATION_FAILED', 'body: send either marks or filter, not both');
    expectError(await checkerC.post(`${base}/bulk`, { marks: [] }), 400, 'VALIDATION_FAILED', /body\.marks: must name at least one mark/);
    expectError(await checkerC.post(`${base}/bulk`, { marks: ['R1'], checkName: 'L/90 wind' }), 400, 'VALIDATION_FAILED', 'body.checkName: R1 has no check "L/90 wind" in revision 1; leave them out or raise them without a check');
    expectError(await checkerC.post(`${base}/bulk`, { filter: { utilMin: 'lots' } }), 400, 'VALIDATION_FAILED', /body\.filter\.utilMin: must be a number/);
    expect(await t.counts(['flags', 'flag_events', 'activity', 'outbound_mail'])).toEqual(before);
  });

  it('assigns many flags at once, skipping closed ones and those already so assigned', async () => {
    const all = (await checkerC.get(`${base}?pageSize=200&sort=mark`)).body.items as Flag[];
    const b1 = all.find((f) => f.mark === 'B1')!;
    const c1 = all.find((f) => f.mark === 'C1')!;
    const c2 = all.find((f) => f.mark === 'C2')!;
    expect((await checkerC.post(`${base}/${c2.id}/close`, { version: c2.version })).status).toBe(200);

    const res = await managerC.post(`${base}/bulk-assign`, { flagIds: [c1.id, c2.id, b1.id], assigneeId: engineer2.id, dueDate: '2027-03-01' });
    expect(res.status).toBe(200);
    expect(res.body.skippedIds).toEqual([c2.id]);
    expect(res.body.skipped).toBe(1);
    expect(res.body.updated.map((f: Flag) => [f.mark, f.assignee?.id, f.dueDate, f.version])).toEqual([['B1', engineer2.id, '2027-03-01', 2], ['C1', engineer2.id, '2027-03-01', 2]]);
    const mail = (await t.mailbox()).find((m) => m.to.includes(engineer2.email) && m.subject.startsWith('Flag on B1'));
    expect(mail?.text).toContain('Mireille Fontaine assigned you the flag on B1 in Halvercote Yard.');
    expect((await checkerC.get(`${base}/${c1.id}`)).body.events.map((e: { kind: string }) => e.kind)).toEqual(['status', 'due']);

    expectError(await managerC.post(`${base}/bulk-assign`, { flagIds: [b1.id, 999999], assigneeId: null }), 400, 'VALIDATION_FAILED', 'Some flags are not flags of this project: 999999. Nothing was changed; reload the Flags screen and try again.');
    expectError(await managerC.post(`${base}/bulk-assign`, { flagIds: [b1.id] }), 400, 'VALIDATION_FAILED', 'Some fields need fixing: body.assigneeId: is required');
    const unassign = await managerC.post(`${base}/bulk-assign`, { flagIds: [b1.id], assigneeId: null });
    expect(unassign.body.updated[0]).toMatchObject({ mark: 'B1', assignee: null, dueDate: '2027-03-01' });
  });

  it('filters, sorts and pages the list in SQL', async () => {
    const get = async (query: string) => {
      const res = await engineerC.get(`${base}?${query}`);
      expect(res.status).toBe(200);
      return res.body as { items: Flag[]; total: number; page: number; pageSize: number };
    };
    const everything = await get('sort=mark&pageSize=200');
    expect(marks(everything.items)).toEqual(['B1', 'B2', 'B10', 'C1', 'C2', 'C4', 'C4']);
    expect(everything.total).toBe(7);

    const page2 = await get('sort=mark&pageSize=3&page=2');
    expect({ marks: marks(page2.items), total: page2.total, page: page2.page, pageSize: page2.pageSize }).toEqual({ marks: ['C1', 'C2', 'C4'], total: 7, page: 2, pageSize: 3 });
    expect(marks((await get('sort=-mark&pageSize=2')).items)).toEqual(['C4', 'C4']);

    expect(marks((await get('status=closed')).items)).toEqual(['C2']);
    expect((await get('status=open,answered')).total).toBe(6);
    expect(marks((await get(`level=${project.levels[1].id}&sort=mark`)).items)).toEqual(['C1', 'C2', 'C4', 'C4']);
    expect(marks((await get('mark=b1&sort=mark')).items)).toEqual(['B1', 'B10']);
    expect(marks((await get(`check=${encodeURIComponent('L/240 total')}`)).items)).toEqual(['C4']);
    // "me" is the caller (the engineer); "none" the unassigned ones.
    expect(marks((await get('assignee=me&sort=mark')).items)).toEqual(['B10']);
    expect((await get(`assignee=${engineer2.id},none`)).total).toBe(6);

    // Overdue: open or answered with a due date before today (UTC).
    const b10 = everything.items.find((f) => f.mark === 'B10')!;
    expect((await checkerC.patch(`${base}/${b10.id}`, { version: b10.version, dueDate: '2020-01-01' })).body.overdue).toBe(true);
    expect(marks((await get('overdue=true')).items)).toEqual(['B10']);
    expect((await get('overdue=false')).total).toBe(6);
    expect(marks((await get('sort=due&pageSize=1')).items)).toEqual(['B10']);

    const bad = expectError(await engineerC.get(`${base}?status=done&sort=size&pageSize=1000&assignee=x&overdue=maybe`), 400, 'VALIDATION_FAILED');
    expect(bad.details!.map((d) => d.path)).toEqual(['query.status', 'query.assignee', 'query.overdue', 'query.sort', 'query.pageSize']);
  });

  it('sums flags up by status, level and assignee in SQL', async () => {
    const res = await engineerC.get(`${base}/summary`);
    expect(res.status).toBe(200);
    const [l1, l2] = project.levels;
    expect(res.body).toEqual({
      total: 7,
      byStatus: { open: 6, answered: 0, closed: 1, waived: 0 },
      overdue: 1,
      byLevel: [
        { level: { id: l1.id, name: 'L1' }, open: 3, answered: 0, closed: 0, waived: 0 },
        { level: { id: l2.id, name: 'L2' }, open: 3, answered: 0, closed: 1, waived: 0 },
      ],
      byAssignee: [
        { assignee: { id: engineer2.id, name: 'Ines Okafor' }, open: 2, answered: 0, closed: 1, waived: 0, overdue: 0 },
        { assignee: { id: engineer.id, name: 'Tomas Brandvik' }, open: 1, answered: 0, closed: 0, waived: 0, overdue: 1 },
        { assignee: null, open: 3, answered: 0, closed: 0, waived: 0, overdue: 0 },
      ],
    });
  });
});
