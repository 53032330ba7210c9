import type { FlagDetail } from '@sagline/common/api-types';
import { uploadFile } from './fixtures/import-client';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { scheduleCsv, type MemberSpec } from './support/members-factory';
import { linkIn, TestApp, TEST_PUBLIC_URL } from './support/test-app';

/**
 * Flags follow revisions through the real import routes: the engineer
 * uploads and commits a new schedule over HTTP, and the commit itself writes
 * the automatic notes on the flags of members it changed or removed.
 * Members: 6 m simple steel beams, D = 5 and L = 6 kN/m; I = 20 ×10⁶ mm⁴
 * fails L/360 live (utilisation 1.52), I = 100 passes (0.30), I = 15 fails
 * (AISC Manual 15th ed., Table 3-23 case 1, Δ = 5wL⁴/384EI; members-factory.ts).
 */
describe('flags across revisions, through the import routes', () => {
  let t: TestApp;
  let project: TestProject;
  let engineer: TestUser;
  let checker: ApiClient;
  let eng: ApiClient;
  let base: string;
  const flag = {} as Record<'B1' | 'B2' | 'B3' | 'B4', FlagDetail>;

  async function commitSchedule(members: MemberSpec[], fileName: string): Promise<{ id: number; number: number }> {
    const up = await uploadFile(t, eng, project.id, Buffer.from(scheduleCsv(members), 'utf8'), fileName);
    if (up.status !== 201) throw new Error(`upload failed: ${up.status} ${JSON.stringify(up.body)}`);
    const commit = await eng.post(`/api/projects/${project.id}/imports/${up.body.draftId}/commit`, {});
    if (commit.status !== 201) throw new Error(`commit failed: ${commit.status} ${JSON.stringify(commit.body)}`);
    return commit.body.revision;
  }

  const get = async (f: FlagDetail) => (await checker.get(`${base}/${f.id}`)).body as FlagDetail;

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    const checkerUser = await make.user({ name: 'Priya Castellanos' });
    engineer = await make.user({ name: 'Tomas Brandvik' });
    project = await make.project({ name: 'Halvercote Yard', team: [[checkerUser, 'checker'], [engineer, 'engineer']] });
    checker = await ApiClient.signedIn(t.http, checkerUser.email, PASSWORD);
    eng = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    base = `/api/projects/${project.id}/flags`;

    await commitSchedule([{ mark: 'B1', I: 20 }, { mark: 'B2', I: 20 }, { mark: 'B3', I: 20 }, { mark: 'B4', I: 100 }], 'rev-a.csv');
    for (const [mark, checkName] of [['B1', 'L/360 live'], ['B2', 'L/360 live'], ['B3', 'L/360 live'], ['B4', null]] as const) {
      const res = await checker.post(base, { mark, checkName, assigneeId: engineer.id });
      if (res.status !== 201) throw new Error(`raise failed: ${res.status} ${JSON.stringify(res.body)}`);
      flag[mark] = res.body;
    }
  });
  afterAll(() => t.close());

  it('writes the verdict before and after on the flags of changed members, says when a member left, e-mails the assignee', async () => {
    const mailsBefore = (await t.mailbox()).length;
    // Revision 2: B1 stiffer (now passes), B2 as it was, B3 gone, B4 softer (now fails).
    const rev2 = await commitSchedule([{ mark: 'B1', I: 100 }, { mark: 'B2', I: 20 }, { mark: 'B4', I: 15 }], 'rev-b.csv');
    expect(rev2.number).toBe(2);

    const b1 = await get(flag.B1);
    expect(b1).toMatchObject({ status: 'open', version: 2, member: { verdict: 'pass' } });
    expect(b1.events.map((e) => e.kind)).toEqual(['status', 'revision']);
    expect(b1.events[1]).toEqual({
      id: expect.any(Number),
      kind: 'revision',
      actor: null,
      fromStatus: null,
      toStatus: null,
      body: expect.stringMatching(/^Revision 2 changed this member \(.*I.*\): verdict fail → pass$/),
      data: {
        revisionId: rev2.id,
        revisionNumber: 2,
        verdictBefore: 'fail',
        verdictAfter: 'pass',
        removed: false,
        changedFields: [expect.stringMatching(/^I\b/)],
      },
      createdAt: expect.any(String),
    });

    const b3 = await get(flag.B3);
    expect(b3).toMatchObject({ status: 'open', version: 2, member: null });
    expect(b3.events.at(-1)).toMatchObject({ kind: 'revision', actor: null, body: 'Member no longer in revision 2', data: { removed: true, verdictBefore: 'fail', verdictAfter: null } });

    const b4 = await get(flag.B4);
    expect(b4).toMatchObject({ version: 2, member: { verdict: 'fail' } });
    // Changed AND flipped: one note, not two.
    expect(b4.events.filter((e) => e.kind === 'revision')).toHaveLength(1);
    expect(b4.events.at(-1)?.body).toMatch(/^Revision 2 changed this member \(.*\): verdict pass → fail$/);

    // The unchanged member's flag is left alone.
    const b2 = await get(flag.B2);
    expect({ version: b2.version, kinds: b2.events.map((e) => e.kind) }).toEqual({ version: 1, kinds: ['status'] });

    const all = await t.mailbox();
    const mails = all.slice(0, all.length - mailsBefore).filter((m) => m.to.includes(engineer.email));
    expect(mails.map((m) => m.subject)).toEqual(['Revision 2 changed flagged members (Halvercote Yard)']);
    expect(mails[0].text).toContain('Member no longer in revision 2');
    expect(linkIn(mails[0], `/projects/${project.id}/flags/`)).toMatch(new RegExp(`^${TEST_PUBLIC_URL}/projects/${project.id}/flags/\\d+$`));

    const activity = await t.knex('activity').where({ project_id: project.id, action: 'flag.revision_noted' }).first('actor_id', 'summary');
    expect(activity).toEqual({ actor_id: null, summary: 'Revision 2 changed or removed the members of 3 flags: B1, B3, B4' });
  });

  it('a screen that loaded the flag before the revision cannot overwrite the note (409 with the current flag)', async () => {
    const stale = await checker.post(`${base}/${flag.B1.id}/close`, { version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.code).toBe('STALE_WRITE');
    expect(stale.body.details[0].value).toMatchObject({ id: flag.B1.id, version: 2, status: 'open' });
    expect(stale.body.details[0].value.events.at(-1).kind).toBe('revision');
  });

  it('a re-upload of the same schedule notes nothing', async () => {
    const before = await t.counts(['flag_events']);
    await commitSchedule([{ mark: 'B1', I: 100 }, { mark: 'B2', I: 20 }, { mark: 'B4', I: 15 }], 'rev-c.csv');
    expect(await t.counts(['flag_events'])).toEqual(before);
  });
});
