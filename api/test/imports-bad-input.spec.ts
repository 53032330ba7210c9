import { gunzipSync } from 'node:zlib';
import ExcelJS from 'exceljs';
import type { ApiErrorBody, ImportPreview, ImportProblemDetail } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject } from './support/factories';
import { TestApp } from './support/test-app';
import { noise, PNG, XLS, zipOf } from './fixtures/bad-files';
import { importCounts, uploadFile } from './fixtures/import-client';
import { csvOf, floorBeams, MEMBER_HEADERS, xlsxOf, type FixtureMember } from './fixtures/schedule-files';

/**
 * Every kind of bad upload gets a clear answer (what, where, how to fix) and
 * leaves the database exactly as it was: no revision, member, result, draft
 * or activity row. Caps are lowered for the test (env below) so it stays fast.
 */
const ENV = { IMPORT_MAX_ROWS: '50', IMPORT_MAX_FILE_MB: '1', IMPORT_MAX_UNZIPPED_MB: '5' };

describe('imports: bad input', () => {
  let t: TestApp;
  let project: TestProject;
  let eng: ApiClient;
  const saved: Record<string, string | undefined> = {};

  beforeAll(async () => {
    // The import caps are read from the environment when the api starts.
    for (const [k, v] of Object.entries(ENV)) {
      saved[k] = process.env[k];
      process.env[k] = v;
    }
    t = await TestApp.start();
    const f = new Factories(t.knex);
    const engineer = await f.user();
    project = await f.project({ levels: ['L1', 'L2'], team: [[engineer, 'engineer']] });
    eng = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
  });
  afterAll(async () => {
    await t.close();
    for (const [k, v] of Object.entries(saved)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  });

  /** Uploads, expects the error, and checks that nothing at all was written. */
  async function refused(bytes: Buffer, fileName: string, status: number, code: ApiErrorBody['code'], message?: RegExp): Promise<ApiErrorBody> {
    const before = await importCounts(t);
    const res = await uploadFile(t, eng, project.id, bytes, fileName);
    const body = expectError(res, status, code, message);
    expect(await importCounts(t)).toEqual(before);
    return body;
  }

  /** A 422 whose errors include one with these fields. */
  async function rowsInvalid(bytes: Buffer, fileName: string, expected: Partial<ImportProblemDetail>): Promise<ImportProblemDetail[]> {
    const body = await refused(bytes, fileName, 422, 'IMPORT_ROWS_INVALID', /nothing was stored/);
    const details = body.details as ImportProblemDetail[];
    for (const d of details) {
      expect(Object.keys(d).sort()).toEqual(expect.arrayContaining(['code', 'message', 'row', 'severity', 'sheet', 'value']));
      expect(d.message.length).toBeGreaterThan(20);
    }
    expect(details).toContainEqual(expect.objectContaining({ severity: 'error', ...expected }));
    return details;
  }

  const good = (n = 3): FixtureMember[] => floorBeams(n, { levels: ['L1', 'L2'] });

  it('refuses a file that is not a spreadsheet, whatever its name', async () => {
    await refused(PNG, 'schedule.xlsx', 400, 'IMPORT_FILE_INVALID', /"schedule\.xlsx" is not a spreadsheet.*upload the member schedule as an Excel workbook \(\.xlsx\) or as comma-separated text \(\.csv\)/i);
    await refused(noise(4096), 'members.xlsx', 400, 'IMPORT_FILE_INVALID', /not a spreadsheet/);
    await refused(XLS, 'old.xls', 400, 'IMPORT_FILE_INVALID', /Excel 97-2003 workbook \(\.xls\).*Save it as \.xlsx/);
    await refused(Buffer.alloc(0), 'empty.csv', 400, 'IMPORT_FILE_INVALID', /is empty/);
    await refused(zipOf([{ name: 'word/document.xml', data: Buffer.from('<w/>') }]), 'letter.xlsx', 400, 'IMPORT_FILE_INVALID', /Word document/);
  });

  it('refuses a truncated or corrupt workbook', async () => {
    const whole = await xlsxOf(good());
    await refused(whole.subarray(0, Math.floor(whole.length / 2)), 'cut.xlsx', 400, 'IMPORT_FILE_INVALID', /damaged or incomplete.*cut short.*Save the workbook again/);
    const garbage = zipOf([
      { name: '[Content_Types].xml', data: Buffer.from('<?xml version="1.0"?><Types/>') },
      { name: 'xl/workbook.xml', data: Buffer.from('this is not xml <<<') },
    ]);
    await refused(garbage, 'corrupt.xlsx', 400, 'IMPORT_FILE_INVALID', /could not be read as an Excel workbook/);
  });

  it('refuses zip bombs before opening them: declared too large, or lying about their size', async () => {
    const zeros = Buffer.alloc(8 * 1024 * 1024, 0x20);
    const declared = zipOf([{ name: 'xl/workbook.xml', data: Buffer.from('<workbook/>') }, { name: 'xl/worksheets/sheet1.xml', data: zeros }]);
    expect(declared.length).toBeLessThan(64 * 1024);
    await refused(declared, 'bomb.xlsx', 400, 'IMPORT_FILE_INVALID', /expand to more than 5 MB.*zip bomb/);
    const lying = zipOf([{ name: 'xl/workbook.xml', data: Buffer.from('<workbook/>') }, { name: 'xl/worksheets/sheet1.xml', data: zeros, declaredSize: 1000 }]);
    await refused(lying, 'sly.xlsx', 400, 'IMPORT_FILE_INVALID', /expands to more than its table of contents says.*zip bomb/);
  });

  it('refuses a file over the size cap with 413', async () => {
    await refused(noise(1024 * 1024 + 10), 'huge.xlsx', 413, 'PAYLOAD_TOO_LARGE', /larger than the 1 MB upload limit/);
  });

  it('refuses an upload without a file', async () => {
    const res = await eng.post(`/api/projects/${project.id}/imports`, { file: 'schedule.xlsx' });
    expectError(res, 400, 'IMPORT_FILE_INVALID', /multipart\/form-data/);
  });

  it('reports an empty workbook and one without a Members sheet', async () => {
    const wb = new ExcelJS.Workbook();
    wb.addWorksheet('Members');
    await rowsInvalid(Buffer.from(await wb.xlsx.writeBuffer()), 'empty.xlsx', { code: 'EMPTY_SHEET', sheet: 'Members' });
    await rowsInvalid(await xlsxOf([], { noMembersSheet: true, loads: [] }), 'no-members.xlsx', { code: 'NO_MEMBERS_SHEET', message: expect.stringMatching(/"Notes", "Loads".*Name the sheet/) });
  });

  it('names missing required columns', async () => {
    const headers = MEMBER_HEADERS.map((h) => (h.startsWith('I [') ? 'Inertia-ish' : h));
    const details = await rowsInvalid(await xlsxOf(good(), { headers }), 'no-i.xlsx', { code: 'MISSING_COLUMN', sheet: 'Members', row: 1 });
    expect(details.find((d) => d.code === 'MISSING_COLUMN')!.message).toMatch(/\bI\b/);
  });

  it('names an unknown unit in a header', async () => {
    const headers = MEMBER_HEADERS.map((h) => (h === 'Spans [m]' ? 'Spans [furlong]' : h));
    await rowsInvalid(await xlsxOf(good(), { headers }), 'furlongs.xlsx', { code: 'UNKNOWN_UNIT', row: 1, value: 'Spans [furlong]' });
  });

  it('points at text in a numeric cell', async () => {
    const members = good();
    members[1] = { ...members[1], I: 'big' };
    await rowsInvalid(await xlsxOf(members), 'text.xlsx', { code: 'NOT_A_NUMBER', row: 3, column: 'I [10^6 mm^4] (column L)', value: 'big' });
  });

  it('refuses a formula without a stored result, and reads one with its stored result', async () => {
    const members = good();
    members[0] = { ...members[0], I: { formula: '2*60' } as ExcelJS.CellValue };
    await rowsInvalid(await xlsxOf(members), 'formula.xlsx', { code: 'FORMULA_NO_RESULT', row: 2, column: 'I [10^6 mm^4] (column L)', value: '=2*60' });

    members[0] = { ...members[0], I: { formula: '2*60', result: 120 } as ExcelJS.CellValue };
    const res = await uploadFile(t, eng, project.id, await xlsxOf(members), 'cached.xlsx');
    expect(res.status).toBe(201);
    const preview = res.body as ImportPreview;
    const stored = await t.knex('import_drafts').where({ id: preview.draftId }).first('members_gz');
    expect(JSON.parse(gunzipSync(stored.members_gz).toString('utf8'))[0].I).toBeCloseTo(120e-6, 15);
    await eng.delete(`/api/projects/${project.id}/imports/${preview.draftId}`);
  });

  it('refuses merged cells in the data area, naming the range', async () => {
    const details = await rowsInvalid(await xlsxOf(good(), { members: (s) => s.mergeCells('Q2:R3') }), 'merged.xlsx', { code: 'MERGED_CELLS', sheet: 'Members', row: 2, value: 'Q2:R3' });
    expect(details.find((d) => d.code === 'MERGED_CELLS')!.message).toMatch(/Cells Q2:R3 of the Members sheet are merged\. Unmerge them/);
  });

  it('refuses duplicate marks', async () => {
    const members = good();
    members[2] = { ...members[2], mark: members[0].mark.toLowerCase() };
    await rowsInvalid(await xlsxOf(members), 'dup.xlsx', { code: 'DUPLICATE_MARK', row: 4 });
  });

  it('refuses zero and negative spans', async () => {
    const members = good();
    members[0] = { ...members[0], spans: 0 };
    members[1] = { ...members[1], spans: -4 };
    const details = await rowsInvalid(await xlsxOf(members), 'spans.xlsx', { row: 2, column: 'Spans [m] (column G)' });
    expect(details).toContainEqual(expect.objectContaining({ severity: 'error', row: 3, column: 'Spans [m] (column G)', value: -4 }));
  });

  it('refuses a load outside the member', async () => {
    const members = good();
    await rowsInvalid(
      await xlsxOf(members, { loads: [{ mark: members[0].mark, case: 'L', kind: 'point', position: 25, value: 10 }] }),
      'outside.xlsx',
      { code: 'LOAD_OUTSIDE', sheet: 'Loads', row: 2 },
    );
  });

  it('refuses more member rows than the cap', async () => {
    const csv = Buffer.from(csvOf(floorBeams(60)));
    const details = await rowsInvalid(csv, 'many.csv', { code: 'TOO_MANY_ROWS' });
    expect(details.find((d) => d.code === 'TOO_MANY_ROWS')!.message).toMatch(/more than 50 member rows/);
  });

  it('reads a CSV the same way, unit headers and all', async () => {
    const res = await uploadFile(t, eng, project.id, Buffer.from(csvOf(good(4))), 'members.csv');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ fileType: 'csv', memberCount: 4, problems: [] });
    await eng.delete(`/api/projects/${project.id}/imports/${res.body.draftId}`);
  });
});
