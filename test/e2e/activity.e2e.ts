import { expect, test, type Page } from '@playwright/test';
import ExcelJS from 'exceljs';
import fs from 'node:fs';
import path from 'node:path';

/**
 * The manager's side of journey 3 that lives outside the Overview: the
 * project's Activity feed with its filters in the address, the flags
 * workbook, the daily digest in the Mailbox and the switch that turns it off.
 * Screenshots: test/artifacts/activity-*.png.
 */
const ARTIFACTS = path.join(__dirname, '..', 'artifacts');
const shot = (page: Page, name: string) => page.screenshot({ path: path.join(ARTIFACTS, `activity-${name}.png`), fullPage: true });

const ADMIN = { email: 'admin@halvercote.example', password: 'halvercote-demo' };
const ENGINEER = { email: 'kasimir.oduya@halvercote.example', password: 'halvercote-demo' };

async function signIn(page: Page, who: { email: string; password: string }) {
  await page.context().clearCookies();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(who.email);
  await page.getByLabel('Password').fill(who.password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page).toHaveURL(/\/projects/);
}

async function csrf(page: Page): Promise<string> {
  const cookie = (await page.context().cookies()).find((c) => c.name === 'sagline_csrf');
  return cookie?.value ?? '';
}

test('a manager reads the activity, filters it, downloads the flags workbook; the digest reaches the Mailbox', async ({ page }) => {
  page.on('pageerror', (e) => process.stderr.write(`[page error] ${e.message}\n`));
  await signIn(page, ADMIN);
  await page.getByText('Halvercote Yard').first().click();
  await page.getByLabel('Project sections').getByText('Activity', { exact: true }).click();
  await expect(page).toHaveURL(/\/projects\/\d+\/activity$/);
  const table = page.getByRole('table');
  await expect(table.getByText(/committed revision 1|revision 1/i).first()).toBeVisible();
  await expect(table.getByText(/raised/).first()).toBeVisible();
  await shot(page, '01-feed');

  // Only flag changes; the address says so, and a reload keeps the view.
  await page.getByLabel('Kind').click();
  await page.getByTitle('Flags', { exact: true }).click();
  await page.keyboard.press('Escape');
  await expect(page).toHaveURL(/kind=flags/);
  await expect(table.locator('.ant-tag').filter({ hasNotText: 'Flags' })).toHaveCount(0);
  await page.reload();
  await expect(page).toHaveURL(/kind=flags/);
  await expect(page.locator('.ant-select').filter({ has: page.getByLabel('Kind') }).first()).toContainText('Flags');
  await expect(table.locator('.ant-tag').first()).toHaveText('Flags');
  await shot(page, '02-flags-only');

  // The flags workbook.
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: /Flags workbook/ }).click()]);
  expect(download.suggestedFilename()).toMatch(/^HY-2026-flags-\d{4}-\d{2}-\d{2}\.xlsx$/);
  const file = path.join(ARTIFACTS, 'activity-flags-workbook.xlsx');
  await download.saveAs(file);
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(fs.readFileSync(file) as unknown as ArrayBuffer);
  const sheet = wb.getWorksheet('Flags')!;
  expect(sheet.getRow(1).getCell(2).value).toBe('Mark');
  expect(sheet.rowCount).toBeGreaterThan(1);

  // The daily digest, run now (the scheduled job does the same at 07:00 UTC).
  const res = await page.request.post('/api/digests/send', { data: {}, headers: { 'x-csrf-token': await csrf(page) } });
  expect(res.status()).toBe(200);
  const report = await res.json();
  expect(report.queued + report.alreadySent).toBeGreaterThan(0);

  await signIn(page, ENGINEER);
  await page.goto('/dev/mailbox');
  const digest = page.getByRole('list', { name: 'Messages' }).getByRole('listitem').filter({ hasText: ENGINEER.email }).filter({ hasText: /Sagline digest/ }).first();
  await expect(digest).toBeVisible();
  await digest.click();
  await expect(page.getByText(/flags? waits? on you on Sagline today/).first()).toBeVisible();
  await expect(page.getByText(/(Overdue|Assigned to you: answer once the member is resolved) \(\d+\)/).first()).toBeVisible();
  await shot(page, '03-digest-in-mailbox');

  // The engineer turns the digest off on the Account page.
  await page.goto('/account');
  const toggle = page.getByRole('switch', { name: 'Daily digest' });
  await expect(toggle).toBeChecked();
  await toggle.click();
  await expect(page.getByText(/The daily digest is off/)).toBeVisible();
  await expect(toggle).not.toBeChecked();
  await shot(page, '04-account-digest-off');
  await page.reload();
  await expect(page.getByRole('switch', { name: 'Daily digest' })).not.toBeChecked();
  await toggle.click();
  await expect(page.getByRole('switch', { name: 'Daily digest' })).toBeChecked();
});
