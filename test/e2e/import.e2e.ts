import { expect, test, type Locator, type Page } from '@playwright/test';
import ExcelJS from 'exceljs';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

/**
 * Journey 1 in the browser: the demo engineer downloads the template, uploads
 * the demo schedule again (report and diff: no changes) and commits it as a
 * new revision; a copy with words in a number cell is refused with its row
 * and column; a copy in which one passing member's I is cut to a tenth shows
 * exactly that member among the verdicts that flip, pass → fail, and is
 * discarded. `npm test` seeds samples/halvercote-yard.xlsx
 * as revision 1 of "Halvercote Yard". Screenshots: test/artifacts/import-*.png.
 */
const ROOT = path.join(__dirname, '..', '..');
const ARTIFACTS = path.join(ROOT, 'test', 'artifacts');
const SAMPLE = path.join(ROOT, 'samples', 'halvercote-yard.xlsx');
/** Full-page shots from the top: scrolled, the sticky top bar would be drawn mid-page. */
async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(ARTIFACTS, `import-${name}.png`), fullPage: true });
}

const ENGINEER = { email: 'kasimir.oduya@halvercote.example', password: 'halvercote-demo' };
const stamp = Date.now().toString(36);
// Made in the worker, not at load: Playwright also loads this file in its runner process.
let scratch = '';
test.beforeAll(() => {
  scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'sagline-import-e2e-'));
});
test.afterAll(() => fs.rmSync(scratch, { recursive: true, force: true }));

async function signIn(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page).toHaveURL(/\/projects/);
}

/** The number of the revision marked current in the revisions table. */
async function currentRevision(revisions: Locator): Promise<number> {
  const row = revisions.getByRole('row').filter({ hasText: 'Current' });
  await expect(row).toHaveCount(1);
  const cell = await row.getByRole('cell').first().innerText();
  return Number(cell.match(/\d+/)![0]);
}

/** Header texts by column number (exceljs rows are 1-based and sparse: fill the holes). */
const headerOf = (sheet: ExcelJS.Worksheet): string[] =>
  Array.from(sheet.getRow(1).values as unknown[], (v) => (v === undefined || v === null ? '' : String(v)));

/** Saves a download into the scratch folder and returns where. */
async function save(page: Page, link: Locator): Promise<{ file: string; name: string }> {
  const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
  const name = download.suggestedFilename();
  const file = path.join(scratch, `${stamp}-${name}`);
  await download.saveAs(file);
  return { file, name };
}

/**
 * A member that passes with room to spare and carries no camber, from the
 * Results sheet of a results workbook (one row per member, its governing
 * check). Every deflection is proportional to 1/(E·I) (linear elasticity),
 * so a tenth of its I multiplies its utilisation by ten: from 0.3–0.9 it
 * lands at 3–9, a clear fail, and no other member moves.
 */
async function passingMember(resultsFile: string): Promise<string> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.readFile(resultsFile);
  const sheet = wb.getWorksheet('Results')!;
  const header = headerOf(sheet);
  const col = (name: string) => header.indexOf(name);
  const [mark, utilisation, verdict] = [col('Mark'), col('Utilisation'), col('Verdict')];
  expect(Math.min(mark, utilisation, verdict)).toBeGreaterThan(0);
  for (let r = 2; r <= sheet.rowCount; r++) {
    const row = sheet.getRow(r);
    const u = Number(row.getCell(utilisation).value);
    if (row.getCell(verdict).value === 'PASS' && u >= 0.3 && u <= 0.9) return String(row.getCell(mark).value);
  }
  throw new Error('The results workbook has no member passing with a utilisation between 0.3 and 0.9');
}

/**
 * Two copies of the demo schedule, one member touched in each: `weaker` has
 * its I divided by 10; `broken` has words in that cell, which the import
 * must refuse with the cell's row and column. `row` is its spreadsheet row.
 */
async function scheduleCopies(mark: string): Promise<{ weaker: string; broken: string; row: number }> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.readFile(SAMPLE);
  const sheet = wb.getWorksheet('Members')!;
  const header = headerOf(sheet);
  const iCol = header.findIndex((h) => h.startsWith('I ['));
  const camberCol = header.findIndex((h) => h.startsWith('Camber'));
  expect(iCol).toBeGreaterThan(0);
  for (let r = 2; r <= sheet.rowCount; r++) {
    const row = sheet.getRow(r);
    if (row.getCell(1).value !== mark) continue;
    // A camber would not scale with I; the chosen member must have none.
    expect(camberCol < 0 || row.getCell(camberCol).value === null).toBe(true);
    const i = Number(row.getCell(iCol).value);
    expect(i).toBeGreaterThan(0);
    const weaker = path.join(scratch, `halvercote-yard-${mark}-weaker.xlsx`);
    row.getCell(iCol).value = i / 10;
    await wb.xlsx.writeFile(weaker);
    const broken = path.join(scratch, `halvercote-yard-${mark}-broken.xlsx`);
    row.getCell(iCol).value = `about ${i}`;
    await wb.xlsx.writeFile(broken);
    return { weaker, broken, row: r };
  }
  throw new Error(`${mark} is not on the Members sheet of ${SAMPLE}`);
}

test('engineer uploads a schedule, reads the report and the diff, commits a revision, and sees a verdict flip', async ({ page }) => {
  await signIn(page, ENGINEER.email, ENGINEER.password);
  await page.getByText('Halvercote Yard').first().click();
  await expect(page).toHaveURL(/\/projects\/\d+/);
  await page.getByLabel('Project sections').getByText('Imports', { exact: true }).click();
  await expect(page).toHaveURL(/\/imports$/);
  const revisions = page.getByRole('table', { name: 'Revisions' });
  await expect(revisions.getByText('halvercote-yard.xlsx').or(revisions.getByText('Kasimir Oduya')).first()).toBeVisible();
  await shot(page, '01-imports');

  // The blank template downloads as a workbook with the Members sheet.
  const template = await save(page, page.getByRole('link', { name: 'Download blank template' }));
  expect(template.name).toMatch(/\.xlsx$/);
  const blank = new ExcelJS.Workbook();
  await blank.xlsx.readFile(template.file);
  expect(blank.getWorksheet('Members')).toBeTruthy();

  // The same schedule again: read without errors, nothing changes.
  const before = await currentRevision(revisions);
  await page.locator('input[type="file"]').setInputFiles(SAMPLE);
  await expect(page.getByText('Preview of halvercote-yard.xlsx')).toBeVisible();
  const verdicts = page.getByRole('group', { name: 'Verdicts of the draft' });
  await expect(verdicts).toContainText('Members');
  await expect(page.getByText(`No changes: every member is the same as in revision ${before}.`)).toBeVisible();
  for (const tab of ['Added (0)', 'Removed (0)', 'Changed (0)', 'Verdicts that flip (0)']) {
    await expect(page.getByRole('tab', { name: tab })).toBeVisible();
  }
  await expect(page.getByText(/does not replace the engineer of record's judgement or the local building code/).first()).toBeVisible();
  await shot(page, '02-preview-no-changes');

  const next = before + 1;
  await page.getByLabel('Revision label (optional)').fill(`Re-issue, unchanged (${stamp})`);
  await page.getByRole('button', { name: `Commit as revision ${next}` }).click();
  await expect(page.getByText(`Revision ${next} committed: Re-issue, unchanged (${stamp}).`)).toBeVisible();
  const newest = revisions.getByRole('row').filter({ hasText: `Re-issue, unchanged (${stamp})` });
  await expect(newest).toContainText('Current');
  await expect(newest).toContainText('Kasimir Oduya');
  expect(await currentRevision(revisions)).toBe(next);
  await shot(page, '03-committed');

  // An earlier revision stays browsable.
  await revisions.getByRole('button', { name: `Details of revision ${before}` }).click();
  const drawer = page.getByRole('dialog');
  await expect(drawer.getByText('Parse report')).toBeVisible();
  await shot(page, '04-revision-details');
  await drawer.getByRole('button', { name: /close/i }).click();
  await expect(drawer).toBeHidden();

  // One member made to fail: a tenth of its I.
  const results = await save(page, revisions.getByRole('link', { name: `Results workbook of revision ${next}` }));
  expect(results.name).toMatch(/\.xlsx$/);
  const mark = await passingMember(results.file);
  const copies = await scheduleCopies(mark);

  // Words in a number cell: refused with where and what, nothing stored.
  await page.locator('input[type="file"]').setInputFiles(copies.broken);
  await expect(page.getByText('Nothing was stored', { exact: true })).toBeVisible();
  const problems = page.getByRole('table', { name: 'Problems of the upload' });
  const problem = problems.locator('tbody tr.ant-table-row').filter({ hasText: 'about ' });
  await expect(problem).toHaveCount(1);
  await expect(problem).toContainText('Error');
  await expect(problem).toContainText('Members');
  await expect(problem.getByRole('cell', { name: String(copies.row), exact: true })).toBeVisible();
  await expect(problem).toContainText(/I \[.*\(column [A-Z]+\)/);
  await expect(page.getByRole('button', { name: /Commit as revision/ })).toHaveCount(0);
  await shot(page, '05-report-invalid');
  expect(await currentRevision(revisions)).toBe(next);

  // A tenth of its I: the preview flips exactly that member.
  await page.locator('input[type="file"]').setInputFiles(copies.weaker);
  await expect(page.getByText(`Preview of ${path.basename(copies.weaker)}`)).toBeVisible();
  await expect(page.getByText('Nothing was stored', { exact: true })).toHaveCount(0);
  await expect(page.getByText('1 now fails.')).toBeVisible();
  await expect(page.getByRole('tab', { name: 'Verdicts that flip (1)' })).toBeVisible();
  await expect(page.getByRole('tab', { name: 'Changed (1)' })).toBeVisible();
  const flips = page.getByRole('table', { name: 'Verdicts that flip' });
  const flipRows = flips.locator('tbody tr.ant-table-row');
  await expect(flipRows).toHaveCount(1);
  await expect(flipRows.first()).toContainText(mark);
  await expect(flipRows.first()).toContainText('Pass → Fail (now fails)');
  await shot(page, '06-preview-flip');

  await page.getByRole('tab', { name: 'Changed (1)' }).click();
  const changedRow = page.getByRole('table', { name: 'Changed members' }).locator('tbody tr.ant-table-row');
  await expect(changedRow).toHaveCount(1);
  await expect(changedRow.first()).toContainText(mark);
  await expect(changedRow.first()).toContainText(/I: .+ → .+/);
  await shot(page, '07-preview-changed');

  // Not committed: the demo keeps its schedule for the next journeys.
  await page.getByRole('button', { name: 'Discard' }).click();
  await page.getByRole('tooltip').getByRole('button', { name: 'Discard' }).click();
  await expect(page.getByText('The upload was discarded; no revision was made.')).toBeVisible();
  await expect(page.getByRole('button', { name: /Commit as revision/ })).toHaveCount(0);
  expect(await currentRevision(revisions)).toBe(next);
  await shot(page, '08-discarded');
});
