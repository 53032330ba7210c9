import { expect, test, type Browser, type Locator, type Page } from '@playwright/test';
import path from 'node:path';
import type { MembersPage, ProjectOverview } from '@sagline/common/api-types';
import { pick, tick } from './support/antd-select';

/**
 * Journey 3 in the browser: the demo manager reads the overview and assigns
 * a reviewer to a level, then one member a reviewer of its own on the Members
 * screen (and back to the level's on the Member screen); the demo checker raises a flag on a failing member
 * of that level for the demo engineer, who finds the e-mail in the Mailbox
 * and answers; the checker closes it and signs the level off; the manager
 * sees the counts and the chart move, and prints the status report.
 * Counts are read before and after, so earlier journeys on the same demo
 * database do not matter. Screenshots: test/artifacts/overview-*.png.
 */
const ROOT = path.join(__dirname, '..', '..');
const ARTIFACTS = path.join(ROOT, 'test', 'artifacts');
const PASSWORD = 'halvercote-demo';
const MANAGER = { email: 'mireille.fontaine@halvercote.example', name: 'Mireille Fontaine' };
const CHECKER = { email: 'ines.okafor@halvercote.example', name: 'Ines Okafor' };
const ENGINEER = { email: 'kasimir.oduya@halvercote.example', name: 'Kasimir Oduya' };
const REVIEWER = 'Tomas Brandvik';
/** A checker the manager gives one member of the level to, on the Members screen (then hands it back). */
const OWN_REVIEWER = 'Priya Castellanos';
const stamp = Date.now().toString(36);

async function shot(page: Page, name: string) {
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(ARTIFACTS, `overview-${name}.png`), fullPage: true });
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

async function json<T>(page: Page, url: string): Promise<T> {
  const res = await page.request.get(url);
  expect(res.status(), url).toBe(200);
  return (await res.json()) as T;
}

/** The count a row of the overview shows in one column (its link's accessible name: "Open: 3 (L2)"). */
async function count(row: Locator, column: string, name: string): Promise<number> {
  const link = row.getByRole('link', { name: new RegExp(`^${column}: \\d+ \\(${name}\\)$`) });
  const label = (await link.getAttribute('aria-label'))!;
  return Number(label.match(/: (\d+) /)![1]);
}

test('manager reads the overview and assigns a reviewer; a flag is raised, mailed, answered and closed; the counts and the chart follow', async ({ browser }) => {
  // Three people and a dozen screens, on a machine that may be busy: more than the default two minutes.
  test.setTimeout(300_000);
  // ---- The manager opens the project: the overview is its first screen.
  const manager = await signedIn(browser, MANAGER.email);
  await manager.getByText('Halvercote Yard').first().click();
  await expect(manager).toHaveURL(/\/projects\/\d+\/overview$/);
  const projectUrl = manager.url().match(/\/projects\/\d+/)![0];
  const api = `/api${projectUrl}`;
  const levels = manager.getByRole('table', { name: 'Per level' });
  await expect(levels.locator('tbody tr.ant-table-row').first()).toBeVisible();
  await expect(manager.getByLabel('Latest revision')).toContainText(/Revision \d+/);

  // The screen shows what the server counted: the totals and each level's row.
  const before = await json<ProjectOverview>(manager, `${api}/overview`);
  const totals = manager.getByLabel('Totals');
  await expect(totals).toContainText(`Members${before.totals.members}`);
  await expect(totals).toContainText(`Failing${before.totals.fail}`);
  for (const l of before.levels.filter((r) => r.level?.id)) {
    const row = levels.getByRole('row', { name: new RegExp(`^${l.level!.name}\\b`) }).first();
    expect(await count(row, 'Failing', l.level!.name)).toBe(l.fail);
    expect(await count(row, 'Open', l.level!.name)).toBe(l.flagsOpen);
  }
  const chart = manager.getByRole('img', { name: /^Flags over time\./ });
  await expect(chart).toBeVisible();
  /** Today's counts as the chart states them: [open, answered, closed, waived]. */
  const chartToday = async () => (await chart.getAttribute('aria-label'))!.match(/(\d+) open, (\d+) answered, (\d+) closed, (\d+) waived\.$/)!.slice(1).map(Number);
  const chartBefore = await chartToday();
  expect(chartBefore).toEqual([before.totals.flagsOpen, before.totals.flagsAnswered, before.totals.flagsClosed, before.totals.flagsWaived]);
  await shot(manager, '01-overview');

  // A level to work on: failing members, nothing on it waiting for action, so it can be signed off at the end.
  const target = before.levels.find((l) => l.level?.id && l.fail > 0 && l.flagsOpen + l.flagsAnswered === 0) ?? before.levels.find((l) => l.level?.id && l.fail > 0)!;
  const levelName = target.level!.name;
  const levelId = target.level!.id!;
  const failing = await json<MembersPage>(manager, `${api}/members?level=${levelId}&verdict=fail&sort=-utilization&pageSize=100`);
  const member = failing.items.find((m) => m.openFlagCount === 0)!;
  expect(member, `a failing member of ${levelName} without a flag`).toBeTruthy();

  // ---- The manager assigns a reviewer to the level; the per-reviewer table follows.
  const reviewerRow = () => manager.getByRole('table', { name: 'Per reviewer' }).getByRole('row', { name: new RegExp(`^${REVIEWER}`) }).first();
  const reviewerBefore = before.reviewers.find((r) => r.reviewer?.name === REVIEWER);
  const tomasId = (await json<{ candidates: { id: number; name: string }[] }>(manager, `${api}/reviewer-assignments`)).candidates.find((c) => c.name === REVIEWER)!.id;
  const alreadyHis = (await json<MembersPage>(manager, `${api}/members?level=${levelId}&reviewer=${tomasId}&pageSize=1`)).total;
  await pick(manager, manager.getByRole('combobox', { name: `Reviewer of ${levelName}` }), new RegExp(`^${REVIEWER}$`));
  await expect(manager.getByText(`${REVIEWER} now reviews ${levelName}.`)).toBeVisible();
  const expectedMembers = (reviewerBefore?.members ?? 0) - alreadyHis + target.members;
  await expect(reviewerRow().getByRole('link', { name: `Members: ${expectedMembers} (${REVIEWER})` })).toBeVisible();
  // The Members screen follows the assignment: the level's members, filtered by the reviewer, are all of them.
  await reviewerRow().getByRole('link', { name: REVIEWER, exact: true }).click();
  await expect(manager).toHaveURL(new RegExp(`/members\\?reviewer=${tomasId}$`));
  await expect(manager.getByText(`${expectedMembers} match the filters`)).toBeVisible();
  await manager.goBack();
  await expect(levels.locator('tbody tr.ant-table-row').first()).toBeVisible();
  await shot(manager, '02-reviewer-assigned');

  // ---- On the Members screen the manager gives one failing member of the level a reviewer of its own;
  // the table's Reviewer column and its Reviewer filter follow. Then, on the Member screen, the member
  // goes back to its level's reviewer (so the demo data stays as it was).
  const priyaId = (await json<{ candidates: { id: number; name: string }[] }>(manager, `${api}/reviewer-assignments`)).candidates.find((c) => c.name === OWN_REVIEWER)!.id;
  await manager.goto(`${projectUrl}/members?level=${levelId}&verdict=fail&sort=-utilization&pageSize=100`);
  const membersTable = manager.getByRole('table', { name: 'Members' });
  const memberRow = () => membersTable.locator('tr.ant-table-row', { has: manager.getByRole('link', { name: member.mark, exact: true }) });
  await expect(memberRow()).toContainText(REVIEWER);
  await expect(manager.getByRole('button', { name: 'Assign reviewer to selected members' })).toBeDisabled();
  await membersTable.getByRole('checkbox', { name: `Select ${member.mark}` }).check();
  await manager.getByRole('button', { name: 'Assign reviewer to 1 selected member' }).click();
  const assignDialog = manager.getByRole('dialog', { name: `Reviewer of ${member.mark}` });
  await pick(manager, assignDialog.getByRole('combobox', { name: `Reviewer of ${member.mark}` }), new RegExp(`^${OWN_REVIEWER}$`));
  await assignDialog.getByRole('button', { name: 'Assign' }).click();
  await expect(manager.getByText(`${OWN_REVIEWER} now reviews ${member.mark}.`)).toBeVisible();
  await expect(assignDialog).toBeHidden();
  await expect(memberRow()).toContainText(OWN_REVIEWER);
  await expect(membersTable.getByRole('checkbox', { name: `Select ${member.mark}` })).not.toBeChecked();
  // Filtered by that reviewer (the filter's own select), the level's failing members are the one just assigned
  // (and any the reviewer had already).
  const hers = (await json<MembersPage>(manager, `${api}/members?level=${levelId}&verdict=fail&reviewer=${priyaId}&pageSize=100`)).items;
  expect(hers.map((m) => m.mark)).toContain(member.mark);
  await tick(manager, manager.getByRole('combobox', { name: 'Reviewer', exact: true }), new RegExp(`^${OWN_REVIEWER} · `));
  await expect(manager).toHaveURL(new RegExp(`reviewer=${priyaId}`));
  await expect(manager.getByText(`${hers.length} match the filters`)).toBeVisible();
  await expect(membersTable.locator('tr.ant-table-row')).toHaveCount(hers.length);
  await expect(memberRow()).toContainText(OWN_REVIEWER);
  await shot(manager, '02b-member-reviewer');

  // The Member screen says who reviews it and why, and hands it back to the level's reviewer.
  await memberRow().getByRole('link', { name: member.mark, exact: true }).click();
  await expect(manager.getByRole('heading', { name: member.mark })).toBeVisible();
  const reviewerFact = manager.locator('.ant-descriptions-item-label', { hasText: /^Reviewer$/ }).locator('xpath=following-sibling::*[1]');
  await expect(reviewerFact).toHaveText(`${OWN_REVIEWER} (its own assignment)`);
  await manager.getByRole('button', { name: 'Assign reviewer' }).click();
  const backDialog = manager.getByRole('dialog', { name: `Reviewer of ${member.mark}` });
  await expect(backDialog.getByRole('combobox', { name: `Reviewer of ${member.mark}` }).locator('xpath=ancestor::div[contains(@class,"ant-select")][1]')).toContainText(OWN_REVIEWER);
  await pick(manager, backDialog.getByRole('combobox', { name: `Reviewer of ${member.mark}` }), /^Their level.s or the schedule.s reviewer$/);
  await backDialog.getByRole('button', { name: 'Assign' }).click();
  await expect(manager.getByText(`${member.mark} follows the level's or the schedule's reviewer again.`)).toBeVisible();
  await expect(backDialog).toBeHidden();
  await expect(reviewerFact).toHaveText(`${REVIEWER} (assigned to ${levelName})`);
  await shot(manager, '02c-member-back-to-level');
  await manager.goto(`${projectUrl}/overview`);
  await expect(levels.locator('tbody tr.ant-table-row').first()).toBeVisible();

  // ---- The checker raises a flag on a failing member of the level, for the engineer.
  const checker = await signedIn(browser, CHECKER.email);
  await checker.goto(`${projectUrl}/members/${encodeURIComponent(member.mark)}`);
  await expect(checker.getByRole('heading', { name: member.mark })).toBeVisible();
  await checker.getByRole('button', { name: 'Raise flag' }).click();
  const raise = checker.getByRole('dialog');
  await raise.getByLabel('Comment').fill(`Over its limit on ${levelName}; please look at the section (${stamp}).`);
  await pick(checker, raise.getByRole('combobox', { name: 'Assignee' }), new RegExp(ENGINEER.name));
  await raise.getByRole('button', { name: 'Raise flag' }).click();
  await expect(raise).toBeHidden();
  const flagLink = checker.getByRole('region', { name: `Flags of ${member.mark}` }).getByRole('link').filter({ hasText: member.mark }).first();
  await expect(flagLink).toBeVisible();
  const flagHref = (await flagLink.getAttribute('href'))!;

  // The overview counts the new open flag on the level.
  await manager.reload();
  const levelRow = levels.getByRole('row', { name: new RegExp(`^${levelName}\\b`) }).first();
  await expect(levelRow.getByRole('link', { name: `Open: ${target.flagsOpen + 1} (${levelName})` })).toBeVisible();
  const chartSays = (open: number, answered: number, closed: number, waived: number) =>
    expect(chart).toHaveAttribute('aria-label', new RegExp(`${open} open, ${answered} answered, ${closed} closed, ${waived} waived\\.$`));
  await chartSays(chartBefore[0] + 1, chartBefore[1], chartBefore[2], chartBefore[3]);
  await expect(levelRow.getByRole('button', { name: `Sign off ${levelName}` })).toHaveCount(0); // managers do not sign off

  // ---- The engineer finds the e-mail in the Mailbox, follows it and answers.
  const engineer = await signedIn(browser, ENGINEER.email);
  await engineer.goto('/dev/mailbox');
  const mail = engineer.getByText(`Flag on ${member.mark} assigned to you (Halvercote Yard)`).first();
  await expect(mail).toBeVisible();
  await mail.click();
  await expect(engineer.getByText(new RegExp(`${CHECKER.name} raised a flag`)).first()).toBeVisible();
  await expect(engineer.getByText(flagHref.split('/').pop()!, { exact: false }).first()).toBeVisible();
  await shot(engineer, '03-mailbox');
  await engineer.goto(flagHref);
  const answer = engineer.getByRole('form', { name: 'Answer the flag' });
  await answer.getByLabel('Answer').fill(`Deeper section in the next revision; the required I is met (${stamp}).`);
  await answer.getByRole('button', { name: 'Send answer' }).click();
  await expect(engineer.getByText('Answered', { exact: true }).first()).toBeVisible();
  await engineer.context().close();

  await manager.reload();
  await expect(levelRow.getByRole('link', { name: `Open: ${target.flagsOpen} (${levelName})` })).toBeVisible();
  await expect(levelRow.getByRole('link', { name: `Answered: ${target.flagsAnswered + 1} (${levelName})` })).toBeVisible();
  await chartSays(chartBefore[0], chartBefore[1] + 1, chartBefore[2], chartBefore[3]);

  // ---- The checker closes it, then signs the level off (nothing on it waits any more).
  await checker.goto(flagHref);
  const tab = checker.getByRole('tab', { name: /Close/ });
  if (await tab.count()) await tab.click();
  const close = checker.getByRole('form', { name: 'Close the flag' });
  await close.getByLabel('Comment (optional)').fill('Accepted.');
  await close.getByRole('button', { name: 'Close flag' }).click();
  await expect(checker.getByText('Closed', { exact: true }).first()).toBeVisible();

  await checker.goto(`${projectUrl}/overview`);
  const checkerLevels = checker.getByRole('table', { name: 'Per level' });
  const checkerRow = checkerLevels.getByRole('row', { name: new RegExp(`^${levelName}\\b`) }).first();
  const signOff = checkerRow.getByRole('button', { name: `Sign off ${levelName}` });
  if (target.flagsOpen + target.flagsAnswered === 0) {
    await signOff.click();
    await checker.getByRole('textbox', { name: `Comment on the sign-off of ${levelName}` }).fill(`All failing members of ${levelName} reviewed (${stamp}).`);
    await checker.getByRole('button', { name: `Confirm the sign-off of ${levelName}` }).click();
    await expect(checker.getByText(`${levelName} is signed off.`)).toBeVisible();
    await expect(checkerRow.getByText('Signed off', { exact: true })).toBeVisible();
    await shot(checker, '04-signed-off');
  }
  await checker.context().close();

  // ---- The manager sees the counts and the chart move.
  const after = await json<ProjectOverview>(manager, `${api}/overview`);
  await manager.reload();
  await expect(levelRow.getByRole('link', { name: `Open: ${target.flagsOpen} (${levelName})` })).toBeVisible();
  await expect(levelRow.getByRole('link', { name: `Answered: ${target.flagsAnswered} (${levelName})` })).toBeVisible();
  await expect(levelRow.getByRole('link', { name: `Closed: ${target.flagsClosed + 1} (${levelName})` })).toBeVisible();
  const afterLevel = after.levels.find((l) => l.level?.id === levelId)!;
  expect(afterLevel.flagsTotal).toBe(target.flagsTotal + 1);
  expect(after.totals.flagsClosed).toBe(before.totals.flagsClosed + 1);
  await expect(manager.getByLabel('Totals')).toContainText(`Closed${after.totals.flagsClosed}`);
  // The chart's last day: the raised flag came and went, so one more closed and the rest as before.
  await chartSays(chartBefore[0], chartBefore[1], chartBefore[2] + 1, chartBefore[3]);
  const series = await json<{ points: { open: number; answered: number; closed: number; waived: number }[] }>(manager, `${api}/overview/flags-over-time?days=30`);
  const today = series.points[series.points.length - 1];
  expect([today.open, today.answered, today.closed, today.waived]).toEqual([after.totals.flagsOpen, after.totals.flagsAnswered, after.totals.flagsClosed, after.totals.flagsWaived]);
  if (target.flagsOpen + target.flagsAnswered === 0) await expect(levelRow.getByText('Signed off', { exact: true })).toBeVisible();
  await shot(manager, '05-after-close');

  // ---- The printable status report: the same counts, printed to PDF by the browser.
  await manager.goto(`${projectUrl}/overview/report`);
  const report = manager.getByRole('main', { name: 'Status report' });
  await expect(report.getByRole('heading', { name: /^Status report: Halvercote Yard/ })).toBeVisible();
  await expect(report.getByRole('table', { name: 'Per level' }).getByRole('row', { name: new RegExp(`^${levelName}\\b`) }).first()).toContainText(REVIEWER);
  await expect(report.getByRole('img', { name: /^Flags over time\./ })).toBeVisible();
  await shot(manager, '06-report');
  await manager.emulateMedia({ media: 'print' });
  // As printed: no buttons, white page.
  await expect(report.getByRole('button', { name: /Print or save as PDF/ })).toBeHidden();
  await shot(manager, '07-report-as-printed');
  await manager.pdf({ path: path.join(ARTIFACTS, 'overview-report.pdf'), landscape: true, format: 'A4', printBackground: true });
  await manager.context().close();
});
