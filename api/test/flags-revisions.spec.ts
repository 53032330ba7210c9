import type { FlagDetail } from '@sagline/common/api-types';
import { TransactionRunner } from '../src/db/transaction';
import { FlagsService } from '../src/flags/flags.service';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { linkIn, TestApp, TEST_PUBLIC_URL } from './support/test-app';

/**
 * Flags follow their member by mark: when a revision is committed, the
 * import calls FlagsService.onRevisionCommitted inside its transaction, and
 * every flag that is not closed, on a changed or removed member, gets an
 * automatic note. Called directly here, as the import's commit calls it.
 */
describe('flags across revisions', () => {
  let t: TestApp;
  let project: TestProject;
  let engineer: TestUser;
  let checker: ApiClient;
  let engineerC: ApiClient;
  let flags: FlagsService;
  let tx: TransactionRunner;
  let members: MembersFactory;
  let base: string;
  const flag = {} as Record<'B1' | 'B2' | 'B3' | 'B4' | 'B5', FlagDetail>;

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    const checkerUser = await make.user({ name: 'Priya Castellanos' });
    engineer = await make.user({ name: 'Tomas Brandvik' });
    project = await make.project({ name: 'Halvercote Yard', team: [[checkerUser, 'checker'], [engineer, 'engineer']] });
    members = new MembersFactory(t);
    await members.revision(project.id, engineer.id, ['B1', 'B2', 'B3', 'B4', 'B5'].map((mark) => ({ mark, I: 20 })));
    checker = await ApiClient.signedIn(t.http, checkerUser.email, PASSWORD);
    engineerC = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    flags = t.app.get(FlagsService, { strict: false });
    tx = t.app.get(TransactionRunner, { strict: false });
    base = `/api/projects/${project.id}/flags`;

    for (const mark of ['B1', 'B2', 'B3', 'B4', 'B5'] as const) {
      flag[mark] = (await checker.post(base, { mark, checkName: 'L/360 live', assigneeId: engineer.id })).body;
    }
    // B2 closed, B3 waived, B4 answered; B1 and B5 open.
    await checker.post(`${base}/${flag.B2.id}/close`, { version: 1 });
    await checker.post(`${base}/${flag.B3.id}/waive`, { version: 1, reason: 'Accepted by the engineer of record.' });
    await engineerC.post(`${base}/${flag.B4.id}/answer`, { version: 1, body: 'Will be changed in revision 2.' });
  });
  afterAll(() => t.close());

  it('notes the change on every flag that is not closed, bumps its version, logs it and e-mails the assignee once', async () => {
    // Revision 2: B1 stiffer (now passes), B2 and B4 stiffer, B3 gone, B5 as it was.
    const rev2 = await members.revision(project.id, engineer.id, [{ mark: 'B1', I: 100 }, { mark: 'B2', I: 100 }, { mark: 'B4', I: 25 }, { mark: 'B5', I: 20 }]);
    const mailsBefore = (await t.mailbox()).length;
    // Relative to the flags as they are now: once the import's commit makes this same call, revision 2 has noted them already.
    const version = async (f: FlagDetail) => ((await checker.get(`${base}/${f.id}`)).body as FlagDetail).version;
    const before = { B1: await version(flag.B1), B2: await version(flag.B2), B3: await version(flag.B3), B4: await version(flag.B4), B5: await version(flag.B5) };

    const result = await tx.run((trx) =>
      flags.onRevisionCommitted(trx, project.id, rev2.id, [
        { mark: 'b1', verdictBefore: 'fail', verdictAfter: 'pass', removed: false, changedFields: ['I'] },
        { mark: 'B2', verdictBefore: 'fail', verdictAfter: 'pass', removed: false, changedFields: ['I'] },
        { mark: 'B3', verdictBefore: 'fail', verdictAfter: null, removed: true },
        { mark: 'B4', verdictBefore: 'fail', verdictAfter: 'fail', removed: false, changedFields: ['I', 'Section'] },
      ]),
    );
    expect(result.notedFlagIds).toEqual([flag.B1.id, flag.B3.id, flag.B4.id]);
    expect(result.mailIds).toHaveLength(1);
    flags.deliverRevisionNotes(result);

    const b1 = (await checker.get(`${base}/${flag.B1.id}`)).body as FlagDetail;
    expect(b1).toMatchObject({ status: 'open', version: before.B1 + 1, member: { verdict: 'pass', maxUtilization: expect.closeTo(0.3038, 3) } });
    expect(b1.events.at(-1)).toEqual({
      id: expect.any(Number),
      kind: 'revision',
      actor: null,
      fromStatus: null,
      toStatus: null,
      body: 'Revision 2 changed this member (I): verdict fail → pass',
      data: { revisionId: rev2.id, revisionNumber: 2, verdictBefore: 'fail', verdictAfter: 'pass', removed: false, changedFields: ['I'] },
      createdAt: expect.any(String),
    });
    const b3 = (await checker.get(`${base}/${flag.B3.id}`)).body as FlagDetail;
    expect(b3).toMatchObject({ status: 'waived', version: before.B3 + 1, member: null });
    expect(b3.events.at(-1)).toMatchObject({ kind: 'revision', body: 'Member no longer in revision 2', data: { removed: true, verdictAfter: null } });
    const b4 = (await checker.get(`${base}/${flag.B4.id}`)).body as FlagDetail;
    expect(b4).toMatchObject({ status: 'answered', version: before.B4 + 1 });
    expect(b4.events.at(-1)?.body).toBe('Revision 2 changed this member (I, Section): verdict still fail');
    // The closed flag and the unchanged member's flag are left alone.
    const b2 = (await checker.get(`${base}/${flag.B2.id}`)).body as FlagDetail;
    expect({ version: b2.version, kinds: b2.events.map((e) => e.kind) }).toEqual({ version: before.B2, kinds: ['status', 'status'] });
    expect((await checker.get(`${base}/${flag.B5.id}`)).body.version).toBe(before.B5);

    const activity = await t.knex('activity').where({ project_id: project.id, action: 'flag.revision_noted' }).orderBy('id', 'desc').first('actor_id', 'summary');
    expect(activity).toEqual({ actor_id: null, summary: 'Revision 2 changed or removed the members of 3 flags: B1, B3, B4' });

    const mails = (await t.mailbox()).slice(0, (await t.mailbox()).length - mailsBefore).filter((m) => m.to.includes(engineer.email));
    expect(mails.map((m) => m.subject)).toEqual(['Revision 2 changed flagged members (Halvercote Yard)']);
    expect(mails[0].text).toContain('B1: B1 fails L/360 live (utilisation 1.52)');
    expect(mails[0].text).toContain('  Member no longer in revision 2');
    expect(linkIn(mails[0], `/projects/${project.id}/flags/`)).toBe(`${TEST_PUBLIC_URL}/projects/${project.id}/flags/${flag.B1.id}`);

    // A stale screen of B1 cannot overwrite what the revision said.
    const stale = await checker.post(`${base}/${flag.B1.id}/close`, { version: before.B1 });
    expect(stale.status).toBe(409);
  });

  it('leaves nothing behind when the commit around it rolls back, and does nothing without changes', async () => {
    const rev = await t.knex('revisions').where({ project_id: project.id }).max('id as id').first();
    const before = await t.counts(['flag_events', 'activity', 'outbound_mail']);
    await expect(
      tx.run(async (trx) => {
        await flags.onRevisionCommitted(trx, project.id, rev!.id, [{ mark: 'B5', verdictBefore: 'fail', verdictAfter: 'pass', removed: false }]);
        throw new Error('the import failed after the notes');
      }),
    ).rejects.toThrow('the import failed after the notes');
    expect(await t.counts(['flag_events', 'activity', 'outbound_mail'])).toEqual(before);
    expect(await tx.run((trx) => flags.onRevisionCommitted(trx, project.id, rev!.id, []))).toEqual({ notedFlagIds: [], mailIds: [] });
    await expect(tx.run((trx) => flags.onRevisionCommitted(trx, project.id + 1000, rev!.id, [{ mark: 'B5', verdictBefore: null, verdictAfter: null, removed: true }]))).rejects.toThrow(
      /is not a revision of project/,
    );
  });
});
