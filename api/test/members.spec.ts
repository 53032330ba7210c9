import type { MemberDetail, MemberRow, MembersPage } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory, type MemberSpec } from './support/members-factory';
import { TestApp } from './support/test-app';

/*
 * Revision 1 of the project. Expected deflections from handbook formulas
 * (AISC Steel Construction Manual, 15th ed., Table 3-23: case 1, simple beam
 * under uniform load, Δ = 5wL⁴/384EI; case 23 (cantilever, uniform load),
 * Δ = wL⁴/8EI), limits from IBC 2021 Table 1604.3 (floor: L/360 live, L/240
 * total with D left out for steel, footnote g; 0.5D + L for dry wood,
 * footnote d; cantilevers on twice their length):
 *   B1  6 m steel, I = 20, L = 6 kN/m: Δ_L = 25.31 mm, L/360 = 16.67 → 1.519 fail (L/240 = 25.0 → 1.0125 fail)
 *   B2  I = 100: 5.06 mm → 0.304 pass
 *   B10 I = 50: 10.13 mm → 0.608 pass
 *   C1  I = 30: 16.88 mm → 1.0125 fail L/360 (L/240: 0.675 pass)
 *   C2  4 m timber, E = 11 GPa, I = 100, D = 1, L = 1.5 kN/m: Δ_L = 4.55 mm, L/360 = 11.1 → 0.409 pass
 *   K1  2 m steel cantilever, I = 20: Δ_L = 3.0 mm, 2·2000/360 = 11.1 → 0.270 pass
 *   U1  steel with dead load only: no check applies (unchecked)
 */
const L_UTIL = { B1: 1.51875, B2: 0.30375, B10: 0.6075, C1: 1.0125, C2: 0.40909, K1: 0.27 };

describe('members: list, facets and one member explained', () => {
  let t: TestApp;
  let project: TestProject;
  let ines: TestUser;
  let kasimir: TestUser;
  let engineer: TestUser;
  let viewer: ApiClient;
  let checker: ApiClient;
  let rev1: { id: number; number: number };
  let rev2: { id: number; number: number };
  let base: string;

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    ines = await make.user({ name: 'Ines Okafor', email: 'ines.okafor@halvercote.example' });
    kasimir = await make.user({ name: 'Kasimir Oduya', email: 'kasimir.oduya@halvercote.example' });
    engineer = await make.user({ name: 'Tomas Brandvik' });
    const viewerUser = await make.user({ name: 'Aldo Viewer' });
    project = await make.project({ name: 'Halvercote Yard', team: [[ines, 'checker'], [kasimir, 'checker'], [engineer, 'engineer'], [viewerUser, 'viewer']] });
    const first: MemberSpec[] = [
      { mark: 'B1', grid: 'A/1-2', I: 20, reviewer: ines.email },
      { mark: 'B2', grid: 'A/2-3', I: 100, reviewer: ines.email },
      { mark: 'B10', grid: 'B/1-2', I: 50, reviewer: kasimir.email },
      { mark: 'C1', level: 'L2', grid: 'C/1-2', I: 30, reviewer: kasimir.email },
      { mark: 'C2', level: 'L2', material: 'timber', spans: '4', E: 11, I: 100, D: 1, L: 1.5, reviewer: 'nobody@elsewhere.example' },
      { mark: 'K1', level: 'L2', grid: 'D/5', supports: 'cantilever-left', spans: '2', I: 20, reviewer: kasimir.email },
      { mark: 'U1', level: 'Roof', L: null },
    ];
    const factory = new MembersFactory(t);
    rev1 = await factory.revision(project.id, engineer.id, first, 'Rev A');
    // Revision 2: B1 stiffened (now passes), B2 gone, B3 new.
    rev2 = await factory.revision(project.id, engineer.id, [
      { ...first[0], I: 100 }, ...first.slice(2), { mark: 'B3', grid: 'A/3-4', I: 20, reviewer: ines.email },
    ], 'Rev B');
    viewer = await ApiClient.signedIn(t.http, viewerUser.email, PASSWORD);
    checker = await ApiClient.signedIn(t.http, ines.email, PASSWORD);
    base = `/api/projects/${project.id}/members`;
  });
  afterAll(() => t.close());

  async function list(query: string): Promise<MembersPage> {
    const res = await viewer.get(`${base}?${query}`);
    if (res.status !== 200) throw new Error(`${query}: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body;
  }
  const marks = (p: MembersPage) => p.items.map((m) => m.mark);

  it('lists the latest revision by default, marks in natural order, every field of a row', async () => {
    const page = await list(`revision=${rev1.id}`);
    expect(marks(page)).toEqual(['B1', 'B2', 'B10', 'C1', 'C2', 'K1', 'U1']);
    expect({ total: page.total, page: page.page, pageSize: page.pageSize, revision: page.revision }).toEqual({
      total: 7, page: 1, pageSize: 50, revision: { id: rev1.id, number: 1, label: 'Rev A', createdAt: expect.any(String) },
    });
    const b1: MemberRow = page.items[0];
    expect(b1).toEqual({
      id: expect.any(Number),
      mark: 'B1',
      level: { id: project.levels[0].id, name: 'L1' },
      grid: 'A/1-2',
      category: 'floor',
      material: 'steel',
      section: null,
      supports: 'pinned',
      spans: [6],
      leftOverhang: 0,
      rightOverhang: 0,
      length: 6,
      governingCheck: 'L/360 live',
      maxUtilization: expect.closeTo(L_UTIL.B1, 6),
      verdict: 'fail',
      // The I at which every check passes: I·Δ/Δ_allowed = 20 ×10⁶ mm⁴ × 1.51875.
      requiredI: expect.closeTo(20e-6 * L_UTIL.B1, 12),
      I: 20e-6,
      reviewer: { id: ines.id, name: 'Ines Okafor' },
      reviewerEmail: 'ines.okafor@halvercote.example',
      openFlagCount: 0,
    });
    const c2 = page.items.find((m) => m.mark === 'C2')!;
    expect(c2).toMatchObject({ reviewer: null, reviewerEmail: 'nobody@elsewhere.example', maxUtilization: expect.closeTo(L_UTIL.C2, 4), governingCheck: 'L/360 live', verdict: 'pass' });
    expect(page.items.find((m) => m.mark === 'K1')).toMatchObject({ supports: 'cantilever-left', maxUtilization: expect.closeTo(L_UTIL.K1, 6) });
    expect(page.items.find((m) => m.mark === 'U1')).toMatchObject({ verdict: null, maxUtilization: null, governingCheck: null, requiredI: null });

    const latest = await list('');
    expect(latest.revision).toMatchObject({ id: rev2.id, number: 2, label: 'Rev B' });
    expect(marks(latest)).toEqual(['B1', 'B3', 'B10', 'C1', 'C2', 'K1', 'U1']);
    expect(latest.items[0]).toMatchObject({ verdict: 'pass', maxUtilization: expect.closeTo(L_UTIL.B2, 6) });
  });

  it('filters by level, category, material, reviewer, verdict, failing check, utilisation and text', async () => {
    const r = `revision=${rev1.id}`;
    const [l1, l2] = project.levels;
    expect(marks(await list(`${r}&verdict=fail`))).toEqual(['B1', 'C1']);
    expect(marks(await list(`${r}&verdict=pass`))).toEqual(['B2', 'B10', 'C2', 'K1']);
    expect(marks(await list(`${r}&verdict=fail,unchecked`))).toEqual(['B1', 'C1', 'U1']);
    expect(marks(await list(`${r}&level=${l2.id}`))).toEqual(['C1', 'C2', 'K1']);
    expect(marks(await list(`${r}&level=${l1.id},${l2.id}&verdict=fail`))).toEqual(['B1', 'C1']);
    expect(marks(await list(`${r}&material=timber`))).toEqual(['C2']);
    expect((await list(`${r}&category=floor`)).total).toBe(7);
    expect((await list(`${r}&category=roof-no-ceiling`)).total).toBe(0);
    expect(marks(await list(`${r}&reviewer=${ines.id}`))).toEqual(['B1', 'B2']);
    expect(marks(await list(`${r}&reviewer=none`))).toEqual(['C2', 'U1']);
    expect(marks(await list(`${r}&reviewer=${kasimir.id},none&verdict=fail`))).toEqual(['C1']);
    expect(marks(await list(`${r}&check=${encodeURIComponent('L/360 live')}`))).toEqual(['B1', 'C1']);
    expect(marks(await list(`${r}&check=${encodeURIComponent('L/240 total')}`))).toEqual(['B1']);
    expect(marks(await list(`${r}&check=${encodeURIComponent('L/240 total')}&check=${encodeURIComponent('L/360 live')}`))).toEqual(['B1', 'C1']);
    expect(marks(await list(`${r}&utilMin=0.5&utilMax=1.1`))).toEqual(['B10', 'C1']);
    expect(marks(await list(`${r}&utilMin=1.6`))).toEqual([]);
    expect(marks(await list(`${r}&q=a%2F`))).toEqual(['B1', 'B2']);
    expect(marks(await list(`${r}&q=b1`))).toEqual(['B1', 'B10']);
    // % and _ are text, not patterns.
    expect(marks(await list(`${r}&q=%25`))).toEqual([]);
  });

  it('sorts by utilisation, level, reviewer and mark, and pages without overlap', async () => {
    const r = `revision=${rev1.id}`;
    expect(marks(await list(`${r}&sort=-utilization`))).toEqual(['B1', 'C1', 'B10', 'C2', 'B2', 'K1', 'U1']);
    expect(marks(await list(`${r}&sort=utilization`))).toEqual(['U1', 'K1', 'B2', 'C2', 'B10', 'C1', 'B1']);
    expect(marks(await list(`${r}&sort=-level`))).toEqual(['U1', 'C1', 'C2', 'K1', 'B1', 'B2', 'B10']);
    expect(marks(await list(`${r}&sort=reviewer`))).toEqual(['B1', 'B2', 'B10', 'C1', 'K1', 'C2', 'U1']);
    expect(marks(await list(`${r}&sort=-mark`))).toEqual(['U1', 'K1', 'C2', 'C1', 'B10', 'B2', 'B1']);
    const pages = [];
    for (let page = 1; page <= 3; page++) pages.push(...marks(await list(`${r}&sort=-utilization&pageSize=3&page=${page}`)));
    expect(pages).toEqual(['B1', 'C1', 'B10', 'C2', 'B2', 'K1', 'U1']);
    const last = await list(`${r}&pageSize=3&page=3`);
    expect({ items: marks(last), total: last.total }).toEqual({ items: ['U1'], total: 7 });
    // A page past the end, and a filter nothing matches: no rows, and still the total and the revision.
    const past = await list(`${r}&pageSize=3&page=4`);
    expect({ items: marks(past), total: past.total, revision: past.revision?.id }).toEqual({ items: [], total: 7, revision: rev1.id });
    const none = await list(`${r}&q=nothing-like-this`);
    expect({ items: marks(none), total: none.total, revision: none.revision?.id }).toEqual({ items: [], total: 0, revision: rev1.id });
  });

  it('counts each mark\'s flags that still need action', async () => {
    const raised = await checker.post(`/api/projects/${project.id}/flags`, { mark: 'C1' });
    expect(raised.status).toBe(201);
    const other = await checker.post(`/api/projects/${project.id}/flags`, { mark: 'C1', checkName: 'L/360 live' });
    await checker.post(`/api/projects/${project.id}/flags/${other.body.id}/close`, { version: 1 });
    const page = await list('verdict=fail');
    expect(page.items.map((m) => [m.mark, m.openFlagCount])).toEqual([['B3', 0], ['C1', 1]]);
  });

  it('refuses bad filters and other projects\' revisions', async () => {
    const bad = expectError(await viewer.get(`${base}?revision=first&level=L1&verdict=bad&utilMin=-1&sort=weight&page=0&pageSize=501`), 400, 'VALIDATION_FAILED');
    expect(bad.details).toEqual([
      { path: 'query.revision', message: 'must be "latest" or a revision id of this project' },
      { path: 'query.verdict', message: 'must be one or more of pass, fail, unchecked, comma-separated' },
      { path: 'query.sort', message: expect.stringMatching(/^must be one of mark, -mark, level/) },
      { path: 'query.page', message: 'must be 1 or more' },
      { path: 'query.pageSize', message: 'must be at most 500' },
      { path: 'query.level', message: 'must be level ids, comma-separated, e.g. 3,4' },
      { path: 'query.utilMin', message: 'must be a number of 0 or more, e.g. 0.9 (1 = at the limit)' },
    ]);
    expectError(await viewer.get(`${base}?revision=999999`), 404, 'NOT_FOUND', 'Revision 999999 was not found in this project; the revisions list shows the ones there are.');
    expectError(await viewer.get(`${base}/facets?revision=999999`), 404, 'NOT_FOUND');
    expectError(await viewer.get(`${base}/B1?revision=999999`), 404, 'NOT_FOUND');
  });

  it('gives the facets of a revision, counted in SQL', async () => {
    const res = await viewer.get(`${base}/facets?revision=${rev1.id}`);
    expect(res.status).toBe(200);
    const [l1, l2, roof] = project.levels;
    expect(res.body).toEqual({
      revision: { id: rev1.id, number: 1, label: 'Rev A', createdAt: expect.any(String) },
      total: 7,
      verdicts: { pass: 4, fail: 2, unchecked: 1 },
      levels: [
        { id: l1.id, name: 'L1', count: 3, failCount: 1 },
        { id: l2.id, name: 'L2', count: 3, failCount: 1 },
        { id: roof.id, name: 'Roof', count: 1, failCount: 0 },
      ],
      categories: [{ value: 'floor', count: 7, failCount: 2 }],
      materials: [{ value: 'steel', count: 6, failCount: 2 }, { value: 'timber', count: 1, failCount: 0 }],
      reviewers: [
        { id: ines.id, name: 'Ines Okafor', count: 2, failCount: 1 },
        { id: kasimir.id, name: 'Kasimir Oduya', count: 3, failCount: 1 },
        { id: null, name: null, count: 2, failCount: 0 },
      ],
      checks: [{ name: 'L/360 live', failCount: 2 }, { name: 'L/240 total', failCount: 1 }],
    });
  });

  it('answers a project without revisions with empty lists, and 404 for a member', async () => {
    const make = new Factories(t.knex);
    const empty = await make.project({ team: [[engineer, 'engineer']] });
    const c = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    expect((await c.get(`/api/projects/${empty.id}/members`)).body).toEqual({ items: [], total: 0, page: 1, pageSize: 50, revision: null });
    expect((await c.get(`/api/projects/${empty.id}/members/facets`)).body).toEqual({
      revision: null, total: 0, verdicts: { pass: 0, fail: 0, unchecked: 0 }, levels: [], categories: [], materials: [], reviewers: [], checks: [],
    });
    expectError(await c.get(`/api/projects/${empty.id}/members/B1`), 404, 'NOT_FOUND', 'This project has no revision yet; upload a member schedule on the Imports screen first.');
  });

  it('explains one member: stored data, loads, engine input, a fresh report matching the stored results, rules, flags, history', async () => {
    const res = await viewer.get(`${base}/b1?revision=${rev1.id}`);
    expect(res.status).toBe(200);
    const d = res.body as MemberDetail;
    expect({ revision: d.revision, isLatest: d.isLatest, unitSystem: d.unitSystem }).toEqual({
      revision: { id: rev1.id, number: 1, label: 'Rev A', createdAt: expect.any(String) }, isLatest: false, unitSystem: 'SI',
    });
    expect(d.member).toMatchObject({ mark: 'B1', E: 200e9, I: 20e-6, depth: null, camber: null, notes: null, sourceRow: 2, verdict: 'fail' });
    expect(d.loads).toEqual([
      { position: 0, case: 'D', kind: 'udl', x1: 0, x2: 6, value1: 5000, value2: null, source: { sheet: expect.any(String), row: 2, column: expect.stringContaining('D') } },
      { position: 1, case: 'L', kind: 'udl', x1: 0, x2: 6, value1: 6000, value2: null, source: { sheet: expect.any(String), row: 2, column: expect.stringContaining('L') } },
    ]);
    expect(d.beamInput).toMatchObject({
      length: 6, E: 200e9, I: 20e-6,
      supports: [{ x: 0, kind: 'pin' }, { x: 6, kind: 'pin' }],
      loads: [{ case: 'D', kind: 'udl', x1: 0, x2: 6, w: 5000 }, { case: 'L', kind: 'udl', x1: 0, x2: 6, w: 6000 }],
      combinations: { L: { L: 1 } },
    });
    expect(d.beamInput.checks!.map((c) => [c.name, c.combination, c.ratio])).toEqual([['L/360 live', 'L', 360], ['L/240 total', 'L', 240]]);

    // The fresh run: midspan deflection 5wL⁴/384EI = 25.3125 mm down (AISC Table 3-23 case 1), all of it from the live load.
    const seg = d.report.combinations.L.segments[0];
    expect(seg.extreme.x).toBeCloseTo(3, 6);
    expect(seg.extreme.deflection).toBeCloseTo(-(5 * 6000 * 6 ** 4) / (384 * 200e9 * 20e-6), 9);
    expect(seg.contributions).toEqual([{ load: 1, case: 'L', factor: 1, deflection: expect.closeTo(seg.extreme.deflection, 12) }]);
    // Reactions wL/2 = 18 kN up at each pin (statics).
    expect(d.report.combinations.L.reactions.map((r) => r.force)).toEqual([expect.closeTo(18000, 6), expect.closeTo(18000, 6)]);

    expect(d.results).toHaveLength(2);
    expect(d.results[0]).toEqual({
      checkName: 'L/360 live', combination: 'L', ruleId: 'floor.live', segmentIndex: 0, segmentKind: 'span', segmentFrom: 0, segmentTo: 6,
      x: expect.closeTo(3, 6), deflection: expect.closeTo(-0.0253125, 9), effectiveLength: 6, spanRatio: expect.closeTo(6 / 0.0253125, 3),
      limitRatio: 360, maxAbs: null, plus: 0, allowed: expect.closeTo(6 / 360, 12), governing: 'ratio', utilization: expect.closeTo(L_UTIL.B1, 9),
      pass: false, requiredI: expect.closeTo(20e-6 * L_UTIL.B1, 15),
    });
    // The stored results are the report's checks, number for number.
    d.report.checks.forEach((check, i) => {
      expect(check.name).toBe(d.results[i].checkName);
      expect(check.segments[0].deflection).toBe(d.results[i].deflection);
      expect(check.segments[0].utilization).toBe(d.results[i].utilization);
    });
    expect(d.rules.map((r) => [r.id, r.check, r.combinationName])).toEqual([['floor.live', 'L/360 live', 'L'], ['floor.total.steel', 'L/240 total', 'L']]);
    expect(d.rules[0].sourceText).toMatch(/^IBC 2021, Table 1604\.3, floor members, L column/);
    expect(d.caution).toMatch(/do not replace the judgement of the engineer of record/);

    // History: revision 1 as raised, revision 2 with I changed (and the verdict with it).
    expect(d.history).toEqual([
      { revision: expect.objectContaining({ id: rev1.id, number: 1 }), present: true, verdict: 'fail', maxUtilization: expect.closeTo(L_UTIL.B1, 6), governingCheck: 'L/360 live', changes: [] },
      {
        revision: expect.objectContaining({ id: rev2.id, number: 2 }), present: true, verdict: 'pass', maxUtilization: expect.closeTo(L_UTIL.B2, 6), governingCheck: 'L/360 live',
        changes: [{ field: 'I', label: 'I', before: 20e-6, after: 100e-6, beforeText: expect.stringContaining('20'), afterText: expect.stringContaining('100') }],
      },
    ]);

    const b2 = (await viewer.get(`${base}/B2?revision=${rev1.id}`)).body as MemberDetail;
    expect(b2.history.map((h) => [h.revision.number, h.present])).toEqual([[1, true], [2, false]]);
    expectError(await viewer.get(`${base}/B2`), 404, 'NOT_FOUND', 'There is no member "B2" in revision 2; the Members screen lists the marks of each revision.');
  });

  it('lists the member\'s flags and explains a cantilever and a timber member too', async () => {
    const c1 = (await viewer.get(`${base}/C1`)).body as MemberDetail;
    expect(c1.isLatest).toBe(true);
    expect(c1.flags.map((f) => [f.mark, f.checkName, f.status])).toEqual([['C1', 'L/360 live', 'closed'], ['C1', null, 'open']]);

    // Cantilever: tip deflection wL⁴/8EI (AISC Table 3-23 case 23), checked on twice the length.
    const k1 = (await viewer.get(`${base}/K1`)).body as MemberDetail;
    expect(k1.beamInput.supports).toEqual([{ x: 0, kind: 'fixed' }]);
    expect(k1.report.combinations.L.segments[0]).toMatchObject({ kind: 'overhang', extreme: { x: expect.closeTo(2, 9), deflection: expect.closeTo(-(6000 * 2 ** 4) / (8 * 200e9 * 20e-6), 9) } });
    expect(k1.results[0]).toMatchObject({ segmentKind: 'overhang', effectiveLength: 4, utilization: expect.closeTo(L_UTIL.K1, 9) });

    // Dry timber: total under 0.5D + L (IBC 2021 Table 1604.3 footnote d).
    const c2 = (await viewer.get(`${base}/C2`)).body as MemberDetail;
    expect(c2.beamInput.combinations).toEqual({ L: { L: 1 }, '0.5D+L': { D: 0.5, L: 1 } });
    expect(c2.results.map((r) => [r.checkName, r.combination])).toEqual([['L/360 live', 'L'], ['L/240 total', '0.5D+L']]);
    // 0.5·1 + 1.5 = 2 kN/m over 4 m: 5·2000·4⁴/(384·11e9·100e-6) = 6.06 mm.
    expect(c2.results[1].deflection).toBeCloseTo(-(5 * 2000 * 4 ** 4) / (384 * 11e9 * 100e-6), 9);

    const u1 = (await viewer.get(`${base}/U1`)).body as MemberDetail;
    expect({ checks: u1.beamInput.checks, results: u1.results, rules: u1.rules, combinations: u1.report.combinations }).toEqual({ checks: [], results: [], rules: [], combinations: {} });
  });
});
