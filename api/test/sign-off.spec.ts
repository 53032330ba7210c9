import type { ImportPreview, LevelSignOff, ProjectOverview } from '@sagline/common/api-types';
import { uploadFile } from './fixtures/import-client';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { scheduleCsv, type MemberSpec } from './support/members-factory';
import { TestApp } from './support/test-app';

/**
 * Sign-off of a level by a checker: refused while a flag on the level is open
 * or answered, voided by the next revision that touches a member on it (as
 * uploaded and committed through the import routes), withdrawn by hand.
 */
describe('level sign-offs', () => {
  let t: TestApp;
  let project: TestProject;
  let checker: TestUser;
  let engineer: TestUser;
  let checkerC: ApiClient;
  let engineerC: ApiClient;
  let viewerC: ApiClient;
  let base: string;
  let uploads = 0;

  const L = (name: string) => project.levels.find((l) => l.name === name)!.id;

  /** Upload and commit a schedule the way the Imports screen does. */
  async function commit(members: MemberSpec[]): Promise<number> {
    const up = await uploadFile(t, engineerC, project.id, Buffer.from(scheduleCsv(members), 'utf8'), `rev-${++uploads}.csv`);
    expect(up.status).toBe(201);
    const res = await engineerC.post(`${base}/imports/${(up.body as ImportPreview).draftId}/commit`, {});
    expect(res.status).toBe(201);
    return res.body.revision.number;
  }

  async function signOffs(): Promise<Record<string, Pick<LevelSignOff, 'state' | 'revisionNumber' | 'voidReason' | 'voidedInRevisionNumber'> | null>> {
    const o = (await viewerC.get(`${base}/overview`)).body as ProjectOverview;
    return Object.fromEntries(
      o.levels.filter((l) => l.level?.id).map((l) => [l.level!.name, l.signOff && { state: l.signOff.state, revisionNumber: l.signOff.revisionNumber, voidReason: l.signOff.voidReason, voidedInRevisionNumber: l.signOff.voidedInRevisionNumber }]),
    );
  }

  const REV1: MemberSpec[] = [
    { mark: 'B1', I: 20 },
    { mark: 'B2', I: 100 },
    { mark: 'C1', level: 'L2', I: 100 },
    { mark: 'C2', level: 'L2', I: 100 },
  ];

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    checker = await make.user({ name: 'Ines Okafor' });
    engineer = await make.user({ name: 'Kasimir Oduya' });
    const viewer = await make.user({ name: 'Dalia Stroud' });
    project = await make.project({ name: 'Halvercote Yard', team: [[checker, 'checker'], [engineer, 'engineer'], [viewer, 'viewer']] });
    checkerC = await ApiClient.signedIn(t.http, checker.email, PASSWORD);
    engineerC = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    viewerC = await ApiClient.signedIn(t.http, viewer.email, PASSWORD);
    base = `/api/projects/${project.id}`;
  });
  afterAll(() => t.close());

  it('refuses a sign-off before the first revision', async () => {
    expectError(await checkerC.post(`${base}/levels/${L('L1')}/sign-off`, {}), 409, 'CONFLICT', 'L1 cannot be signed off yet: the project has no revision. Import a member schedule first.');
  });

  it('refuses to sign off a level while a flag on it is open or answered, then signs it off once closed', async () => {
    expect(await commit(REV1)).toBe(1);
    const flag = (await checkerC.post(`${base}/flags`, { mark: 'B1', assigneeId: engineer.id })).body;
    const before = await t.counts(['level_sign_offs', 'activity']);
    const refused = expectError(await checkerC.post(`${base}/levels/${L('L1')}/sign-off`, {}), 409, 'CONFLICT',
      `L1 cannot be signed off: 1 open flag on it still needs action: B1 (flag ${flag.id}, open). Close or waive it first.`);
    expect(refused.details).toEqual([{ path: `flags[${flag.id}]`, message: `B1: flag ${flag.id} is open` }]);
    expect(await t.counts(['level_sign_offs', 'activity'])).toEqual(before);
    const answered = (await engineerC.post(`${base}/flags/${flag.id}/answer`, { version: flag.version, body: 'Deeper section.' })).body;
    const afterAnswer = await t.counts(['level_sign_offs', 'activity']);
    expectError(await checkerC.post(`${base}/levels/${L('L1')}/sign-off`, {}), 409, 'CONFLICT', /^L1 cannot be signed off: 1 answered flag on it still needs action/);
    expect(await t.counts(['level_sign_offs', 'activity'])).toEqual(afterAnswer);
    await checkerC.post(`${base}/flags/${flag.id}/close`, { version: answered.version });

    const res = await checkerC.post(`${base}/levels/${L('L1')}/sign-off`, { comment: 'All L1 beams reviewed.' });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(Number), level: { id: L('L1'), name: 'L1' }, state: 'signed', signedBy: { id: checker.id, name: 'Ines Okafor' }, signedAt: expect.any(String),
      revisionNumber: 1, comment: 'All L1 beams reviewed.', voidedAt: null, voidedInRevisionNumber: null, voidedBy: null, voidReason: null,
    });
    expect((await checkerC.post(`${base}/levels/${L('L2')}/sign-off`, {})).status).toBe(201);
    expectError(await checkerC.post(`${base}/levels/${L('L1')}/sign-off`, {}), 409, 'CONFLICT', 'L1 is already signed off (and no revision has changed it since); the Overview shows who signed it and when.');
    expectError(await checkerC.post(`${base}/levels/${L('Roof')}/sign-off`, {}), 409, 'CONFLICT', 'Roof has no members in revision 1, so there is nothing to sign off.');
    expectError(await checkerC.post(`${base}/levels/999999/sign-off`, {}), 404, 'NOT_FOUND', 'Level 999999 is not a level of this project; the Overview lists the levels there are.');
    expect(await t.knex('activity').where({ project_id: project.id, action: 'sign_off.signed' }).orderBy('id').pluck('summary')).toEqual([
      'Ines Okafor signed off L1 at revision 1: All L1 beams reviewed.',
      'Ines Okafor signed off L2 at revision 1',
    ]);
    expect(await signOffs()).toEqual({
      L1: { state: 'signed', revisionNumber: 1, voidReason: null, voidedInRevisionNumber: null },
      L2: { state: 'signed', revisionNumber: 1, voidReason: null, voidedInRevisionNumber: null },
      Roof: null,
    });
  });

  it('voids the sign-off of a level a new revision changes, and only that one, saying which revision and members', async () => {
    // Revision 2: C1 gets a deeper section (I), C3 is added on L2; L1 is as it was.
    expect(await commit([...REV1.slice(0, 2), { mark: 'C1', level: 'L2', I: 150 }, REV1[3], { mark: 'C3', level: 'L2', I: 100 }])).toBe(2);
    expect(await signOffs()).toEqual({
      L1: { state: 'signed', revisionNumber: 1, voidReason: null, voidedInRevisionNumber: null },
      L2: { state: 'voided', revisionNumber: 1, voidReason: 'Revision 2 changed members on L2: C3 (added), C1 (changed)', voidedInRevisionNumber: 2 },
      Roof: null,
    });
    expect(await t.knex('activity').where({ project_id: project.id, action: 'sign_off.voided' }).pluck('summary')).toEqual([
      'The sign-off of L2 no longer holds: Revision 2 changed members on L2: C3 (added), C1 (changed)',
    ]);
  });

  it('voids both levels when a member moves from one to the other, and a removal voids its level', async () => {
    expect((await checkerC.post(`${base}/levels/${L('L2')}/sign-off`, {})).status).toBe(201);
    // Revision 3: B2 moves from L1 to L2.
    expect(await commit([REV1[0], { mark: 'B2', level: 'L2', I: 100 }, { mark: 'C1', level: 'L2', I: 150 }, REV1[3], { mark: 'C3', level: 'L2', I: 100 }])).toBe(3);
    let s = await signOffs();
    expect(s.L1).toEqual({ state: 'voided', revisionNumber: 1, voidReason: 'Revision 3 changed members on L1: B2 (changed)', voidedInRevisionNumber: 3 });
    expect(s.L2).toEqual({ state: 'voided', revisionNumber: 2, voidReason: 'Revision 3 changed members on L2: B2 (changed)', voidedInRevisionNumber: 3 });

    expect((await checkerC.post(`${base}/levels/${L('L2')}/sign-off`, {})).status).toBe(201);
    // Revision 4: C3 removed.
    expect(await commit([REV1[0], { mark: 'B2', level: 'L2', I: 100 }, { mark: 'C1', level: 'L2', I: 150 }, REV1[3]])).toBe(4);
    s = await signOffs();
    expect(s.L2).toMatchObject({ state: 'voided', revisionNumber: 3, voidReason: 'Revision 4 changed members on L2: C3 (removed)', voidedInRevisionNumber: 4 });
    // History is kept: every sign-off of L2, none deleted.
    expect(await t.knex('level_sign_offs').where({ level_id: L('L2') }).count('* as n').first()).toEqual({ n: '3' });
  });

  it('lets a checker withdraw a sign-off with a reason', async () => {
    expect((await checkerC.post(`${base}/levels/${L('L1')}/sign-off`, {})).status).toBe(201);
    expectError(await checkerC.post(`${base}/levels/${L('L1')}/sign-off/withdraw`, {}), 400, 'VALIDATION_FAILED', /body\.reason: is required/);
    const res = await checkerC.post(`${base}/levels/${L('L1')}/sign-off/withdraw`, { reason: 'B1 needs another look.' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ state: 'voided', voidReason: 'Withdrawn by Ines Okafor: B1 needs another look.', voidedBy: { id: checker.id, name: 'Ines Okafor' }, voidedInRevisionNumber: null });
    expectError(await checkerC.post(`${base}/levels/${L('L1')}/sign-off/withdraw`, { reason: 'Again.' }), 409, 'CONFLICT', 'L1 has no sign-off in force to withdraw.');
  });
});
