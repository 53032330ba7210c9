import ExcelJS from 'exceljs';
import type { ImportPreview, ProjectLimitSet, RevisionDetail, RevisionSummary } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { TestApp } from './support/test-app';
import { download, importCounts, uploadFile } from './fixtures/import-client';
import { floorBeams, xlsxOf } from './fixtures/schedule-files';

/**
 * Journey 1 end to end over HTTP against real PostgreSQL: template, upload →
 * preview, commit → revision, the revision's file and results workbook, a
 * second revision's diff and verdict flips, and who may do what.
 */
describe('imports', () => {
  let t: TestApp;
  let f: Factories;
  let engineer: TestUser;
  let viewer: TestUser;
  let outsider: TestUser;
  let project: TestProject;
  let eng: ApiClient;

  beforeAll(async () => {
    t = await TestApp.start();
    f = new Factories(t.knex);
    engineer = await f.user({ name: 'Edda Engineer' });
    viewer = await f.user();
    outsider = await f.user();
    project = await f.project({ name: 'Imports Yard', levels: ['L1', 'L2', 'Roof'], team: [[engineer, 'engineer'], [viewer, 'viewer']] });
    eng = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
  });
  afterAll(() => t.close());

  const base = () => `/api/projects/${project.id}`;

  it('offers the blank template in the project unit system, with drop-downs and help', async () => {
    const res = await download(t, eng, `${base()}/imports/template`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="imports-yard-member-schedule-template\.xlsx"/);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as ArrayBuffer);
    expect(wb.worksheets.map((w) => w.name)).toEqual(['Members', 'Loads', 'How to fill in', 'Codes']);
    const header = (wb.getWorksheet('Members')!.getRow(1).values as unknown[]).slice(1);
    expect(header.slice(0, 12)).toEqual(['Mark', 'Level', 'Grid', 'Category', 'Material', 'Section', 'Spans [m]', 'Left overhang [m]', 'Right overhang [m]', 'Supports', 'E [GPa]', 'I [10^6 mm^4]']);
    const category = wb.getWorksheet('Members')!.getCell('D2').dataValidation;
    expect(category).toMatchObject({ type: 'list', formulae: [expect.stringMatching(/^'Codes'!\$A\$2:\$A\$\d+$/)] });
    expect(wb.getWorksheet('How to fill in')!.getCell('A1').value).toBe('Imports Yard: member schedule template');
  });

  it('offers a filled example that imports without a problem', async () => {
    const res = await download(t, eng, `${base()}/imports/example`);
    expect(res.status).toBe(200);
    const up = await uploadFile(t, eng, project.id, res.body as Buffer, 'example.xlsx');
    expect(up.status).toBe(201);
    const preview = up.body as ImportPreview;
    expect(preview.problems).toEqual([]);
    expect(preview.memberCount).toBe(6);
    expect(preview.summary).toEqual({ pass: 6, fail: 0, unchecked: 0 });
    expect((await t.knex('import_drafts').where({ id: preview.draftId }).delete())).toBe(1);
  });

  it('writes the template and example of a US project in US customary units, and the example imports cleanly', async () => {
    const us = await f.project({ name: 'Annex', levels: ['Level 1', 'Level 2', 'Roof'], team: [[engineer, 'engineer']] });
    await t.knex('projects').where({ id: us.id }).update({ unit_system: 'US' });
    const template = await download(t, eng, `/api/projects/${us.id}/imports/template`);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(template.body as ArrayBuffer);
    const header = (wb.getWorksheet('Members')!.getRow(1).values as unknown[]).slice(1);
    expect(header).toEqual(expect.arrayContaining(['Spans [ft]', 'E [ksi]', 'I [in^4]', 'Depth [in]', 'D [plf]', 'L [plf]']));
    const example = await download(t, eng, `/api/projects/${us.id}/imports/example`);
    const up = await uploadFile(t, eng, us.id, example.body as Buffer, 'annex-example.xlsx');
    expect(up.status).toBe(201);
    expect(up.body).toMatchObject({ unitSystem: 'US', memberCount: 6, problems: [], summary: { pass: 6, fail: 0, unchecked: 0 } });
    await eng.delete(`/api/projects/${us.id}/imports/${up.body.draftId}`);
  });

  it('shows the limit set the verdicts come from, with every rule’s source', async () => {
    const res = await eng.get(`${base()}/limit-set`);
    expect(res.status).toBe(200);
    const set = res.body as ProjectLimitSet;
    expect(set).toMatchObject({ name: 'US building: IBC 2021 + ACI 318-19', sourcePresetId: 'us-ibc-2021-aci-318-19' });
    const live = set.rules.find((r) => r.id === 'floor.live')!;
    expect(live).toMatchObject({ category: 'floor', check: expect.stringContaining('360'), ratio: 360, combination: { L: 1 } });
    expect(live.sourceText).toMatch(/^IBC 2021, Table 1604\.3/);
    expect(set.caution).toMatch(/engineer of record/);
  });

  let firstUpload: Buffer;
  let firstRevision: RevisionSummary;

  it('uploads, previews and commits a schedule as revision 1, all in one go', async () => {
    const members = floorBeams(40, { levels: ['L1', 'L2'], failEvery: 10 });
    firstUpload = await xlsxOf(members);
    const before = await importCounts(t);
    const up = await uploadFile(t, eng, project.id, firstUpload, 'Rev A schedule.xlsx');
    expect(up.status).toBe(201);
    const preview = up.body as ImportPreview;
    expect(preview).toEqual({
      draftId: expect.stringMatching(/^[0-9a-f-]{36}$/),
      fileName: 'Rev A schedule.xlsx',
      fileType: 'xlsx',
      fileSize: firstUpload.length,
      unitSystem: 'SI',
      memberCount: 40,
      loadRowCount: 0,
      problems: [],
      fatal: false,
      diff: { against: null, added: expect.any(Array), removed: [], changed: [], flips: [], unchanged: 0 },
      summary: { pass: 36, fail: 4, unchecked: 0 },
      limitSet: { id: expect.any(Number), name: 'US building: IBC 2021 + ACI 318-19' },
      createdAt: expect.any(String),
      expiresAt: expect.any(String),
    });
    expect(preview.diff.added).toHaveLength(40);
    expect(preview.diff.added[9]).toEqual({ mark: 'B00010', level: 'L2', category: 'floor', verdict: 'fail', maxUtilization: expect.closeTo(1 / 0.7, 2) });
    // Only the draft is stored so far.
    expect(await importCounts(t)).toEqual({ ...before, import_drafts: before.import_drafts + 1 });

    const commit = await eng.post(`${base()}/imports/${preview.draftId}/commit`, { label: 'Rev A, for review' });
    expect(commit.status).toBe(201);
    firstRevision = commit.body.revision;
    expect(firstRevision).toEqual({
      id: expect.any(Number),
      number: 1,
      label: 'Rev A, for review',
      uploadedBy: { id: engineer.id, name: 'Edda Engineer' },
      createdAt: expect.any(String),
      fileName: 'Rev A schedule.xlsx',
      fileType: 'xlsx',
      fileSize: firstUpload.length,
      memberCount: 40,
      passCount: 36,
      failCount: 4,
      status: 'committed',
    });
    // Steel floor beams: L/360 live and L/240 total (dead load taken as zero for steel, footnote g): 2 results each.
    expect(await importCounts(t)).toEqual({ ...before, revisions: 1, members: 40, member_loads: 80, results: 80, activity: before.activity + 1 });
    const activity = await t.knex('activity').where({ project_id: project.id, action: 'import.committed' }).first();
    expect(activity.summary).toBe('Committed revision 1 "Rev A, for review" from Rev A schedule.xlsx: 40 members, 4 failing');

    // The second commit of the same draft is refused and changes nothing.
    const again = await eng.post(`${base()}/imports/${preview.draftId}/commit`, {});
    expectError(again, 409, 'CONFLICT', /already committed as revision 1/);
    expect((await importCounts(t)).revisions).toBe(1);
  });

  it('stores SI results that match the handbook deflection 5wL⁴/384EI', async () => {
    // B00001: 4.0 m simple span, L = 4 kN/m (AISC Manual 15th ed., Table 3-23, case 1).
    const m = await t.knex('members').where({ revision_id: firstRevision.id, mark: 'B00001' }).first();
    const live = await t.knex('results').where({ member_id: m.id }).orderBy('id').first();
    const expected = -(5 * 4000 * 4 ** 4) / (384 * 200e9 * m.i);
    expect(live).toMatchObject({ check_name: expect.stringContaining('360'), combination: 'L', segment_kind: 'span', effective_length: 4, limit_ratio: 360 });
    expect(live.deflection / expected).toBeCloseTo(1, 9);
    expect(live.x).toBeCloseTo(2, 9);
    expect(live.utilization).toBeCloseTo(Math.abs(expected) / (4 / 360), 9);
    expect(m).toMatchObject({ verdict: 'pass', level_name: 'L1', level_id: project.levels[0].id, governing_check: live.check_name });
  });

  it('lists revisions, shows one with its parse report, and gives back the original file byte for byte', async () => {
    const list = await eng.get(`${base()}/revisions`);
    expect(list.status).toBe(200);
    expect(list.body).toEqual([firstRevision]);

    const detail = await eng.get(`${base()}/revisions/${firstRevision.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body as RevisionDetail).toEqual({
      ...firstRevision,
      parseReport: { problems: [], memberRows: 40, loadRows: 0 },
      diff: { against: null, added: 40, removed: 0, changed: 0, flips: 0, flipped: [] },
      limitSet: { id: expect.any(Number), name: 'US building: IBC 2021 + ACI 318-19' },
    });

    const file = await download(t, eng, `${base()}/revisions/${firstRevision.id}/file`);
    expect(file.status).toBe(200);
    expect(file.headers['content-disposition']).toBe(`attachment; filename="Rev A schedule.xlsx"; filename*=UTF-8''Rev%20A%20schedule.xlsx`);
    expect(Buffer.compare(file.body as Buffer, firstUpload)).toBe(0);

    expectError(await eng.get(`${base()}/revisions/999999`), 404, 'NOT_FOUND');
  });

  it('exports the results workbook: units in headers, a row per member, failures marked, the caution and the sources', async () => {
    const res = await download(t, eng, `${base()}/revisions/${firstRevision.id}/results.xlsx`);
    expect(res.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as ArrayBuffer);
    expect(wb.worksheets.map((w) => w.name)).toEqual(['Results', 'All checks', 'About']);
    const sheet = wb.getWorksheet('Results')!;
    expect((sheet.getRow(1).values as unknown[]).slice(1)).toEqual([
      'Mark', 'Level', 'Grid', 'Category', 'Material', 'Section', 'Governing check', 'Combination', 'Segment', 'Deflection [mm]', 'Direction',
      'Span ratio (L/…)', 'Limit', 'Allowed [mm]', 'Utilisation', 'Verdict', 'I [10^6 mm^4]', 'I required [10^6 mm^4]', 'Reviewer', 'Limit source',
    ]);
    expect(sheet.rowCount).toBe(41);
    expect(sheet.views[0]).toMatchObject({ state: 'frozen', ySplit: 1 });
    const rows = new Map<string, unknown[]>();
    sheet.eachRow((row, n) => n > 1 && rows.set(String(row.getCell(1).value), (row.values as unknown[]).slice(1)));
    const b10 = rows.get('B00010')!;
    expect(b10[15]).toBe('FAIL');
    expect(b10[14]).toBeCloseTo(1 / 0.7, 2);
    // The I that would pass is the I that makes the utilisation exactly 1 (deflection ∝ 1/I).
    expect((b10[17] as number) / (b10[16] as number)).toBeCloseTo(b10[14] as number, 3);
    expect(b10[10]).toBe('down');
    expect(b10[19]).toMatch(/^IBC 2021, Table 1604\.3/);
    expect(rows.get('B00001')![15]).toBe('PASS');
    const about = wb.getWorksheet('About')!;
    const text: string[] = [];
    about.eachRow((row) => text.push((row.values as unknown[]).filter(Boolean).join(' | ')));
    expect(text.join('\n')).toMatch(/Caution: Results support checking; they do not replace the judgement of the engineer of record/);
    expect(text.join('\n')).toMatch(/Table 1604\.3/);
    expect(wb.getWorksheet('All checks')!.rowCount).toBe(81);
  });

  it('previews a second upload against revision 1: exactly the changed member, its field and its verdict flip', async () => {
    const members = floorBeams(40, { levels: ['L1', 'L2'], failEvery: 10 });
    members[0] = { ...members[0], I: Math.round((members[0].I as number) * 0.7 / 1.6 * 10) / 10 };
    const up = await uploadFile(t, eng, project.id, await xlsxOf(members), 'rev-b.xlsx');
    expect(up.status).toBe(201);
    const { diff, summary } = up.body as ImportPreview;
    expect(summary).toEqual({ pass: 35, fail: 5, unchecked: 0 });
    expect(diff.against).toEqual({ id: firstRevision.id, number: 1, label: 'Rev A, for review' });
    expect(diff.added).toEqual([]);
    expect(diff.removed).toEqual([]);
    expect(diff.unchanged).toBe(39);
    expect(diff.changed).toEqual([
      {
        mark: 'B00001', level: 'L1', category: 'floor', verdict: 'fail', verdictBefore: 'pass', maxUtilization: expect.any(Number),
        changes: [{ field: 'I', label: 'I', before: expect.any(Number), after: expect.any(Number), beforeText: expect.stringMatching(/ ×10⁶ mm⁴$/), afterText: expect.stringMatching(/ ×10⁶ mm⁴$/) }],
      },
    ]);
    expect(diff.flips).toEqual([{ mark: 'B00001', level: 'L1', from: 'pass', to: 'fail', governingCheck: expect.stringContaining('360'), maxUtilization: expect.any(Number) }]);
    await eng.delete(`${base()}/imports/${(up.body as ImportPreview).draftId}`);
  });

  it('gives concurrent commits consecutive revision numbers', async () => {
    const drafts: string[] = [];
    for (const n of [5, 6]) {
      const up = await uploadFile(t, eng, project.id, await xlsxOf(floorBeams(n)), `rev-${n}.xlsx`);
      expect(up.status).toBe(201);
      drafts.push(up.body.draftId);
    }
    const results = await Promise.all(drafts.map((d) => eng.post(`${base()}/imports/${d}/commit`, {})));
    expect(results.map((r) => r.status)).toEqual([201, 201]);
    expect(results.map((r) => r.body.revision.number).sort()).toEqual([2, 3]);
    expect(await t.knex('import_drafts').count('* as n').first()).toEqual({ n: '0' });
  });

  it('lets a viewer read but not upload or commit, and hides the project from outsiders', async () => {
    const before = await importCounts(t);
    const v = await ApiClient.signedIn(t.http, viewer.email, PASSWORD);
    expect((await v.get(`${base()}/revisions`)).status).toBe(200);
    expect((await v.get(`${base()}/limit-set`)).status).toBe(200);
    expect((await download(t, v, `${base()}/revisions/${firstRevision.id}/results.xlsx`)).status).toBe(200);
    expectError(await uploadFile(t, v, project.id, await xlsxOf(floorBeams(3)), 'viewer.xlsx'), 403, 'FORBIDDEN', /needs engineer or manager/);

    const o = await ApiClient.signedIn(t.http, outsider.email, PASSWORD);
    expectError(await uploadFile(t, o, project.id, await xlsxOf(floorBeams(3)), 'outsider.xlsx'), 404, 'NOT_FOUND');
    expectError(await o.get(`${base()}/revisions`), 404, 'NOT_FOUND');
    expectError(await o.get(`${base()}/revisions/${firstRevision.id}/file`), 404, 'NOT_FOUND');
    expectError(await o.get(`${base()}/limit-set`), 404, 'NOT_FOUND');
    expect(await importCounts(t)).toEqual(before);
  });
});
