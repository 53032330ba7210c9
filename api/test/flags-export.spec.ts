import ExcelJS from 'exceljs';
import type { FlagDetail } from '@sagline/common/api-types';
import { VERDICT_CAUTION } from '@sagline/common/limits';
import { download as fetchFile } from './fixtures/import-client';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp, TEST_PUBLIC_URL } from './support/test-app';

const dayOffset = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

async function download(c: ApiClient, url: string): Promise<{ status: number; headers: Record<string, string>; workbook: ExcelJS.Workbook }> {
  const res = await fetchFile(t, c, url);
  const workbook = new ExcelJS.Workbook();
  if (res.status === 200) await workbook.xlsx.load(res.body as ArrayBuffer);
  return { status: res.status, headers: res.headers as Record<string, string>, workbook };
}

/** Rows of a sheet as header → value objects. */
function rows(sheet: ExcelJS.Worksheet): Record<string, unknown>[] {
  const header = (sheet.getRow(1).values as unknown[]).slice(1) as string[];
  const out: Record<string, unknown>[] = [];
  sheet.eachRow((row, n) => {
    if (n === 1) return;
    const values = (row.values as unknown[]).slice(1);
    out.push(Object.fromEntries(header.map((h, i) => [h, values[i] ?? null])));
  });
  return out;
}

let t: TestApp;

describe('the flags workbook', () => {
  let project: TestProject;
  let viewer: ApiClient;
  let flags: Record<'overdue' | 'answered' | 'closed' | 'waived' | 'gone', FlagDetail>;
  let url: string;

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    const checker = await make.user({ name: 'Priya Castellanos' });
    const engineer = await make.user({ name: 'Rafe Lindqvist' });
    const manager = await make.user({ name: 'Mireille Fontaine' });
    const viewerUser = await make.user({ name: 'Aldo Viewer' });
    project = await make.project({ name: 'Halvercote Yard', number: 'HY-2041', team: [[checker, 'checker'], [engineer, 'engineer'], [manager, 'manager'], [viewerUser, 'viewer']] });
    const members = new MembersFactory(t);
    const all = ['B1', 'B2', 'B3', 'B4', 'B5'].map((mark) => ({ mark, I: 20 }));
    await members.revision(project.id, engineer.id, all);
    const c = {
      checker: await ApiClient.signedIn(t.http, checker.email, PASSWORD),
      engineer: await ApiClient.signedIn(t.http, engineer.email, PASSWORD),
      manager: await ApiClient.signedIn(t.http, manager.email, PASSWORD),
    };
    viewer = await ApiClient.signedIn(t.http, viewerUser.email, PASSWORD);
    const raise = async (body: Record<string, unknown>): Promise<FlagDetail> => {
      const res = await c.checker.post(`/api/projects/${project.id}/flags`, body);
      if (res.status !== 201) throw new Error(`${res.status} ${JSON.stringify(res.body)}`);
      return res.body;
    };
    flags = {
      overdue: await raise({ mark: 'B1', checkName: 'L/360 live', assigneeId: engineer.id, dueDate: dayOffset(-3), comment: 'Over the live-load limit.' }),
      answered: await raise({ mark: 'B2', assigneeId: engineer.id, dueDate: dayOffset(10) }),
      closed: await raise({ mark: 'B3', assigneeId: engineer.id }),
      waived: await raise({ mark: 'B4' }),
      gone: await raise({ mark: 'B5', assigneeId: engineer.id }),
    };
    expect((await c.engineer.post(`/api/projects/${project.id}/flags/${flags.answered.id}/answer`, { version: 1, body: 'Camber 10 mm added.' })).status).toBe(200);
    expect((await c.checker.post(`/api/projects/${project.id}/flags/${flags.closed.id}/close`, { version: 1, body: 'Checked the new section.' })).status).toBe(200);
    expect((await c.manager.post(`/api/projects/${project.id}/flags/${flags.waived.id}/waive`, { version: 1, reason: 'Architectural finish tolerates it.' })).status).toBe(200);
    // Revision 2 leaves B5 out and makes B2 pass.
    await members.revision(project.id, engineer.id, [{ mark: 'B1', I: 20 }, { mark: 'B2', I: 100 }, { mark: 'B3', I: 100 }, { mark: 'B4', I: 20 }]);
    await t.outbox.settle();
    url = `/api/projects/${project.id}/flags.xlsx`;
  });
  afterAll(() => t.close());

  it('lists every flag, overdue first, with people, dates, member facts in the latest revision and the last comment', async () => {
    const { status, headers, workbook } = await download(viewer, url);
    expect(status).toBe(200);
    expect(headers['content-type']).toBe('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    expect(headers['content-disposition']).toMatch(new RegExp(`attachment; filename="HY-2041-flags-${new Date().toISOString().slice(0, 10)}\\.xlsx"`));
    expect(workbook.worksheets.map((s) => s.name)).toEqual(['Flags', 'About']);

    const sheet = workbook.getWorksheet('Flags')!;
    expect((sheet.getRow(1).values as unknown[]).slice(1)).toEqual([
      'Flag', 'Mark', 'Level', 'Check', 'Title', 'Status', 'Overdue', 'Days overdue [d]', 'Due (date)', 'Assignee', 'Raised by', 'Raised (UTC)',
      'Last change (UTC)', 'Closed (UTC)', 'Raised in revision', 'Verdict (latest revision)', 'Utilisation [Δ/allowed]', 'Last comment',
      'Last comment by', 'Last comment (UTC)', 'Waive reason', 'Link', 'Limit source',
    ]);
    const list = rows(sheet);
    expect(list.map((r) => [r.Mark, r.Status, r.Overdue])).toEqual([
      ['B1', 'open', 'OVERDUE'],
      ['B5', 'open', null],
      ['B2', 'answered', null],
      ['B3', 'closed', null],
      ['B4', 'waived', null],
    ]);
    const [b1, b5, b2, b3, b4] = list;
    expect(b1).toMatchObject({
      Flag: flags.overdue.id, Level: 'L1', Check: 'L/360 live', Title: flags.overdue.title, 'Days overdue [d]': 3, 'Due (date)': new Date(`${dayOffset(-3)}T00:00:00Z`),
      Assignee: 'Rafe Lindqvist', 'Raised by': 'Priya Castellanos', 'Closed (UTC)': null, 'Raised in revision': 1, 'Verdict (latest revision)': 'FAIL',
      'Last comment': 'Over the live-load limit.', 'Last comment by': 'Priya Castellanos',
      Link: { text: `${TEST_PUBLIC_URL}/projects/${project.id}/flags/${flags.overdue.id}`, hyperlink: `${TEST_PUBLIC_URL}/projects/${project.id}/flags/${flags.overdue.id}` },
      'Limit source': expect.stringMatching(/IBC 2021, Table 1604\.3/),
    });
    expect(b1['Raised (UTC)']).toBeInstanceOf(Date);
    expect(b1['Utilisation [Δ/allowed]']).toBeCloseTo(1.5188, 3);
    expect(b5).toMatchObject({ Level: 'not in the latest revision', 'Verdict (latest revision)': null, 'Utilisation [Δ/allowed]': null, Check: 'whole member' });
    expect(b2).toMatchObject({ 'Verdict (latest revision)': 'PASS', 'Last comment': 'Camber 10 mm added.', 'Last comment by': 'Rafe Lindqvist', 'Due (date)': new Date(`${dayOffset(10)}T00:00:00Z`), 'Days overdue [d]': null });
    expect(b3['Closed (UTC)']).toBeInstanceOf(Date);
    expect(b3).toMatchObject({ 'Last comment': 'Checked the new section.' });
    expect(b4).toMatchObject({ Assignee: 'unassigned', 'Waive reason': 'Architectural finish tolerates it.', 'Last comment by': 'Mireille Fontaine' });
  });

  it('freezes the header, filters every column and colours statuses and overdue flags', async () => {
    const sheet = (await download(viewer, url)).workbook.getWorksheet('Flags')!;
    expect(sheet.views[0]).toMatchObject({ state: 'frozen', xSplit: 2, ySplit: 1 });
    expect(sheet.autoFilter).toBe('A1:W1');
    const formats = (sheet as unknown as { conditionalFormattings: { ref: string; rules: { type: string; text?: string; formulae?: string[] }[] }[] }).conditionalFormattings;
    expect(formats.map((f) => f.ref)).toEqual(['F2:F6', 'G2:G6', 'B2:B6', 'Q2:Q6']);
    // Read back, a "contains text" rule is its formula.
    expect(formats[0].rules.map((r) => [r.type, r.formulae?.[0]])).toEqual(
      ['open', 'answered', 'closed', 'waived'].map((w) => ['containsText', `NOT(ISERROR(SEARCH("${w}",F2)))`]),
    );
    expect(formats[1].rules[0]).toMatchObject({ type: 'containsText', formulae: ['NOT(ISERROR(SEARCH("OVERDUE",G2)))'] });
    expect(formats[2].rules[0]).toMatchObject({ type: 'expression', formulae: ['$G2="OVERDUE"'] });
  });

  it('carries the caution, the counts and the source of each check in an About sheet', async () => {
    const about = (await download(viewer, url)).workbook.getWorksheet('About')!;
    const text: string[] = [];
    about.eachRow((row) => text.push((row.values as unknown[]).slice(1).filter((v) => v !== null && v !== undefined).join(' | ')));
    expect(text[0]).toBe('Halvercote Yard (HY-2041): flags');
    expect(about.getCell('A3').value).toBe(`Caution: ${VERDICT_CAUTION}`);
    expect(about.getCell('A3').isMerged).toBe(true);
    expect(text).toContain('Flags | 5: 2 open, 1 answered, 1 closed, 1 waived');
    expect(text).toContain('Overdue | 1 (open or answered, due before today, UTC)');
    expect(text).toContain('Member facts from | revision 2 (the latest)');
    expect(text.some((l) => /^L\/360 live \| floor \| IBC 2021, Table 1604\.3/.test(l))).toBe(true);
  });

  it('is empty but well formed for a project without flags, and hidden from outsiders', async () => {
    const make = new Factories(t.knex);
    const someone = await make.user();
    const empty = await make.project({ name: 'Quiet job', team: [[someone, 'viewer']] });
    const c = await ApiClient.signedIn(t.http, someone.email, PASSWORD);
    const { status, workbook } = await download(c, `/api/projects/${empty.id}/flags.xlsx`);
    expect(status).toBe(200);
    expect(workbook.getWorksheet('Flags')!.rowCount).toBe(1);
    expect((await fetchFile(t, c, url)).status).toBe(404);
    expectError(await c.get(url), 404, 'NOT_FOUND');
  });
});
