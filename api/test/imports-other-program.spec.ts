import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { checkZip } from '../src/imports/zip-guard';
import { inflateRawSync } from 'node:zlib';
import type { ImportPreview } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD, type TestProject } from './support/factories';
import { TestApp } from './support/test-app';
import { uploadFile } from './fixtures/import-client';
import { csvOf, floorBeams, type FixtureMember } from './fixtures/schedule-files';

/**
 * A workbook written by another spreadsheet program (LibreOffice Calc,
 * headless: CSV → xlsx) imports to the same members and the same results as
 * the CSV it was made from. `npm test` installs libreoffice-calc-nogui when
 * soffice is missing.
 */
const SOFFICE = ['/usr/bin/soffice', '/usr/bin/libreoffice'].find((p) => fs.existsSync(p));

function convertWithLibreOffice(csvPath: string, outDir: string): Buffer {
  if (!SOFFICE) throw new Error('soffice is not installed: apt-get install -y libreoffice-calc-nogui (npm test does this)');
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'sagline-lo-'));
  try {
    execFileSync(SOFFICE, [`-env:UserInstallation=file://${profile}`, '--headless', '--convert-to', 'xlsx', '--outdir', outDir, csvPath], { stdio: 'pipe', timeout: 120_000 });
  } finally {
    fs.rmSync(profile, { recursive: true, force: true });
  }
  return fs.readFileSync(path.join(outDir, path.basename(csvPath).replace(/\.csv$/, '.xlsx')));
}

/** The text of one part of an xlsx (to see which program wrote it). */
function part(xlsx: Buffer, name: string): string {
  const entry = checkZip(xlsx, { maxUnzippedBytes: 50e6, maxRatio: 1000 }).find((e) => e.name === name)!;
  const start = entry.localHeaderOffset + 30 + xlsx.readUInt16LE(entry.localHeaderOffset + 26) + xlsx.readUInt16LE(entry.localHeaderOffset + 28);
  const raw = xlsx.subarray(start, start + entry.compressedSize);
  return (entry.method === 0 ? raw : inflateRawSync(raw)).toString('utf8');
}

describe('imports: a workbook from another spreadsheet program', () => {
  let t: TestApp;
  let project: TestProject;
  let eng: ApiClient;
  let dir: string;

  beforeAll(async () => {
    t = await TestApp.start();
    const f = new Factories(t.knex);
    const engineer = await f.user();
    project = await f.project({ levels: ['L1', 'L2'], team: [[engineer, 'engineer']] });
    eng = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sagline-import-'));
  });
  afterAll(async () => {
    await t.close();
    fs.rmSync(dir, { recursive: true, force: true });
  });

  it('imports LibreOffice’s xlsx of a CSV to the same members and results as the CSV', async () => {
    const members: FixtureMember[] = floorBeams(24, { failEvery: 6 });
    // Layouts beyond a simple span: continuous spans (text with "+"), an overhang, a cantilever, notes with a comma.
    members[1] = { ...members[1], spans: '5.0+4.0+5.0', notes: 'continuous, three spans' };
    members[2] = { ...members[2], rightOverhang: 1.5 };
    members[3] = { ...members[3], spans: 1.8, supports: 'cantilever-left', I: 60 };
    const csv = csvOf(members);
    const csvPath = path.join(dir, 'members.csv');
    fs.writeFileSync(csvPath, csv);
    const xlsx = convertWithLibreOffice(csvPath, dir);
    expect(part(xlsx, 'docProps/app.xml')).toMatch(/<Application>LibreOffice/);

    const fromCsv = await uploadFile(t, eng, project.id, Buffer.from(csv), 'members.csv');
    expect(fromCsv.status).toBe(201);
    const commit = await eng.post(`/api/projects/${project.id}/imports/${fromCsv.body.draftId}/commit`, {});
    expect(commit.status).toBe(201);

    const fromXlsx = await uploadFile(t, eng, project.id, xlsx, 'members.xlsx');
    expect(fromXlsx.status).toBe(201);
    const preview = fromXlsx.body as ImportPreview;
    expect(preview).toMatchObject({ fileType: 'xlsx', memberCount: 24, summary: (fromCsv.body as ImportPreview).summary });
    expect(preview.problems).toEqual((fromCsv.body as ImportPreview).problems);
    // Compared field by field (common/src/schedule diffMembers) against the CSV's revision: identical members, no flip.
    expect(preview.diff).toMatchObject({ added: [], removed: [], changed: [], flips: [], unchanged: 24 });

    const second = await eng.post(`/api/projects/${project.id}/imports/${preview.draftId}/commit`, {});
    expect(second.status).toBe(201);
    const results = (revisionId: number) =>
      t.knex('results as r').join('members as m', 'm.id', 'r.member_id').where('r.revision_id', revisionId).orderBy(['m.mark', 'r.id'])
        .select('m.mark', 'r.check_name', 'r.segment_index', 'r.x', 'r.deflection', 'r.utilization', 'r.pass', 'r.required_i');
    const a = await results(commit.body.revision.id);
    const b = await results(second.body.revision.id);
    expect(a.length).toBeGreaterThan(48);
    expect(b).toEqual(a);
  }, 120_000);
});
