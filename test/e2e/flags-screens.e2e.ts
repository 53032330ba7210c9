import { expect, test, type Browser, type Page } from '@playwright/test';
import path from 'node:path';
import { pick } from './support/antd-select';

/**
 * The Flags screens in the browser, on the demo flags that `seed-demo` raises
 * at every stage (api/src/flags/demo-flags.ts): the table with filters in the
 * address, the board by status, a flag page per role, and two people changing
 * one flag at once (the second sees the current flag, nothing is overwritten).
 * Screenshots: test/artifacts/flags-*.png.
 */
const ROOT = path.join(__dirname, '..', '..');
const ARTIFACTS = path.join(ROOT, 'test', 'artifacts');
const PASSWORD = 'halvercote-demo';
const CHECKER = 'ines.okafor@halvercote.example';
const MANAGER = 'mireille.fontaine@halvercote.example';
const VIEWER = 'dalia.stroud@halvercote.example';
const ENGINEER_NAME = 'Kasimir Oduya';

async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(ARTIFACTS, `flags-${name}.png`), fullPage: true });
}

async function signedIn(browser: Browser, email: string): Promise<Page> {
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page).toHaveURL(/\/projects/);
  return page;
}

async function openFlags(page: Page): Promise<string> {
  await page.getByText('Halvercote Yard').first().click();
  await expect(page).toHaveURL(/\/projects\/\d+/);
  const projectUrl = page.url().match(/\/projects\/\d+/)![0];
  await page.getByLabel('Project sections').getByText('Flags', { exact: true }).click();
  await expect(page).toHaveURL(/\/flags$/);
  return projectUrl;
}

test('flags table, filters in the address, board, flag pages by role and a stale write', async ({ browser }) => {
  const checker = await signedIn(browser, CHECKER);
  const projectUrl = await openFlags(checker);
  const table = checker.getByRole('table', { name: 'Flags' });
  const rows = table.locator('tbody tr.ant-table-row');
  await expect(rows.first()).toBeVisible();
  expect(await rows.count()).toBeGreaterThanOrEqual(6);
  await shot(checker, '01-table');

  // The overdue link of the counts is a filter in the address, with the API's name.
  const overdueLink = checker.getByLabel('Flag counts').getByRole('link', { name: /overdue/ });
  const overdue = Number((await overdueLink.innerText()).match(/(\d+) overdue/)![1]);
  await overdueLink.click();
  await expect(checker).toHaveURL(/\/flags\?overdue=true$/);
  await expect(checker.getByRole('switch', { name: 'Overdue only' })).toBeChecked();
  // The table keeps the previous rows while the filtered list loads: wait for the overdue ones before reading them.
  await expect(rows).toHaveCount(overdue);
  for (const row of await rows.all()) await expect(row).toContainText('(overdue)');
  // Opened afresh, the address shows the same view.
  await checker.goto(checker.url());
  await expect(checker.getByRole('switch', { name: 'Overdue only' })).toBeChecked();
  await shot(checker, '02-overdue');
  await checker.getByRole('button', { name: 'Clear filters' }).click();
  await expect(checker).toHaveURL(/\/flags$/);

  // The board: a column per status.
  await checker.getByText('Board by status').click();
  await expect(checker).toHaveURL(/view=board/);
  for (const name of ['Open', 'Answered', 'Closed', 'Waived']) {
    await expect(checker.getByRole('region', { name: `${name} flags` })).toBeVisible();
  }
  const answeredColumn = checker.getByRole('region', { name: 'Answered flags' });
  await expect(answeredColumn.getByRole('link').first()).toBeVisible();
  await shot(checker, '03-board');

  // The answered flag, as the checker sees it: close, waive, reassign.
  await answeredColumn.getByRole('link').first().click();
  await expect(checker).toHaveURL(new RegExp(`${projectUrl}/flags/\\d+$`));
  const flagUrl = checker.url();
  await expect(checker.getByRole('tab', { name: 'Close' })).toBeVisible();
  await expect(checker.getByLabel('History of the flag')).toContainText(`${ENGINEER_NAME}`);
  await expect(checker.getByLabel('History of the flag')).toContainText('answered');
  await shot(checker, '04-flag-checker');

  // The manager waives it meanwhile, in another browser.
  const manager = await signedIn(browser, MANAGER);
  await manager.goto(flagUrl);
  await expect(manager.getByRole('tab', { name: 'Close' })).toHaveCount(0);
  await manager.getByRole('tab', { name: 'Waive' }).click();
  const waive = manager.getByRole('form', { name: 'Waive the flag' });
  await waive.getByLabel('Reason').fill('Accepted by the engineer of record for this bay (browser test).');
  await waive.getByRole('button', { name: 'Waive flag' }).click();
  await expect(manager.getByLabel('The flag').getByText('Waived', { exact: true })).toBeVisible();

  // The checker, still on the old page, closes: refused, and shown the flag as it is now.
  const close = checker.getByRole('form', { name: 'Close the flag' });
  await close.getByLabel('Comment (optional)').fill('The new section passes.');
  await close.getByRole('button', { name: 'Close flag' }).click();
  const notice = checker.getByRole('alert').filter({ hasText: 'Someone changed this flag' });
  await expect(notice).toBeVisible();
  await expect(notice).toContainText('status waived');
  await expect(notice).toContainText('waived the flag');
  await expect(checker.getByLabel('The flag').getByText('Waived', { exact: true })).toBeVisible();
  await expect(checker.getByRole('tab', { name: 'Reopen' })).toBeVisible();
  await shot(checker, '05-stale-write');

  // A viewer reads it, with no action.
  const viewer = await signedIn(browser, VIEWER);
  await viewer.goto(flagUrl);
  await expect(viewer.getByText('You can read this flag; viewers do not change flags.')).toBeVisible();
  await expect(viewer.getByRole('tab')).toHaveCount(0);
  await expect(viewer.getByRole('form')).toHaveCount(0);
  await shot(viewer, '06-flag-viewer');

  // The manager assigns the unassigned flag from the table.
  await manager.goto(`${projectUrl}/flags?assignee=none&status=open,answered`);
  const managerRows = manager.getByRole('table', { name: 'Flags' }).locator('tbody tr.ant-table-row');
  await expect(managerRows.first()).toBeVisible();
  const before = await managerRows.count();
  await managerRows.first().getByRole('checkbox').check();
  await manager.getByRole('button', { name: /Assign 1 selected flag/ }).click();
  const dialog = manager.getByRole('dialog');
  await pick(manager, dialog.getByRole('combobox', { name: 'Assignee' }), new RegExp(ENGINEER_NAME));
  await shot(manager, '07-bulk-assign');
  await dialog.getByRole('button', { name: 'Assign', exact: true }).click();
  await expect(manager.getByText(/1 flag updated/)).toBeVisible();
  await expect(managerRows).toHaveCount(before - 1);
});
