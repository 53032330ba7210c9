import { expect, test, type Locator, type Page } from '@playwright/test';
import path from 'node:path';

/**
 * The Limit sets screen in the browser: the demo manager copies a preset
 * into Halvercote Yard, makes its floor live-load ratio stricter, uses it
 * after the confirmation, sees verdicts flip (on this screen and on the
 * Members screen), then puts the original set back so later journeys see
 * the demo's verdicts. Screenshots: test/artifacts/limit-sets-*.png.
 */
const ARTIFACTS = path.join(__dirname, '..', 'artifacts');
/** The screen as a person sees it (the page is long: the part around `at`, else the top). */
async function shot(page: Page, name: string, at?: Locator) {
  if (at) {
    await at.scrollIntoViewIfNeeded();
    // Leave room for the sticky top bar.
    await page.evaluate(() => window.scrollBy(0, -80));
  } else await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(ARTIFACTS, `limit-sets-${name}.png`) });
}

const stamp = Date.now().toString(36);

const MANAGER = { email: 'mireille.fontaine@halvercote.example', password: 'halvercote-demo' };

async function signIn(page: Page) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(MANAGER.email);
  await page.getByLabel('Password').fill(MANAGER.password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page).toHaveURL(/\/projects/);
}

/** "Revision N: M members, P passing, F failing, …" of the set-in-use card. */
async function failing(card: Locator): Promise<number> {
  const text = await card.getByText(/^Revision \d+: \d+ members/).innerText();
  return Number(text.match(/(\d+) failing/)![1]);
}

test('a manager copies a preset, makes a ratio stricter, uses it and sees verdicts change; then restores the original set', async ({ page }) => {
  await signIn(page);
  await page.getByText('Halvercote Yard').first().click();
  await expect(page).toHaveURL(/\/projects\/\d+/);
  const projectUrl = page.url().match(/\/projects\/\d+/)![0];
  await page.getByLabel('Project sections').getByText('Limit sets', { exact: true }).click();
  await expect(page).toHaveURL(/\/limit-sets$/);

  const inUse = page.locator('.ant-card').filter({ has: page.getByText(/^In use: /) }).first();
  await expect(inUse.getByRole('table', { name: /^Rules of / })).toBeVisible();
  const originalName = (await inUse.getByText(/^In use: /).innerText()).replace(/^In use: /, '');
  await expect(inUse.getByText('verdicts follow this set')).toBeVisible();
  await expect(inUse.getByText('Table 1604.3, floor members, L column').first()).toBeVisible();
  await expect(page.getByText(/does not replace the engineer of record's judgement/).first()).toBeVisible();
  const before = await failing(inUse);
  await shot(page, '01-in-use');

  // ---- Copy the US preset (IBC 2021 with ACI 318-19 for the concrete transfer beams) into the project.
  const presetSelect = page.getByRole('combobox', { name: 'Preset' });
  // The drop-down opens with an animation: try again until the choice took.
  await expect(async () => {
    await presetSelect.click();
    await page.locator('.ant-select-dropdown:visible .ant-select-item-option').filter({ hasText: /^US building/ }).click({ timeout: 2000 });
    await expect(page.getByRole('table', { name: /Rules of the preset US building/ })).toBeVisible({ timeout: 2000 });
  }).toPass({ timeout: 20_000 });
  await page.getByRole('button', { name: 'Copy into project' }).click();
  await expect(page.getByText(/^Copied the preset "US building: IBC 2021 \+ ACI 318-19" into the project as/)).toBeVisible();
  const form = page.getByRole('form', { name: /^Edit US building: IBC 2021 \+ ACI 318-19 \(project copy\)/ });
  await expect(form).toBeVisible();

  // ---- A bad edit is refused in the form, then the floor live-load ratio goes from 360 to 900.
  const checks = await form.locator('input[aria-label^="Check of rule"]').evaluateAll((inputs) => inputs.map((i) => (i as HTMLInputElement).value));
  const n = checks.indexOf('L/360 live') + 1;
  expect(n).toBeGreaterThan(0);
  const ratio = form.getByRole('spinbutton', { name: `Ratio of rule ${n}`, exact: true });
  await ratio.fill('');
  await form.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(form.getByText('Give n of span/n, e.g. 360.')).toBeVisible();
  // A name of its own: the cluster of a local run may keep copies of earlier runs.
  const name = `Halvercote floors, stricter ${stamp}`;
  await form.getByRole('textbox', { name: 'Name', exact: true }).fill(name);
  await form.getByRole('textbox', { name: `Check of rule ${n}`, exact: true }).fill('L/900 live (basis of design)');
  await ratio.fill('900');
  await form.getByRole('textbox', { name: `Source document of rule ${n}`, exact: true }).fill('Halvercote Yard basis of design');
  await form.getByRole('textbox', { name: `Source edition of rule ${n}`, exact: true }).fill('Issue B');
  await form.getByRole('textbox', { name: `Source clause of rule ${n}`, exact: true }).fill('§4.2 floors under sensitive finishes');
  await shot(page, '02-editing', form.getByRole('textbox', { name: `Check of rule ${n}`, exact: true }));
  await form.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByText(`"${name}" is saved.`)).toBeVisible();

  // ---- Use it: the confirmation says the verdicts will be recomputed.
  const copyPanel = page.locator('.ant-collapse-item').filter({ hasText: name });
  await copyPanel.getByRole('button', { name: 'Use this set', exact: true }).click();
  const dialog = page.getByRole('dialog');
  await expect(dialog.getByText(/will be recomputed under its rules/)).toBeVisible();
  await shot(page, '03-confirm');
  await dialog.getByRole('button', { name: 'Use this set and recompute' }).click();
  const done = page.getByText(`now follows "${name}".`, { exact: false });
  await expect(done).toBeVisible();
  const summary = await page.getByText(/members recomputed: \d+ → \d+ failing/).innerText();
  const [, from, to, flipped] = summary.match(/(\d+) → (\d+) failing, (\d+) verdicts? flipped/)!.map(Number);
  expect(from).toBe(before);
  expect(to).toBeGreaterThan(from);
  expect(flipped).toBe(to - from);
  const firstFlip = summary.match(/flipped: (\S+) pass → fail/)![1];
  await expect(page.locator('.ant-card').filter({ has: page.getByText(`In use: ${name}`) }).getByText('L/900 live (basis of design)').first()).toBeVisible();
  expect(await failing(page.locator('.ant-card').filter({ has: page.getByText(/^In use: /) }).first())).toBe(to);
  await shot(page, '04-used');

  // ---- The Members screen follows: the flipped member fails its new check.
  await page.goto(`${projectUrl}/members/${encodeURIComponent(firstFlip)}`);
  await expect(page.getByText('L/900 live (basis of design)').first()).toBeVisible();
  await shot(page, '05-member', page.getByText('L/900 live (basis of design)').first());
  await page.goto(`${projectUrl}/members?verdict=fail`);
  await expect(page.getByRole('table', { name: 'Members' }).locator('tbody tr.ant-table-row').first()).toBeVisible();
  await shot(page, '06-members-failing');

  // ---- Put the original set back: the demo's verdicts return.
  await page.goto(`${projectUrl}/limit-sets`);
  const original = page.locator('.ant-collapse-item').filter({ has: page.getByText(originalName, { exact: true }) }).first();
  await original.getByRole('button', { name: 'Use this set', exact: true }).click();
  await page.getByRole('dialog').getByRole('button', { name: 'Use this set and recompute' }).click();
  await expect(page.getByText(new RegExp(`now follows "${originalName.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}"`))).toBeVisible();
  expect(await failing(page.locator('.ant-card').filter({ has: page.getByText(/^In use: /) }).first())).toBe(before);
});

test('a viewer reads the limit sets and their sources but gets no way to change them', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill('dalia.stroud@halvercote.example');
  await page.getByLabel('Password').fill(MANAGER.password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page).toHaveURL(/\/projects/);
  await page.getByText('Halvercote Yard').first().click();
  await page.getByLabel('Project sections').getByText('Limit sets', { exact: true }).click();
  await expect(page).toHaveURL(/\/limit-sets$/);
  await expect(page.getByText(/^In use: /)).toBeVisible();
  await expect(page.getByText(/Managers and admins copy, edit, choose and delete limit sets/)).toBeVisible();
  await expect(page.getByText('Table 1604.3, floor members, L column').first()).toBeVisible();
  for (const name of ['Edit rules', 'Use this set', 'Copy into project', 'Copy', 'Delete']) {
    await expect(page.getByRole('button', { name, exact: true })).toHaveCount(0);
  }
  await shot(page, '07-viewer');
});
