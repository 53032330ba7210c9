import { gunzipSync } from 'node:zlib';
import type { ImportPreview } from '@sagline/common/api-types';
import type { ScheduleMember } from '@sagline/common/schedule';
import { copyRows } from '../src/db/copy-rows';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { TestApp } from './support/test-app';
import { uploadFile } from './fixtures/import-client';
import { floorBeams, xlsxOf, type FixtureMember } from './fixtures/schedule-files';

/**
 * The commit writes members, loads and results with COPY (text format): what
 * a person typed must come back exactly, whatever COPY treats specially
 * (tab, newline, carriage return, backslash, the `\N` of null), and numbers
 * must come back as the very doubles the engine computed.
 */
describe('imports: what the commit writes comes back as it was typed', () => {
  let t: TestApp;
  let engineer: TestUser;
  let project: TestProject;
  let eng: ApiClient;

  beforeAll(async () => {
    t = await TestApp.start();
    const f = new Factories(t.knex);
    engineer = await f.user({ name: 'Copy Engineer' });
    project = await f.project({ name: 'Copy Yard', levels: ['L1', 'L2'], team: [[engineer, 'engineer']] });
    eng = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
  });
  afterAll(() => t.close());

  it('keeps tabs, line breaks, backslashes and a literal \\N in marks, grids and notes; blanks stay null', async () => {
    const notes = ['Tab\there', 'Two\nlines', 'Carriage\r\nreturn', 'Back\\slash \\N \\t', '\\N', 'Ünïcødé — 梁 ✓', 'plain'];
    const members: FixtureMember[] = floorBeams(notes.length, { levels: ['L1', 'L2'], failEvery: 3 }).map((m, i) => ({
      ...m,
      mark: i === 3 ? 'B\\00004' : m.mark,
      grid: i === 1 ? 'A\t1' : i === 2 ? undefined : m.grid,
      notes: notes[i],
    }));
    const up = await uploadFile(t, eng, project.id, await xlsxOf(members, { loads: [{ mark: members[0].mark, case: 'L', kind: 'point', position: 1.25, value: 3.3 }] }), 'copy.xlsx');
    expect(up.status).toBe(201);
    const preview = up.body as ImportPreview;
    // What the parser read (the spreadsheet's XML already turned CR LF into LF): the commit must store exactly that.
    const draft = await t.knex('import_drafts').where({ id: preview.draftId }).first('members_gz');
    const parsed = JSON.parse(gunzipSync(draft.members_gz).toString('utf8')) as ScheduleMember[];
    expect(parsed[1].grid).toBe('A\t1');
    expect(parsed[3].notes).toBe('Back\\slash \\N \\t');
    const commit = await eng.post(`/api/projects/${project.id}/imports/${preview.draftId}/commit`, { label: 'copy' });
    expect(commit.status).toBe(201);
    const revisionId = commit.body.revision.id as number;

    const rows = await t.knex('members').where({ revision_id: revisionId }).orderBy('source_row').select('mark', 'grid', 'notes', 'section', 'depth', 'camber', 'reviewer_id');
    expect(rows.map((r) => r.notes)).toEqual(parsed.map((m) => m.notes));
    expect(rows.map((r) => r.grid)).toEqual(parsed.map((m) => m.grid));
    expect(rows.map((r) => r.mark)).toEqual(parsed.map((m) => m.mark));
    expect(rows[0].notes).toBe('Tab\there');
    expect(rows[1].notes).toBe('Two\nlines');
    expect(rows[3].mark).toBe('B\\00004');
    expect(rows[4].notes).toBe('\\N');
    expect(rows[5].notes).toBe('Ünïcødé — 梁 ✓');
    expect(rows[1].grid).toBe('A\t1');
    expect(rows[2].grid).toBeNull();
    expect(rows.every((r) => r.camber === null && r.reviewer_id === null)).toBe(true);

    const loads = await t.knex('member_loads as l').join('members as m', 'm.id', 'l.member_id').where('m.revision_id', revisionId).select('l.kind', 'l.case', 'l.x1', 'l.x2', 'l.value1', 'l.value2', 'l.source_sheet', 'l.source_column');
    expect(loads).toContainEqual({ kind: 'point', case: 'L', x1: 1.25, x2: null, value1: 3300, value2: null, source_sheet: 'Loads', source_column: null });
    expect(loads.filter((l) => l.kind === 'udl')).toHaveLength(members.length * 2);
  });

  it('a row PostgreSQL refuses in the middle of a COPY fails the whole transaction, and the connection goes on working', async () => {
    await t.knex.raw('create table copy_probe (n int not null, label text)');
    try {
      const rows: [number | string, string | null][] = Array.from({ length: 5000 }, (_, i) => [i, `row ${i}`]);
      rows[3500] = ['not a number', 'bad'];
      await expect(
        t.knex.transaction(async (trx) => {
          await trx('copy_probe').insert({ n: -1, label: 'before the copy' });
          await copyRows(trx, 'copy_probe', ['n', 'label'], rows.length, (i) => rows[i]);
        }),
      ).rejects.toThrow(/invalid input syntax for type integer/);
      expect(Number((await t.knex('copy_probe').count<{ n: string }[]>('* as n').first())!.n)).toBe(0);
      // The pool's connections still work, in a transaction too.
      await t.knex.transaction((trx) => copyRows(trx, 'copy_probe', ['n', 'label'], 3, (i) => [i, i === 1 ? null : `ok ${i}`]));
      expect(await t.knex('copy_probe').orderBy('n').select('n', 'label')).toEqual([{ n: 0, label: 'ok 0' }, { n: 1, label: null }, { n: 2, label: 'ok 2' }]);
    } finally {
      await t.knex.raw('drop table copy_probe');
    }
  });

  it('stores the same doubles, verdicts and results the preview computed (the member detail recomputes them)', async () => {
    const members = floorBeams(40, { levels: ['L1', 'L2'], failEvery: 4, prefix: 'N' });
    const up = await uploadFile(t, eng, project.id, await xlsxOf(members), 'numbers.xlsx');
    expect(up.status).toBe(201);
    const preview = up.body as ImportPreview;
    const commit = await eng.post(`/api/projects/${project.id}/imports/${preview.draftId}/commit`, { label: null });
    expect(commit.status).toBe(201);
    const revisionId = commit.body.revision.id as number;
    expect(commit.body.revision).toMatchObject({ memberCount: 40, failCount: preview.summary.fail, passCount: preview.summary.pass });

    const stored = await t.knex('members').where({ revision_id: revisionId }).orderBy('source_row').select('id', 'mark', 'spans', 'e', 'i', 'length', 'verdict', 'max_utilization');
    expect(stored).toHaveLength(40);
    stored.forEach((m, k) => {
      expect(m.spans).toEqual([members[k].spans]);
      expect(m.e).toBe(200e9);
      expect(m.i).toBe(Number(`${members[k].I}e-6`));
    });
    expect(stored.filter((m) => m.verdict === 'fail')).toHaveLength(10);
    const results = await t.knex('results').where({ revision_id: revisionId }).count<{ n: string }[]>('* as n').first();
    expect(Number(results!.n)).toBeGreaterThanOrEqual(80);

    // The member detail runs the engine afresh: the stored doubles must be its numbers to the last bit.
    const detail = await eng.get(`/api/projects/${project.id}/members/${encodeURIComponent(stored[3].mark)}?revision=${revisionId}`);
    expect(detail.status).toBe(200);
    const fresh = (detail.body.report.checks as { segments: { deflection: number; utilization: number; requiredI: number }[] }[]).flatMap((c) => c.segments);
    const kept = detail.body.results as { deflection: number; utilization: number; requiredI: number }[];
    expect(kept.map((r) => [r.deflection, r.utilization, r.requiredI])).toEqual(fresh.map((r) => [r.deflection, r.utilization, r.requiredI]));
    expect(Math.max(...kept.map((r) => r.utilization))).toBe(stored[3].max_utilization);
  });
});
