import type { LimitSetJobStatus, LimitSetsOverview, MembersPage, ProjectLimitSetView, ProjectRole } from '@sagline/common/api-types';
import type { Response } from 'supertest';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { ImportCommitService } from '../src/imports/import-commit.service';
import { ImportsService } from '../src/imports/imports.service';
import { MembersFactory, scheduleCsv, type MemberSpec } from './support/members-factory';
import { TestApp } from './support/test-app';

/**
 * The Limit sets screen on the server: presets with their sources, copies
 * into the project, edits (every bad input answered with its path and
 * nothing written), and the choice of the active set, which recomputes the
 * latest revision's results in one transaction and is recorded.
 *
 * Handbook check (AISC Steel Construction Manual, 15th ed., Table 3-23,
 * case 1, simple beam, uniform load): Δmax = 5wL⁴/384EI at midspan. B1 is a
 * 6 m steel floor beam, E = 200 GPa, I = 100 ×10⁶ mm⁴, live load 6 kN/m:
 * 5.06 mm, which passes L/360 (16.7 mm) and fails L/1500 (4.0 mm). B2 has
 * I = 400 ×10⁶ mm⁴ (1.27 mm): passes both.
 */
const SPAN = 6;
const E = 200e9;
const W_LIVE = 6000;
const I_B1 = 100e-6;
const handbookDeflection = (w: number, l: number, e: number, i: number) => (5 * w * l ** 4) / (384 * e * i);

const MEMBERS: MemberSpec[] = [
  { mark: 'B1', I: 100 },
  { mark: 'B2', I: 400 },
  { mark: 'B3', I: 100, level: 'L2' },
];

/** A rule as the edit sends it back: the view's fields without the derived ones. */
function asInput(rule: ProjectLimitSetView['rules'][number]) {
  const { combinationName: _c, sourceText: _s, ...rest } = rule;
  return rest;
}

function editBody(set: ProjectLimitSetView, change: (rules: ReturnType<typeof asInput>[]) => void = () => undefined) {
  const rules = set.rules.map(asInput);
  change(rules);
  return { version: set.version, name: set.name, description: set.description, rules };
}

const put = (c: ApiClient, url: string, body: unknown): Promise<Response> => c.send('put', url, body);

describe('limit sets: presets, copies, edits and the recompute', () => {
  let t: TestApp;
  let project: TestProject;
  let manager: ApiClient;
  let viewer: ApiClient;
  let managerUser: TestUser;
  let base: string;

  async function overview(c: ApiClient = manager): Promise<LimitSetsOverview> {
    const res = await c.get(base);
    expect(res.status).toBe(200);
    return res.body as LimitSetsOverview;
  }

  async function verdicts(): Promise<Record<string, string | null>> {
    const res = await viewer.get(`/api/projects/${project.id}/members?pageSize=100`);
    expect(res.status).toBe(200);
    return Object.fromEntries((res.body as MembersPage).items.map((m) => [m.mark, m.verdict]));
  }

  /** What a refused request must not touch. */
  async function snapshot() {
    const sets = await t.knex('limit_sets').orderBy('id').select('id', 'name', 'version', 'rules', 'categories');
    const project_ = await t.knex('projects').where({ id: project.id }).first('limit_set_id');
    const revision = await t.knex('revisions').where({ project_id: project.id }).first('limit_set_id', 'limit_set', 'pass_count', 'fail_count');
    const results = await t.knex('results').orderBy('id').select('member_id', 'check_name', 'limit_ratio', 'pass', 'utilization');
    const members = await t.knex('members').orderBy('id').select('id', 'verdict', 'governing_check', 'max_utilization');
    const counts = await t.counts(['activity', 'limit_sets', 'recompute_jobs']);
    return { sets, project_, revision, results, members, counts };
  }

  beforeAll(async () => {
    t = await TestApp.start();
    const f = new Factories(t.knex);
    managerUser = await f.user({ name: 'Mireille Fontaine' });
    const engineer = await f.user();
    const view = await f.user();
    project = await f.project({ team: [[managerUser, 'manager'], [engineer, 'engineer'], [view, 'viewer']] });
    await new MembersFactory(t).revision(project.id, engineer.id, MEMBERS);
    manager = await ApiClient.signedIn(t.http, managerUser.email, PASSWORD);
    viewer = await ApiClient.signedIn(t.http, view.email, PASSWORD);
    base = `/api/projects/${project.id}/limit-sets`;
  });
  afterAll(() => t.close());

  it('shows the presets with the source of every rule, and the project set in use with its results up to date', async () => {
    const o = await overview(viewer);
    expect(o.canEdit).toBe(false);
    expect(o.presets.map((p) => p.id)).toEqual(['ibc-2021', 'aci-318-19', 'us-ibc-2021-aci-318-19', 'custom']);
    const ibc = o.presets.find((p) => p.id === 'ibc-2021')!;
    const live = ibc.rules.find((r) => r.id === 'floor.live')!;
    expect(live).toMatchObject({ check: 'L/360 live', ratio: 360, combination: { L: 1 }, maxAbs: null });
    expect(live.source).toMatchObject({ document: 'International Building Code (IBC)', edition: '2021', clause: 'Table 1604.3, floor members, L column' });
    expect(live.sourceText).toContain('Table 1604.3');
    for (const p of o.presets) for (const r of p.rules) expect([r.source.document, r.source.edition, r.source.clause].every((s) => s.length > 0)).toBe(true);
    expect(o.projectSets).toHaveLength(1);
    expect(o.projectSets[0]).toMatchObject({ active: true, version: 1, sourcePresetId: 'us-ibc-2021-aci-318-19' });
    expect(o.activeId).toBe(o.projectSets[0].id);
    expect(o.results).toMatchObject({ revisionNumber: 1, memberCount: 3, passCount: 3, failCount: 0, limitSetId: o.activeId, upToDate: true });
    expect(o.caution).toMatch(/engineer of record/);
    expect(o.openJob).toBeNull();
    expect((await overview(manager)).canEdit).toBe(true);
  });

  it('copies a preset into the project (not in use yet), edits its ratio, uses it: a member that passed L/360 fails the stricter ratio', async () => {
    const expected = handbookDeflection(W_LIVE, SPAN, E, I_B1);
    expect(expected * 1000).toBeCloseTo(5.0625, 4);
    expect(expected).toBeLessThan(SPAN / 360);
    expect(expected).toBeGreaterThan(SPAN / 1500);
    expect(await verdicts()).toEqual({ B1: 'pass', B2: 'pass', B3: 'pass' });

    const copied = await manager.post(base, { fromPreset: 'ibc-2021', name: 'Halvercote floors, stricter' });
    expect(copied.status).toBe(201);
    const copy = copied.body as ProjectLimitSetView;
    expect(copy).toMatchObject({ name: 'Halvercote floors, stricter', active: false, version: 1, sourcePresetId: 'ibc-2021' });
    expect(copy.rules.find((r) => r.id === 'floor.live')?.source.clause).toBe('Table 1604.3, floor members, L column');

    // Editing a set not in use changes no verdict.
    const edited = await put(manager, `${base}/${copy.id}`, editBody(copy, (rules) => {
      const live = rules.find((r) => r.id === 'floor.live')!;
      live.ratio = 1500;
      live.check = 'L/1500 live';
      live.source = { document: 'Halvercote Yard basis of design', edition: 'Issue B', clause: '§4.2 vibration-sensitive floors', trust: 'common practice', note: 'Project criterion of the engineer of record.' };
    }));
    expect(edited.status).toBe(200);
    expect(edited.body.recompute).toBeNull();
    expect(edited.body.set).toMatchObject({ version: 2, active: false });
    expect(edited.body.set.rules.find((r: { id: string }) => r.id === 'floor.live')).toMatchObject({ ratio: 1500, check: 'L/1500 live', source: { document: 'Halvercote Yard basis of design' } });
    expect(await verdicts()).toEqual({ B1: 'pass', B2: 'pass', B3: 'pass' });

    const used = await manager.post(`${base}/${copy.id}/use`, { version: 2 });
    expect(used.status).toBe(200);
    expect(used.body.set).toMatchObject({ id: copy.id, active: true });
    expect(used.body.recompute).toMatchObject({ revisionNumber: 1, memberCount: 3, before: { pass: 3, fail: 0 }, after: { pass: 1, fail: 2 }, flippedCount: 2 });
    expect(used.body.recompute.flipped).toEqual([
      { mark: 'B1', level: 'L1', from: 'pass', to: 'fail' },
      { mark: 'B3', level: 'L2', from: 'pass', to: 'fail' },
    ]);

    // Every verdict the Members screen shows follows the new set.
    expect(await verdicts()).toEqual({ B1: 'fail', B2: 'pass', B3: 'fail' });
    const detail = await viewer.get(`/api/projects/${project.id}/members/B1`);
    expect(detail.status).toBe(200);
    const rows = await t.knex('results as r').join('members as m', 'm.id', 'r.member_id').where({ 'm.mark': 'B1', 'r.check_name': 'L/1500 live' }).select('r.*');
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ limit_ratio: 1500, rule_id: 'floor.live', pass: false });
    expect(Math.abs(rows[0].deflection)).toBeCloseTo(expected, 9);
    expect(rows[0].allowed).toBeCloseTo(SPAN / 1500, 12);
    expect(rows[0].utilization).toBeCloseTo(expected / (SPAN / 1500), 9);
    // No result of the old set is left behind.
    expect(await t.knex('results').where({ check_name: 'L/360 live' }).count('* as n').first()).toEqual({ n: '0' });
    const revision = await t.knex('revisions').where({ project_id: project.id }).first('limit_set_id', 'limit_set', 'fail_count');
    expect(revision).toMatchObject({ limit_set_id: copy.id, fail_count: 2 });
    expect(revision.limit_set.rules.find((r: { id: string }) => r.id === 'floor.live').ratio).toBe(1500);

    const o = await overview(viewer);
    expect(o.activeId).toBe(copy.id);
    expect(o.projectSets[0].id).toBe(copy.id);
    expect(o.results).toMatchObject({ limitSetId: copy.id, upToDate: true, failCount: 2 });

    // Recorded: who, which set, from → to.
    const activity = await t.knex('activity').where({ project_id: project.id }).orderBy('id').select('action', 'actor_id', 'summary', 'data');
    const applied = activity.find((a) => a.action === 'limit_set.applied');
    expect(applied.actor_id).toBe(managerUser.id);
    expect(applied.summary).toContain('Mireille Fontaine changed the project\'s limit set from "US building: IBC 2021 + ACI 318-19" to "Halvercote floors, stricter"');
    expect(applied.summary).toContain('Revision 1 recomputed: 0 → 2 failing of 3, 2 verdicts flipped');
    expect(applied.data).toMatchObject({ limitSetId: copy.id, to: { id: copy.id, version: 2 }, from: { name: 'US building: IBC 2021 + ACI 318-19' }, marks: ['B1', 'B3'] });
    expect(activity.map((a) => a.action)).toEqual(expect.arrayContaining(['limit_set.copied', 'limit_set.edited', 'limit_set.applied']));
    expect(activity.find((a) => a.action === 'limit_set.edited').summary).toContain('ratio L/360 → L/1500');
  });

  it('editing the set in use recomputes at once, and the activity says so', async () => {
    const active = (await overview()).projectSets.find((s) => s.active)!;
    const res = await put(manager, `${base}/${active.id}`, editBody(active, (rules) => {
      rules.find((r) => r.id === 'floor.live')!.ratio = 1000;
    }));
    expect(res.status).toBe(200);
    // 6000/1000 = 6.0 mm > 5.06 mm: B1 and B3 pass again.
    expect(res.body.recompute).toMatchObject({ after: { pass: 3, fail: 0 }, flippedCount: 2 });
    expect(await verdicts()).toEqual({ B1: 'pass', B2: 'pass', B3: 'pass' });
    const last = await t.knex('activity').where({ project_id: project.id }).orderBy('id', 'desc').first('action', 'summary');
    expect(last.action).toBe('limit_set.edited');
    expect(last.summary).toMatch(/edited the project's limit set .*ratio L\/1500 → L\/1000.*Revision 1 recomputed: 2 → 0 failing/);
  });

  it('refuses bad rules with every problem and its path, and writes nothing', async () => {
    const active = (await overview()).projectSets.find((s) => s.active)!;
    const before = await snapshot();
    const res = await put(manager, `${base}/${active.id}`, editBody(active, (rules) => {
      rules[0].ratio = -360;
      rules[1].source = { ...rules[1].source, document: '' };
      rules[2].combination = {};
      rules[3].category = 'balcony-floors';
      (rules[4] as Record<string, unknown>).maxAbs = 'twenty';
      (rules[5] as Record<string, unknown>).colour = 'red';
    }));
    const body = expectError(res, 400, 'VALIDATION_FAILED', /The limit set was not saved: \d+ problems, first body\.rules\[0\]\.ratio/);
    const paths = body.details!.map((d) => d.path);
    expect(paths).toEqual(expect.arrayContaining([
      'body.rules[0].ratio',
      'body.rules[1].source.document',
      'body.rules[2].combination',
      'body.rules[3].category',
      'body.rules[4].maxAbs',
      'body.rules[5].colour',
    ]));
    expect(body.details!.find((d) => d.path === 'body.rules[0].ratio')!.message).toMatch(/above zero, got -360/);
    expect(body.details!.find((d) => d.path === 'body.rules[3].category')!.message).toMatch(/"balcony-floors" is not a member category/);
    expect(await snapshot()).toEqual(before);

    // Not a list of rules at all, a missing name: the DTO's own message, nothing written.
    const shape = await put(manager, `${base}/${active.id}`, { version: active.version, rules: 'all of them' });
    const shapeBody = expectError(shape, 400, 'VALIDATION_FAILED');
    expect(shapeBody.details!.map((d) => d.path)).toEqual(expect.arrayContaining(['body.name', 'body.rules']));
    expect(await snapshot()).toEqual(before);

    // A preset that does not exist.
    expectError(await manager.post(base, { fromPreset: 'eurocode-9' }), 400, 'VALIDATION_FAILED', /There is no preset "eurocode-9"\. Presets: ibc-2021/);
    expectError(await manager.post(base, { fromPreset: 'ibc-2021', fromSetId: active.id }), 400, 'VALIDATION_FAILED');
    expect(await snapshot()).toEqual(before);
  });

  it('a stale edit gets 409 and changes nothing', async () => {
    const active = (await overview()).projectSets.find((s) => s.active)!;
    const before = await snapshot();
    const res = await put(manager, `${base}/${active.id}`, { ...editBody(active), version: active.version - 1 });
    expectError(res, 409, 'STALE_WRITE', /changed by someone else since you opened it \(it is now at version \d+\)/);
    expect(await snapshot()).toEqual(before);
  });

  it('a set that cannot check every member of the latest revision is refused as a whole: nothing changes', async () => {
    const aci = await manager.post(base, { fromPreset: 'aci-318-19' });
    expect(aci.status).toBe(201);
    const before = await snapshot();
    const res = await manager.post(`${base}/${aci.body.id}/use`, {});
    const body = expectError(res, 400, 'VALIDATION_FAILED', /cannot check 3 members of revision 1, so nothing was changed: .*has no category "floor"/);
    expect(body.details!.map((d) => d.path)).toEqual(['members.B1', 'members.B2', 'members.B3']);
    expect(await snapshot()).toEqual(before);
    expect(await verdicts()).toEqual({ B1: 'pass', B2: 'pass', B3: 'pass' });
  });

  it('an import commit that waited for a change of the limit set is refused, not stored with the old verdicts', async () => {
    const imports = t.app.get(ImportsService, { strict: false });
    const committer = t.app.get(ImportCommitService, { strict: false });
    const engineerId = (await t.knex('project_roles').where({ project_id: project.id, role: 'engineer' }).first('user_id')).user_id;
    const preview = await imports.preview(project.id, engineerId, { fileName: 'rev-b.csv', bytes: Buffer.from(scheduleCsv(MEMBERS), 'utf8') });
    const revisionsBefore = await t.knex('revisions').where({ project_id: project.id }).count('* as n').first();

    // A change of the set holds the project's lock (as applyChange does) while the commit arrives.
    const change = await t.knex.transaction();
    await change('projects').where({ id: project.id }).forUpdate().first('id');
    const commit = committer.commit(project.id, preview.draftId, { label: null, actorId: engineerId }).then(
      () => 'committed',
      (e: { code?: string; message?: string }) => `${e.code}: ${e.message}`,
    );
    await new Promise((r) => setTimeout(r, 500));
    const activeId = (await change('projects').where({ id: project.id }).first('limit_set_id')).limit_set_id;
    await change('limit_sets').where({ id: activeId }).update({ version: change.raw('version + 1') });
    await change.commit();

    expect(await commit).toMatch(/^CONFLICT: The project's limit set changed after this upload was checked/);
    expect(await t.knex('revisions').where({ project_id: project.id }).count('* as n').first()).toEqual(revisionsBefore);
  });

  it('copies the current set, and a copy of a copy keeps its sources', async () => {
    const active = (await overview()).projectSets.find((s) => s.active)!;
    const res = await manager.post(base, { fromSetId: active.id });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: `${active.name} (copy)`, active: false, version: 1 });
    expect(res.body.rules).toEqual(active.rules);
  });

  it('deletes a set the project does not use; the set in use is refused with the way out; revisions keep their copy', async () => {
    const sets = (await overview()).projectSets;
    const active = sets.find((s) => s.active)!;
    const before = await snapshot();
    const refused = await manager.delete(`${base}/${active.id}`);
    expectError(refused, 409, 'CONFLICT', `"${active.name}" is the set the project is checked against, so it cannot be deleted. Choose another set with "Use this set" first, then delete this one.`);
    expect(await snapshot()).toEqual(before);

    // The revision was checked against the preset copy first used; make sure that one is not in use, then delete it.
    const revision = await t.knex('revisions').where({ project_id: project.id }).first('limit_set_id', 'limit_set');
    const unused = sets.find((s) => !s.active)!;
    const res = await manager.delete(`${base}/${unused.id}`);
    expect(res.status).toBe(204);
    expect((await overview()).projectSets.map((s) => s.id)).not.toContain(unused.id);
    expect((await manager.delete(`${base}/${unused.id}`)).status).toBe(404);
    const entry = await t.knex('activity').where({ project_id: project.id }).orderBy('id', 'desc').first('action', 'summary', 'data');
    expect(entry).toMatchObject({ action: 'limit_set.deleted', data: { limitSetId: unused.id, limitSetName: unused.name } });
    expect(entry.summary).toBe(`Mireille Fontaine deleted the limit set "${unused.name}" (not in use; revisions checked against it keep their copy of its rules).`);
    // The revision's own copy of the rules it was checked against is untouched; the Members screen still reads.
    const after = await t.knex('revisions').where({ project_id: project.id }).first('limit_set_id', 'limit_set');
    expect(after.limit_set).toEqual(revision.limit_set);
    expect(after.limit_set_id).toBe(revision.limit_set_id === unused.id ? null : revision.limit_set_id);
    expect(Object.keys(await verdicts())).toEqual(['B1', 'B2', 'B3']);

    // A set that a change being applied is about to use stays until the change is done.
    const next = (await manager.post(base, { fromPreset: 'ibc-2021' })).body as ProjectLimitSetView;
    const jobId = '2c8f4c1e-7a0b-4d3e-9f6a-5b1d2e3c4f50';
    await t.knex('recompute_jobs').insert({ id: jobId, project_id: project.id, limit_set_id: next.id, kind: 'use', state: 'queued', progress: 0 });
    try {
      expectError(await manager.delete(`${base}/${next.id}`), 409, 'CONFLICT', /is being applied right now; wait for it to finish/);
    } finally {
      await t.knex('recompute_jobs').where({ id: jobId }).delete();
    }
    expect((await manager.delete(`${base}/${next.id}`)).status).toBe(204);
  });
});

describe('limit sets: a large project recomputes as a background job', () => {
  const ENV: Record<string, string> = { IMPORT_JOB_THRESHOLD: '2', JOBS_POLL_SECONDS: '0.5', JOBS_MAINTENANCE_SECONDS: '1', JOBS_WORKER: 'on' };
  const saved: Record<string, string | undefined> = {};
  let t: TestApp;
  let project: TestProject;
  let manager: ApiClient;

  beforeAll(async () => {
    for (const [k, v] of Object.entries(ENV)) {
      saved[k] = process.env[k];
      process.env[k] = v;
    }
    // Given both ways the api may read them (the environment, and its configuration).
    t = await TestApp.start({ env: ENV });
    const f = new Factories(t.knex);
    const m = await f.user({ name: 'Mireille Fontaine' });
    project = await f.project({ team: [[m, 'manager']] });
    await new MembersFactory(t).revision(project.id, m.id, MEMBERS);
    manager = await ApiClient.signedIn(t.http, m.email, PASSWORD);
  });
  afterAll(async () => {
    await t.close();
    for (const [k, v] of Object.entries(saved)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  });

  it('answers 202 with a job, shows progress, and stores the change and the results together when it completes', async () => {
    const base = `/api/projects/${project.id}/limit-sets`;
    const copy = (await manager.post(base, { fromPreset: 'ibc-2021' })).body as ProjectLimitSetView;
    const edited = await put(manager, `${base}/${copy.id}`, editBody(copy, (rules) => {
      rules.find((r) => r.id === 'floor.live')!.ratio = 1500;
    }));
    expect(edited.status).toBe(200);
    const res = await manager.post(`${base}/${copy.id}/use`, {});
    expect(res.status).toBe(202);
    const jobId = res.body.jobId as string;

    // A second change while the job runs waits its turn.
    const again = await manager.post(`${base}/${copy.id}/use`, {});
    if (again.status !== 202 && again.status !== 200) expectError(again, 409, 'CONFLICT', /being applied right now/);

    let job: LimitSetJobStatus | undefined;
    for (let i = 0; i < 120; i++) {
      job = (await manager.get(`${base}/jobs/${jobId}`)).body as LimitSetJobStatus;
      if (job.state === 'completed' || job.state === 'failed') break;
      await new Promise((r) => setTimeout(r, 250));
    }
    expect(job).toMatchObject({ state: 'completed', progress: 1, kind: 'use', limitSetId: copy.id });
    expect(job!.result!.recompute).toMatchObject({ after: { fail: 2 }, flippedCount: 2 });
    const o = (await manager.get(base)).body as LimitSetsOverview;
    expect(o).toMatchObject({ activeId: copy.id, results: { upToDate: true, failCount: 2 }, openJob: null });
    const page = (await manager.get(`/api/projects/${project.id}/members?verdict=fail`)).body as MembersPage;
    expect(page.items.map((m) => m.mark).sort()).toEqual(['B1', 'B3']);
    expect(await t.knex('activity').where({ project_id: project.id, action: 'limit_set.applied' }).count('* as n').first()).toEqual({ n: '1' });
  });

  it('a job whose set cannot check the members fails with the reason, and nothing of the change is stored', async () => {
    const base = `/api/projects/${project.id}/limit-sets`;
    const aci = (await manager.post(base, { fromPreset: 'aci-318-19' })).body as ProjectLimitSetView;
    const before = {
      active: await t.knex('projects').where({ id: project.id }).first('limit_set_id'),
      results: await t.knex('results').orderBy('id').select('member_id', 'check_name', 'pass'),
      members: await t.knex('members').orderBy('id').select('id', 'verdict'),
      activity: await t.counts(['activity']),
    };
    const res = await manager.post(`${base}/${aci.id}/use`, {});
    expect(res.status).toBe(202);
    let job: LimitSetJobStatus | undefined;
    for (let i = 0; i < 120; i++) {
      job = (await manager.get(`${base}/jobs/${res.body.jobId}`)).body as LimitSetJobStatus;
      if (job.state === 'completed' || job.state === 'failed') break;
      await new Promise((r) => setTimeout(r, 250));
    }
    expect(job).toMatchObject({ state: 'failed', error: { statusCode: 400, code: 'VALIDATION_FAILED' } });
    expect(job!.error!.message).toMatch(/cannot check 3 members of revision 1, so nothing was changed/);
    expect(job!.error!.details!.map((d) => d.path)).toEqual(['members.B1', 'members.B2', 'members.B3']);
    expect({
      active: await t.knex('projects').where({ id: project.id }).first('limit_set_id'),
      results: await t.knex('results').orderBy('id').select('member_id', 'check_name', 'pass'),
      members: await t.knex('members').orderBy('id').select('id', 'verdict'),
      activity: await t.counts(['activity']),
    }).toEqual(before);
    expect(((await manager.get(base)).body as LimitSetsOverview).openJob).toBeNull();
  });
});

describe('limit sets: role × route matrix', () => {
  type Who = ProjectRole | 'admin' | 'outsider';
  const WHO: Who[] = ['manager', 'engineer', 'checker', 'viewer', 'admin', 'outsider'];
  const READERS: Who[] = ['manager', 'engineer', 'checker', 'viewer', 'admin'];
  const WRITERS: Who[] = ['manager', 'admin'];
  let t: TestApp;
  let project: TestProject;
  const users = {} as Record<Who, TestUser>;
  const client = {} as Record<Who, ApiClient>;
  let base: string;
  let spareId: number;
  let spare: ProjectLimitSetView;
  const jobId = '6f1c1f0e-2b7a-4c55-9a57-1d3f3b8f0a11';

  const ROUTES: { name: string; allowed: Who[]; okStatus: number; write: boolean; call: (c: ApiClient) => Promise<Response> }[] = [
    { name: 'GET limit-sets', allowed: READERS, okStatus: 200, write: false, call: (c) => c.get(base) },
    { name: 'GET limit-set', allowed: READERS, okStatus: 200, write: false, call: (c) => c.get(`/api/projects/${project.id}/limit-set`) },
    { name: 'GET limit-sets/jobs/:jobId', allowed: READERS, okStatus: 200, write: false, call: (c) => c.get(`${base}/jobs/${jobId}`) },
    { name: 'POST limit-sets (copy)', allowed: WRITERS, okStatus: 201, write: true, call: (c) => c.post(base, { fromPreset: 'ibc-2021' }) },
    {
      name: 'PUT limit-sets/:setId',
      allowed: WRITERS,
      okStatus: 200,
      write: true,
      call: async (c) => {
        const res = await put(c, `${base}/${spareId}`, editBody(spare));
        if (res.status === 200) spare = res.body.set;
        return res;
      },
    },
    { name: 'POST limit-sets/:setId/use', allowed: WRITERS, okStatus: 200, write: true, call: (c) => c.post(`${base}/${spareId}/use`, {}) },
    {
      name: 'DELETE limit-sets/:setId',
      allowed: WRITERS,
      okStatus: 204,
      write: true,
      call: async (c) => {
        const res = await c.delete(`${base}/${deletable[0]}`);
        if (res.status === 204) deletable.shift();
        return res;
      },
    },
  ];
  /** Unused copies, one for each person allowed to delete. */
  const deletable: number[] = [];

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    for (const who of WHO) users[who] = await make.user({ isAdmin: who === 'admin', name: `The ${who}` });
    project = await make.project({ team: (['manager', 'engineer', 'checker', 'viewer'] as ProjectRole[]).map((r) => [users[r], r] as [TestUser, ProjectRole]) });
    await make.project({ team: [[users.outsider, 'manager']] });
    await new MembersFactory(t).revision(project.id, users.engineer.id, MEMBERS);
    for (const who of WHO) client[who] = await ApiClient.signedIn(t.http, users[who].email, PASSWORD);
    base = `/api/projects/${project.id}/limit-sets`;
    spare = (await client.manager.post(base, { fromPreset: 'us-ibc-2021-aci-318-19' })).body;
    spareId = spare.id;
    for (const _ of WRITERS) deletable.push((await client.manager.post(base, { fromPreset: 'ibc-2021' })).body.id);
    await t.knex('recompute_jobs').insert({ id: jobId, project_id: project.id, limit_set_id: spareId, kind: 'use', state: 'completed', progress: 1, step: 'Done', result: JSON.stringify({ set: spare, recompute: null }) });
  });
  afterAll(() => t.close());

  for (const route of ROUTES) {
    for (const who of WHO) {
      const expected = route.allowed.includes(who) ? route.okStatus : who === 'outsider' ? 404 : 403;
      it(`${route.name} as ${who} → ${expected}`, async () => {
        const before = await t.counts(['limit_sets', 'activity', 'results', 'recompute_jobs']);
        const res = await route.call(client[who]);
        if (expected === 404) expectError(res, 404, 'NOT_FOUND', /was not found, or you are not on its team/);
        else if (expected === 403) expectError(res, 403, 'FORBIDDEN', /cannot do this; it needs manager/);
        else expect(res.status).toBe(expected);
        if (expected !== route.okStatus || !route.write) expect(await t.counts(['limit_sets', 'activity', 'results', 'recompute_jobs'])).toEqual(before);
      });
    }
  }
});
