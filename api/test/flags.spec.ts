import type { FlagDetail, MailboxMessage, StaleFlagDetail } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { linkIn, TestApp, TEST_PUBLIC_URL } from './support/test-app';

/*
 * The members of revision 1 (steel floor beams, 6 m simple spans, D = 5 and
 * L = 6 kN/m; members-factory.ts has the handbook check): I = 100 ×10⁶ mm⁴
 * passes, I = 20 fails L/360 live at utilisation 25.3 / 16.7 = 1.52
 * (AISC Manual 15th ed., Table 3-23 case 1, Δ = 5wL⁴/384EI).
 */
const FAILING = ['B1', 'B2', 'B3', 'B4', 'B5', 'B6', 'B7', 'B8', 'B9', 'B10'];
const PASSING = ['B20', 'B21'];
const UPPER_FAILING = ['C1', 'C2', 'C3'];

describe('flags: raise, answer, close, reopen, waive', () => {
  let t: TestApp;
  let make: Factories;
  let project: TestProject;
  let checker: TestUser;
  let engineer: TestUser;
  let engineer2: TestUser;
  let manager: TestUser;
  const c = {} as Record<'checker' | 'engineer' | 'engineer2' | 'manager' | 'viewer', ApiClient>;
  let base: string;

  beforeAll(async () => {
    t = await TestApp.start();
    make = new Factories(t.knex);
    checker = await make.user({ name: 'Priya Castellanos' });
    engineer = await make.user({ name: 'Tomas Brandvik' });
    engineer2 = await make.user({ name: 'Ines Okafor' });
    manager = await make.user({ name: 'Mireille Fontaine' });
    const viewer = await make.user({ name: 'Aldo Viewer' });
    project = await make.project({
      name: 'Halvercote Yard',
      team: [[checker, 'checker'], [engineer, 'engineer'], [engineer2, 'engineer'], [manager, 'manager'], [viewer, 'viewer']],
    });
    await new MembersFactory(t).revision(project.id, engineer.id, [
      ...FAILING.map((mark) => ({ mark, I: 20 })),
      ...PASSING.map((mark) => ({ mark, I: 100 })),
      ...UPPER_FAILING.map((mark) => ({ mark, level: 'L2', I: 20 })),
    ]);
    c.checker = await ApiClient.signedIn(t.http, checker.email, PASSWORD);
    c.engineer = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    c.engineer2 = await ApiClient.signedIn(t.http, engineer2.email, PASSWORD);
    c.manager = await ApiClient.signedIn(t.http, manager.email, PASSWORD);
    c.viewer = await ApiClient.signedIn(t.http, viewer.email, PASSWORD);
    base = `/api/projects/${project.id}/flags`;
  });
  afterAll(() => t.close());

  async function raise(body: Record<string, unknown>): Promise<FlagDetail> {
    const res = await c.checker.post(base, body);
    if (res.status !== 201) throw new Error(`raise failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body;
  }

  async function mailsTo(user: TestUser): Promise<MailboxMessage[]> {
    return (await t.mailbox()).filter((m) => m.to.includes(user.email));
  }

  it('raises a flag on a failing member, assigned to an engineer, who gets an e-mail with its link', async () => {
    const res = await c.checker.post(base, {
      mark: 'b1',
      checkName: 'L/360 live',
      comment: 'Live-load deflection over the limit; check the section.',
      assigneeId: engineer.id,
      dueDate: '2026-12-18',
    });
    expect(res.status).toBe(201);
    const flag = res.body as FlagDetail;
    expect(flag).toEqual({
      id: expect.any(Number),
      projectId: project.id,
      mark: 'B1',
      checkName: 'L/360 live',
      title: 'B1 fails L/360 live (utilisation 1.52)',
      comment: 'Live-load deflection over the limit; check the section.',
      status: 'open',
      assignee: { id: engineer.id, name: 'Tomas Brandvik' },
      raisedBy: { id: checker.id, name: 'Priya Castellanos' },
      dueDate: '2026-12-18',
      overdue: false,
      waiveReason: null,
      raisedInRevision: { id: expect.any(Number), number: 1 },
      member: {
        level: { id: project.levels[0].id, name: 'L1' },
        category: 'floor',
        verdict: 'fail',
        governingCheck: 'L/360 live',
        maxUtilization: expect.closeTo(1.5188, 3),
        reviewer: null,
      },
      version: 1,
      createdAt: expect.any(String),
      updatedAt: expect.any(String),
      events: [
        {
          id: expect.any(Number),
          kind: 'status',
          actor: { id: checker.id, name: 'Priya Castellanos' },
          fromStatus: null,
          toStatus: 'open',
          body: 'Live-load deflection over the limit; check the section.',
          data: { raised: true, revisionId: flag.raisedInRevision!.id, revisionNumber: 1, assignee: { id: engineer.id, name: 'Tomas Brandvik' }, dueDate: '2026-12-18' },
          createdAt: expect.any(String),
        },
      ],
    });

    const mails = await mailsTo(engineer);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Flag on B1 assigned to you (Halvercote Yard)');
    expect(mails[0].text).toContain('Priya Castellanos raised a flag on B1 in Halvercote Yard and assigned it to you.');
    expect(mails[0].text).toContain('B1: B1 fails L/360 live (utilisation 1.52) (due 2026-12-18)');
    expect(linkIn(mails[0], `/projects/${project.id}/flags/`)).toBe(`${TEST_PUBLIC_URL}/projects/${project.id}/flags/${flag.id}`);

    expect((await c.viewer.get(`${base}/${flag.id}`)).body).toEqual(flag);
    const activity = await t.knex('activity').where({ project_id: project.id, action: 'flag.raised' }).select('actor_id', 'summary');
    expect(activity).toEqual([{ actor_id: checker.id, summary: `Priya Castellanos raised flag ${flag.id} on B1: B1 fails L/360 live (utilisation 1.52), assigned to Tomas Brandvik` }]);
  });

  it('walks open → answered → closed → open → waived, each move with its event, a new version and an e-mail', async () => {
    const raised = await raise({ mark: 'B2', checkName: 'L/360 live', assigneeId: engineer.id });
    const url = `${base}/${raised.id}`;

    const answered = await c.engineer.post(`${url}/answer`, { version: 1, body: 'Changed to W310x60, I = 129 ×10⁶ mm⁴.' });
    expect(answered.status).toBe(200);
    expect(answered.body).toMatchObject({ status: 'answered', version: 2 });
    expect(answered.body.events.at(-1)).toEqual({
      id: expect.any(Number), kind: 'status', actor: { id: engineer.id, name: 'Tomas Brandvik' }, fromStatus: 'open', toStatus: 'answered',
      body: 'Changed to W310x60, I = 129 ×10⁶ mm⁴.', data: {}, createdAt: expect.any(String),
    });
    const toChecker = (await mailsTo(checker)).filter((m) => m.subject === 'Flag on B2 answered (Halvercote Yard)');
    expect(toChecker).toHaveLength(1);
    expect(toChecker[0].text).toContain('> Changed to W310x60, I = 129 ×10⁶ mm⁴.');
    expect(linkIn(toChecker[0], `/projects/${project.id}/flags/`)).toBe(`${TEST_PUBLIC_URL}${url.replace('/api', '')}`);

    const closed = await c.checker.post(`${url}/close`, { version: 2, body: 'Checked the new section: passes.' });
    expect(closed.status).toBe(200);
    expect(closed.body).toMatchObject({ status: 'closed', version: 3 });
    expect((await mailsTo(engineer)).map((m) => m.subject)).toContain('Flag on B2 closed (Halvercote Yard)');

    const reopened = await c.checker.post(`${url}/reopen`, { version: 3, body: 'Revision 2 lost the new section.' });
    expect(reopened.status).toBe(200);
    expect(reopened.body).toMatchObject({ status: 'open', version: 4 });
    expect((await mailsTo(engineer)).map((m) => m.subject)).toContain('Flag on B2 reopened (Halvercote Yard)');

    const waived = await c.manager.post(`${url}/waive`, { version: 4, reason: 'Accepted by the engineer of record: vibration-checked floor, see RFI 14.' });
    expect(waived.status).toBe(200);
    expect(waived.body).toMatchObject({ status: 'waived', version: 5, waiveReason: 'Accepted by the engineer of record: vibration-checked floor, see RFI 14.' });
    expect((await mailsTo(engineer)).map((m) => m.subject)).toContain('Flag on B2 waived (Halvercote Yard)');

    // A waived flag can be reopened too; its reason goes (the history keeps it).
    const again = await c.checker.post(`${url}/reopen`, { version: 5, body: 'The RFI was withdrawn.' });
    expect(again.body).toMatchObject({ status: 'open', version: 6, waiveReason: null });
    expect(again.body.events.map((e: { kind: string; fromStatus: string | null; toStatus: string | null }) => [e.kind, e.fromStatus, e.toStatus])).toEqual([
      ['status', null, 'open'], ['status', 'open', 'answered'], ['status', 'answered', 'closed'], ['status', 'closed', 'open'], ['status', 'open', 'waived'], ['status', 'waived', 'open'],
    ]);
    const actions = await t.knex('activity').whereRaw(`data->>'flagId' = ?`, [String(raised.id)]).orderBy('id').pluck('action');
    expect(actions).toEqual(['flag.raised', 'flag.answered', 'flag.closed', 'flag.reopened', 'flag.waived', 'flag.reopened']);
  });

  it('closes an open flag that was never answered (the checker may resolve it alone)', async () => {
    const raised = await raise({ mark: 'B3' });
    expect(raised.title).toBe('B3 fails L/360 live (utilisation 1.52)');
    expect(raised.checkName).toBeNull();
    const closed = await c.checker.post(`${base}/${raised.id}/close`, { version: 1 });
    expect(closed.status).toBe(200);
    expect(closed.body).toMatchObject({ status: 'closed', version: 2 });
    expect(closed.body.events.at(-1)).toMatchObject({ fromStatus: 'open', toStatus: 'closed', body: null });
  });

  it('answers a stale version with 409 STALE_WRITE carrying the current flag, and changes nothing', async () => {
    const raised = await raise({ mark: 'B4', assigneeId: engineer.id });
    const url = `${base}/${raised.id}`;
    expect((await c.engineer.post(`${url}/comments`, { body: 'Looking at it today.' })).status).toBe(201);
    const before = (await c.checker.get(url)).body as FlagDetail;
    expect(before.version).toBe(2);

    const res = await c.checker.post(`${url}/close`, { version: 1, body: 'Looks fine.' });
    const body = expectError(res, 409, 'STALE_WRITE', `Flag ${raised.id} changed since you loaded it (you sent version 1, it is at version 2, open); look at its current state and try again if your change still applies.`);
    const detail = body.details![0] as unknown as StaleFlagDetail;
    expect(detail).toEqual({ path: 'body.version', message: 'the flag is at version 2; details[0].value is the flag as it is now', value: before });
    expect(detail.value.events.at(-1)).toMatchObject({ kind: 'comment', body: 'Looking at it today.' });

    for (const [route, payload] of [
      ['answer', { version: 1, body: 'x' }], ['waive', { version: 1, reason: 'x' }], ['reopen', { version: 99, body: 'x' }],
    ] as const) {
      const client = route === 'answer' ? c.engineer : c.checker;
      expectError(await client.post(`${url}/${route}`, payload), 409, 'STALE_WRITE');
    }
    expectError(await c.checker.patch(url, { version: 1, assigneeId: engineer2.id }), 409, 'STALE_WRITE');
    expect((await c.checker.get(url)).body).toEqual(before);
  });

  it('refuses status moves the flag cannot make, with 409 CONFLICT saying why', async () => {
    const raised = await raise({ mark: 'B5', assigneeId: engineer.id });
    const url = `${base}/${raised.id}`;
    expectError(await c.checker.post(`${url}/reopen`, { version: 1, body: 'x' }), 409, 'CONFLICT', `Flag ${raised.id} is open, not closed or waived: there is nothing to reopen.`);
    expect((await c.engineer.post(`${url}/answer`, { version: 1, body: 'Done.' })).status).toBe(200);
    expectError(await c.engineer.post(`${url}/answer`, { version: 2, body: 'Again.' }), 409, 'CONFLICT', `Flag ${raised.id} is answered already; add a comment to say more, or wait for a checker to close or reopen it.`);
    expect((await c.checker.post(`${url}/close`, { version: 2 })).status).toBe(200);
    expectError(await c.checker.post(`${url}/close`, { version: 3 }), 409, 'CONFLICT', `Flag ${raised.id} is closed already.`);
    expectError(await c.engineer.post(`${url}/answer`, { version: 3, body: 'Late.' }), 409, 'CONFLICT', `Flag ${raised.id} is closed; a checker must reopen it before it can be answered.`);
    expectError(await c.manager.post(`${url}/waive`, { version: 3, reason: 'x' }), 409, 'CONFLICT', `Flag ${raised.id} is closed; reopen it first if it should be waived instead.`);
    expectError(await c.manager.patch(url, { version: 3, dueDate: '2027-01-10' }), 409, 'CONFLICT', `Flag ${raised.id} is closed; reopen it before changing its assignee or due date.`);
    // Comments are welcome in any status.
    expect((await c.engineer.post(`${url}/comments`, { body: 'For the record: W310x60.' })).body).toMatchObject({ status: 'closed', version: 4 });
  });

  it('lets the assignee or any engineer answer, and nobody else', async () => {
    const raised = await raise({ mark: 'B6', assigneeId: engineer.id });
    const url = `${base}/${raised.id}`;
    expectError(await c.checker.post(`${url}/answer`, { version: 1, body: 'x' }), 403, 'FORBIDDEN', `Only the flag's assignee (Tomas Brandvik) or an engineer of the project can answer flag ${raised.id}; add a comment instead.`);
    expectError(await c.manager.post(`${url}/answer`, { version: 1, body: 'x' }), 403, 'FORBIDDEN');
    const res = await c.engineer2.post(`${url}/answer`, { version: 1, body: 'Answering for Tomas: camber 15 mm added.' });
    expect(res.status).toBe(200);
    expect(res.body.events.at(-1).actor).toEqual({ id: engineer2.id, name: 'Ines Okafor' });
  });

  it('reassigns and reschedules with PATCH, e-mailing the new assignee; an unchanged PATCH keeps the version', async () => {
    const raised = await raise({ mark: 'B7', assigneeId: engineer.id });
    const url = `${base}/${raised.id}`;
    const res = await c.manager.patch(url, { version: 1, assigneeId: engineer2.id, dueDate: '2027-01-15' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ assignee: { id: engineer2.id, name: 'Ines Okafor' }, dueDate: '2027-01-15', version: 2 });
    expect(res.body.events.slice(1)).toEqual([
      { id: expect.any(Number), kind: 'assign', actor: { id: manager.id, name: 'Mireille Fontaine' }, fromStatus: null, toStatus: null, body: null, data: { fromAssignee: { id: engineer.id, name: 'Tomas Brandvik' }, toAssignee: { id: engineer2.id, name: 'Ines Okafor' } }, createdAt: expect.any(String) },
      { id: expect.any(Number), kind: 'due', actor: { id: manager.id, name: 'Mireille Fontaine' }, fromStatus: null, toStatus: null, body: null, data: { from: null, to: '2027-01-15' }, createdAt: expect.any(String) },
    ]);
    const mail = (await mailsTo(engineer2)).find((m) => m.subject === 'Flag on B7 assigned to you (Halvercote Yard)');
    expect(mail?.text).toContain('Mireille Fontaine assigned you the flag on B7 in Halvercote Yard.');
    expect(mail?.text).toContain('(due 2027-01-15)');

    const same = await c.checker.patch(url, { version: 2, assigneeId: engineer2.id });
    expect(same.body).toMatchObject({ version: 2 });
    const cleared = await c.checker.patch(url, { version: 2, assigneeId: null, dueDate: null });
    expect(cleared.body).toMatchObject({ assignee: null, dueDate: null, version: 3 });
    expectError(await c.checker.patch(url, { version: 3 }), 400, 'VALIDATION_FAILED', 'body: send assigneeId and/or dueDate (with the version): there is nothing else to change');
  });

  it('checks what a flag is raised on and with: mark, check, assignee, date, texts', async () => {
    const before = await t.counts(['flags', 'flag_events', 'activity', 'outbound_mail']);
    expectError(await c.checker.post(base, { mark: 'B99' }), 400, 'VALIDATION_FAILED', 'body.mark: there is no member "B99" in revision 1 (the latest); check the mark on the Members screen');
    expectError(
      await c.checker.post(base, { mark: 'B8', checkName: 'L/180 wind' }),
      400, 'VALIDATION_FAILED', 'body.checkName: B8 has no check "L/180 wind" in revision 1; its checks are "L/240 total", "L/360 live"',
    );
    expectError(
      await c.checker.post(base, { mark: 'B8', assigneeId: checker.id }),
      400, 'VALIDATION_FAILED', `body.assigneeId: person ${checker.id} is not an engineer on this project; flags are assigned to engineers (a manager can change roles on the Team screen)`,
    );
    const bad = expectError(await c.checker.post(base, { mark: '', dueDate: '2026-02-30', title: '', extra: 1 }), 400, 'VALIDATION_FAILED');
    expect(bad.details).toEqual([
      { path: 'body.extra', message: 'is not a field of this request; remove it' },
      { path: 'body.mark', message: 'is required: the mark of a member, e.g. "B12"' },
      { path: 'body.title', message: 'cannot be empty (leave it out for the default title)' },
      { path: 'body.dueDate', message: 'is not a date of the calendar (check the month and the day)' },
    ]);
    expectError(await c.checker.post(base, { mark: 'B8', dueDate: '18/12/2026' }), 400, 'VALIDATION_FAILED', 'Some fields need fixing: body.dueDate: must be a date written YYYY-MM-DD, e.g. 2026-12-18, or null');
    expect(await t.counts(['flags', 'flag_events', 'activity', 'outbound_mail'])).toEqual(before);

    const first = await raise({ mark: 'B8', checkName: 'L/360 live' });
    expectError(await c.checker.post(base, { mark: 'b8', checkName: 'L/360 live' }), 409, 'CONFLICT', `B8 already has an open flag for L/360 live (flag ${first.id}); add a comment to that one instead.`);
    // Another check, or the member as a whole, is another flag.
    expect((await c.checker.post(base, { mark: 'B8', checkName: 'L/240 total' })).status).toBe(201);
    expect((await c.checker.post(base, { mark: 'B8' })).status).toBe(201);
    // A passing member can be raised too, with a title that does not claim it fails.
    expect((await raise({ mark: 'B20' })).title).toBe('B20 needs a look');
    expect((await raise({ mark: 'B21', checkName: 'L/360 live' })).title).toBe('B21: L/360 live needs a look (utilisation 0.30)');

    const id = first.id;
    expectError(await c.manager.post(`${base}/${id}/waive`, { version: 1, reason: '  ' }), 400, 'VALIDATION_FAILED', /body\.reason: is required: say why the flag is waived/);
    expectError(await c.checker.post(`${base}/${id}/reopen`, { version: 1 }), 400, 'VALIDATION_FAILED', 'Some fields need fixing: body.body: is required');
    expectError(await c.checker.post(`${base}/${id}/close`, { body: 'x' }), 400, 'VALIDATION_FAILED', /body\.version: is required/);
    expectError(await c.checker.get(`${base}/999999`), 404, 'NOT_FOUND', 'Flag 999999 was not found in this project; the Flags screen lists the ones there are.');
    expectError(await c.checker.post(`${base}/999999/close`, { version: 1 }), 404, 'NOT_FOUND');
    expectError(await c.checker.get(`${base}/abc`), 400, 'VALIDATION_FAILED', /params\.flagId: must be a positive whole number/);
  });

  it('keeps each project\'s flags to itself: a flag id of another project is 404', async () => {
    const other = await make.project({ name: 'Other', team: [[checker, 'checker'], [engineer, 'engineer']] });
    await new MembersFactory(t).revision(other.id, engineer.id, [{ mark: 'X1', I: 20 }]);
    const res = await c.checker.post(`/api/projects/${other.id}/flags`, { mark: 'X1' });
    expect(res.status).toBe(201);
    expectError(await c.checker.get(`${base}/${res.body.id}`), 404, 'NOT_FOUND');
    expectError(await c.checker.post(`${base}/${res.body.id}/close`, { version: 1 }), 404, 'NOT_FOUND');
    const list = await c.checker.get(`${base}?mark=X1`);
    expect(list.body).toEqual({ items: [], total: 0, page: 1, pageSize: 50 });
  });

  it('refuses to raise flags before the project has a revision', async () => {
    const empty = await make.project({ team: [[checker, 'checker']] });
    expectError(await c.checker.post(`/api/projects/${empty.id}/flags`, { mark: 'B1' }), 409, 'CONFLICT', 'This project has no revision yet: flags are raised on the members of a committed revision. Upload a member schedule first.');
    expect((await c.checker.get(`/api/projects/${empty.id}/flags/summary`)).body).toEqual({
      total: 0, byStatus: { open: 0, answered: 0, closed: 0, waived: 0 }, overdue: 0, byLevel: [], byAssignee: [],
    });
  });
});
