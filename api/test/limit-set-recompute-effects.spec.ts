import type { FlagDetail, LevelSignOff, LimitSetJobStatus, ProjectLimitSetView, ProjectOverview } from '@sagline/common/api-types';
import type { Response } from 'supertest';
import { FlagsService } from '../src/flags/flags.service';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory, type MemberSpec } from './support/members-factory';
import { TestApp } from './support/test-app';

/**
 * A change of the project's limit set recomputes the latest revision's
 * verdicts in place. Where a verdict flips, the flags on that member get an
 * automatic note and the sign-off of its level is voided, in the same
 * transaction as the recompute (inline, and as a job on a large project).
 *
 * The members are 6 m steel floor beams under 6 kN/m live load (as in
 * limit-sets.spec.ts): I = 100 ×10⁶ mm⁴ deflects 5.06 mm (passes L/360 and
 * L/1000, fails L/1500 = 4.0 mm, utilisation 1.27); I = 400 deflects 1.27 mm
 * and passes all three.
 */
const MEMBERS: MemberSpec[] = [
  { mark: 'B1', I: 100 },
  { mark: 'B2', I: 400 },
  { mark: 'C1', level: 'L2', I: 100 },
  { mark: 'C2', level: 'L2', I: 100 },
  { mark: 'R1', level: 'Roof', category: 'floor', I: 400 },
];

const STRICT = 'Halvercote floors, stricter';

function editBody(set: ProjectLimitSetView, ratio: number, check: string) {
  const rules = set.rules.map(({ combinationName: _c, sourceText: _s, ...rest }) => rest);
  const live = rules.find((r) => r.id === 'floor.live')!;
  live.ratio = ratio;
  live.check = check;
  return { version: set.version, name: set.name, description: set.description, rules };
}

interface People {
  manager: ApiClient;
  checker: ApiClient;
  managerUser: TestUser;
  engineerUser: TestUser;
}

async function setUp(t: TestApp): Promise<{ project: TestProject; people: People }> {
  const make = new Factories(t.knex);
  const managerUser = await make.user({ name: 'Mireille Fontaine' });
  const checkerUser = await make.user({ name: 'Ines Okafor' });
  const engineerUser = await make.user({ name: 'Kasimir Oduya' });
  const project = await make.project({ name: 'Halvercote Yard', team: [[managerUser, 'manager'], [checkerUser, 'checker'], [engineerUser, 'engineer']] });
  await new MembersFactory(t).revision(project.id, engineerUser.id, MEMBERS);
  const manager = await ApiClient.signedIn(t.http, managerUser.email, PASSWORD);
  const checker = await ApiClient.signedIn(t.http, checkerUser.email, PASSWORD);
  return { project, people: { manager, checker, managerUser, engineerUser } };
}

/** The live or voided sign-off each level shows on the Overview. */
async function signOffs(c: ApiClient, projectId: number): Promise<Record<string, LevelSignOff | null>> {
  const res = await c.get(`/api/projects/${projectId}/overview`);
  expect(res.status).toBe(200);
  return Object.fromEntries((res.body as ProjectOverview).levels.filter((l) => l.level?.id).map((l) => [l.level!.name, l.signOff]));
}

async function flagDetail(c: ApiClient, projectId: number, id: number): Promise<FlagDetail> {
  const res = await c.get(`/api/projects/${projectId}/flags/${id}`);
  expect(res.status).toBe(200);
  return res.body as FlagDetail;
}

const automatic = (f: FlagDetail) => f.events.filter((e) => e.kind === 'revision');

describe('a change of the limit set: flags on flipped members get a note, sign-offs of their levels are voided', () => {
  let t: TestApp;
  let project: TestProject;
  let p: People;
  let base: string;
  let strict: ProjectLimitSetView;
  const flag = {} as Record<'B1' | 'B2' | 'C1', FlagDetail>;
  const L = (name: string) => project.levels.find((l) => l.name === name)!.id;

  beforeAll(async () => {
    t = await TestApp.start();
    ({ project, people: p } = await setUp(t));
    base = `/api/projects/${project.id}`;
    for (const mark of ['B1', 'B2', 'C1'] as const) {
      const res = await p.checker.post(`${base}/flags`, { mark, assigneeId: p.engineerUser.id });
      expect(res.status).toBe(201);
      flag[mark] = res.body;
    }
    // C1's flag is waived, so L2 can be signed off (a waived flag still follows its member).
    expect((await p.checker.post(`${base}/flags/${flag.C1.id}/waive`, { version: flag.C1.version, reason: 'Accepted by the engineer of record.' })).status).toBe(200);
    for (const level of ['L2', 'Roof']) expect((await p.checker.post(`${base}/levels/${L(level)}/sign-off`, {})).status).toBe(201);

    const copy = (await p.manager.post(`${base}/limit-sets`, { fromPreset: 'ibc-2021', name: STRICT })).body as ProjectLimitSetView;
    const edited = await p.manager.send('put', `${base}/limit-sets/${copy.id}`, editBody(copy, 1500, 'L/1500 live'));
    expect(edited.status).toBe(200);
    strict = edited.body.set;
  });
  afterAll(() => t.close());

  it('a rollback of the notes rolls back the whole change: verdicts, sign-offs and flags stay as they were', async () => {
    const flags = t.app.get(FlagsService, { strict: false });
    const spy = jest.spyOn(flags, 'onResultsRecomputed').mockRejectedValueOnce(new Error('disk full'));
    const before = {
      active: await t.knex('projects').where({ id: project.id }).first('limit_set_id'),
      members: await t.knex('members').orderBy('id').select('mark', 'verdict'),
      signOffs: await t.knex('level_sign_offs').orderBy('id').select('id', 'voided_at', 'void_reason'),
      counts: await t.counts(['activity', 'flag_events', 'results']),
    };
    const res = await p.manager.post(`${base}/limit-sets/${strict.id}/use`, {});
    expect(res.status).toBe(500);
    expect(spy).toHaveBeenCalledTimes(1);
    spy.mockRestore();
    expect({
      active: await t.knex('projects').where({ id: project.id }).first('limit_set_id'),
      members: await t.knex('members').orderBy('id').select('mark', 'verdict'),
      signOffs: await t.knex('level_sign_offs').orderBy('id').select('id', 'voided_at', 'void_reason'),
      counts: await t.counts(['activity', 'flag_events', 'results']),
    }).toEqual(before);
    expect((await signOffs(p.checker, project.id)).L2?.state).toBe('signed');
  });

  it('choosing a stricter set voids the sign-off of the level whose members failed, says why, and keeps the others', async () => {
    const res = await p.manager.post(`${base}/limit-sets/${strict.id}/use`, {});
    expect(res.status).toBe(200);
    // The answer says what the change did beyond the verdicts (the Limit sets screen shows it).
    expect(res.body.recompute).toMatchObject({ flippedCount: 3, signOffsVoided: ['L2'], flagsNoted: 2 });

    const s = await signOffs(p.checker, project.id);
    expect(s.L2).toMatchObject({
      state: 'voided',
      voidReason: `The limit set changed to "${STRICT}" (verdicts flipped on L2: C1 (pass → fail), C2 (pass → fail))`,
      voidedInRevisionNumber: null,
      voidedBy: { id: p.managerUser.id, name: 'Mireille Fontaine' },
    });
    // Nothing flipped on the roof: its sign-off holds.
    expect(s.Roof).toMatchObject({ state: 'signed', voidReason: null });

    const voided = await t.knex('activity').where({ project_id: project.id, action: 'sign_off.voided' }).select('actor_id', 'summary', 'data');
    expect(voided).toHaveLength(1);
    expect(voided[0].actor_id).toBe(p.managerUser.id);
    expect(voided[0].summary).toBe(`The sign-off of L2 no longer holds: The limit set changed to "${STRICT}" (verdicts flipped on L2: C1 (pass → fail), C2 (pass → fail))`);
    expect(voided[0].data).toMatchObject({ levelName: 'L2', limitSetId: strict.id, revisionNumber: 1, marks: ['C1', 'C2'] });
  });

  it('the flags on flipped members, open or waived, get an automatic note with the verdict before and after; others get none', async () => {
    const b1 = await flagDetail(p.checker, project.id, flag.B1.id);
    expect(automatic(b1).map((e) => e.body)).toEqual([`Limit set changed to "${STRICT}": verdict pass → fail (L/1500 live 1.27)`]);
    expect(automatic(b1)[0]).toMatchObject({ actor: null, data: { cause: 'limit_set', limitSetId: strict.id, verdictBefore: 'pass', verdictAfter: 'fail', revisionNumber: 1 } });
    // Its version moved on, so a screen open on the old one reloads instead of overwriting.
    expect(b1.version).toBe(flag.B1.version + 1);
    const c1 = await flagDetail(p.checker, project.id, flag.C1.id);
    expect(automatic(c1).map((e) => e.body)).toEqual([`Limit set changed to "${STRICT}": verdict pass → fail (L/1500 live 1.27)`]);
    // B2 still passes: no note, same version.
    const b2 = await flagDetail(p.checker, project.id, flag.B2.id);
    expect(automatic(b2)).toEqual([]);
    expect(b2.version).toBe(flag.B2.version);

    const noted = await t.knex('activity').where({ project_id: project.id, action: 'flag.revision_noted' }).select('summary', 'data');
    expect(noted).toHaveLength(1);
    expect(noted[0].summary).toBe(`Limit set changed to "${STRICT}": verdicts flipped on the members of 2 flags: B1, C1`);
    expect(noted[0].data.flagIds.sort()).toEqual([flag.B1.id, flag.C1.id].sort());
  });

  it('the assignee of those flags gets one e-mail naming the change and each flipped member', async () => {
    const mails = (await t.mailbox()).filter((m) => m.to.includes(p.engineerUser.email) && m.subject.startsWith('Limit set change'));
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Limit set change flipped flagged members (Halvercote Yard)');
    expect(mails[0].text).toContain(`Limit set changed to "${STRICT}" in Halvercote Yard`);
    for (const f of [flag.B1, flag.C1]) {
      expect(mails[0].text).toContain(`/projects/${project.id}/flags/${f.id}`);
    }
    expect(mails[0].text).toContain(`Limit set changed to "${STRICT}": verdict pass → fail (L/1500 live 1.27)`);
    expect(mails[0].text).not.toContain(`/flags/${flag.B2.id}`);
  });

  it('an edit of the set in use that flips nothing writes no note and voids nothing', async () => {
    // L2 may be signed off again (C1's flag is waived, C2 has none).
    expect((await p.checker.post(`${base}/levels/${L('L2')}/sign-off`, {})).status).toBe(201);
    const before = { events: await t.counts(['flag_events']), signOffs: await signOffs(p.checker, project.id) };
    // L/2000 (3.0 mm): B1, C1 and C2 still fail, B2 and R1 still pass.
    const res = await p.manager.send('put', `${base}/limit-sets/${strict.id}`, editBody(strict, 2000, 'L/2000 live'));
    expect(res.status).toBe(200);
    strict = res.body.set;
    expect(res.body.recompute).toMatchObject({ flippedCount: 0 });
    expect(await t.counts(['flag_events'])).toEqual(before.events);
    expect(await signOffs(p.checker, project.id)).toEqual(before.signOffs);
    expect(before.signOffs.L2?.state).toBe('signed');
  });

  it('an edit of the set in use that lets members pass again notes it on their flags and voids their level\'s new sign-off', async () => {
    // L/1000 (6.0 mm): B1, C1 and C2 pass again.
    const res = await p.manager.send('put', `${base}/limit-sets/${strict.id}`, editBody(strict, 1000, 'L/1000 live'));
    expect(res.status).toBe(200);
    expect(res.body.recompute).toMatchObject({ flippedCount: 3 });
    const s = await signOffs(p.checker, project.id);
    expect(s.L2).toMatchObject({ state: 'voided', voidReason: `The limit set "${STRICT}" was edited (verdicts flipped on L2: C1 (fail → pass), C2 (fail → pass))` });
    expect(s.Roof?.state).toBe('signed');
    const b1 = await flagDetail(p.checker, project.id, flag.B1.id);
    expect(automatic(b1).map((e) => e.body)).toEqual([
      `Limit set changed to "${STRICT}": verdict pass → fail (L/1500 live 1.27)`,
      `Limit set "${STRICT}" edited: verdict fail → pass (L/1000 live 0.84)`,
    ]);
    expect(automatic(await flagDetail(p.checker, project.id, flag.B2.id))).toEqual([]);
  });
});

describe('a change of the limit set on a large project: the job notes flags and voids sign-offs in its transaction', () => {
  const ENV: Record<string, string> = { IMPORT_JOB_THRESHOLD: '2', JOBS_POLL_SECONDS: '0.5', JOBS_MAINTENANCE_SECONDS: '1', JOBS_WORKER: 'on' };
  const saved: Record<string, string | undefined> = {};
  let t: TestApp;
  let project: TestProject;
  let p: People;

  beforeAll(async () => {
    for (const [k, v] of Object.entries(ENV)) {
      saved[k] = process.env[k];
      process.env[k] = v;
    }
    t = await TestApp.start({ env: ENV });
    ({ project, people: p } = await setUp(t));
  });
  afterAll(async () => {
    await t.close();
    for (const [k, v] of Object.entries(saved)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  });

  async function waitFor(res: Response): Promise<LimitSetJobStatus> {
    expect(res.status).toBe(202);
    let job: LimitSetJobStatus | undefined;
    for (let i = 0; i < 120; i++) {
      job = (await p.manager.get(`/api/projects/${project.id}/limit-sets/jobs/${res.body.jobId}`)).body as LimitSetJobStatus;
      if (job.state === 'completed' || job.state === 'failed') break;
      await new Promise((r) => setTimeout(r, 250));
    }
    return job!;
  }

  it('choosing a stricter set as a job voids the sign-off of L2 and notes the flag on B1 when it completes', async () => {
    const base = `/api/projects/${project.id}`;
    const L = (name: string) => project.levels.find((l) => l.name === name)!.id;
    const b1 = (await p.checker.post(`${base}/flags`, { mark: 'B1', assigneeId: p.engineerUser.id })).body as FlagDetail;
    for (const level of ['L2', 'Roof']) expect((await p.checker.post(`${base}/levels/${L(level)}/sign-off`, {})).status).toBe(201);
    const copy = (await p.manager.post(`${base}/limit-sets`, { fromPreset: 'ibc-2021', name: STRICT })).body as ProjectLimitSetView;
    expect((await p.manager.send('put', `${base}/limit-sets/${copy.id}`, editBody(copy, 1500, 'L/1500 live'))).status).toBe(200);

    const job = await waitFor(await p.manager.post(`${base}/limit-sets/${copy.id}/use`, {}));
    expect(job).toMatchObject({ state: 'completed', result: { recompute: { flippedCount: 3 } } });
    const s = await signOffs(p.checker, project.id);
    expect(s.L2).toMatchObject({ state: 'voided', voidReason: `The limit set changed to "${STRICT}" (verdicts flipped on L2: C1 (pass → fail), C2 (pass → fail))` });
    expect(s.Roof?.state).toBe('signed');
    expect(automatic(await flagDetail(p.checker, project.id, b1.id)).map((e) => e.body)).toEqual([`Limit set changed to "${STRICT}": verdict pass → fail (L/1500 live 1.27)`]);
  });
});
