import { expect, test, type Page } from '@playwright/test';
import path from 'node:path';

/**
 * Journey: an admin signs in, creates a project, invites a person; the person
 * opens the invitation in the Mailbox, sets a password through the link, signs
 * in and sees the project with the right role. Screenshots: test/artifacts/.
 */
const ARTIFACTS = path.join(__dirname, '..', 'artifacts');
const shot = (page: Page, name: string) => page.screenshot({ path: path.join(ARTIFACTS, `foundation-${name}.png`), fullPage: true });

const ADMIN = { email: 'admin@halvercote.example', password: 'halvercote-demo' };
const stamp = Date.now().toString(36);
const invitee = { email: `noor.vasquez.${stamp}@halvercote.example`, name: 'Noor Vasquez', password: 'a-long-new-password-1' };
const projectName = `Brookfen Annex ${stamp}`;

async function signIn(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page).toHaveURL(/\/projects/);
}

test('admin creates a project and invites a checker who signs in', async ({ page }) => {
  await signIn(page, ADMIN.email, ADMIN.password);
  await expect(page.getByText('Halvercote Yard')).toBeVisible();
  await shot(page, '01-projects');

  await page.getByRole('button', { name: /new project/i }).first().click();
  const dialog = page.getByRole('dialog');
  await dialog.getByLabel('Project name').fill(projectName);
  await dialog.getByLabel('Project number').fill('BA-7');
  await shot(page, '02-new-project');
  await dialog.getByRole('button', { name: /create/i }).click();
  await expect(page).toHaveURL(/\/projects\/\d+/);
  await expect(page.getByText(projectName).first()).toBeVisible();

  await page.getByLabel('Project sections').getByText('Team', { exact: true }).click();
  await expect(page).toHaveURL(/\/team/);
  const form = page.getByRole('form', { name: 'Invite someone' });
  await form.getByLabel('E-mail').fill(invitee.email);
  await form.getByLabel('Name (optional)').fill(invitee.name);
  await form.getByLabel('Role').click();
  await page.getByRole('option', { name: /checker/i }).click();
  await form.getByRole('button', { name: /invite/i }).click();
  await expect(page.getByText(`Invitation sent to ${invitee.email}.`)).toBeVisible();
  await expect(page.getByRole('row', { name: new RegExp(invitee.name) })).toContainText(/invited/i);
  await shot(page, '03-team-invited');

  // The Mailbox shows what the app sent; the invitation link is clickable.
  await page.goto('/dev/mailbox');
  const message = page.getByRole('list', { name: 'Messages' }).getByText(invitee.email).first();
  await expect(message).toBeVisible();
  await message.click();
  await shot(page, '04-mailbox');
  const link = page.locator('a[href*="/invitations/"]').first();
  const frameLink = page.frameLocator('iframe').locator('a[href*="/invitations/"]').first();
  const href = (await link.count()) ? await link.getAttribute('href') : await frameLink.getAttribute('href');
  expect(href).toContain('/invitations/');

  // The invitee opens the link in a fresh session.
  await page.context().clearCookies();
  await page.goto(href!);
  await expect(page.getByText(projectName).first()).toBeVisible();
  await page.getByLabel('Your name').fill(invitee.name);
  await page.getByLabel('Password', { exact: true }).fill(invitee.password);
  await page.getByLabel('Confirm password').fill(invitee.password);
  await shot(page, '05-invitation');
  await page.getByRole('button', { name: /set password|accept|continue/i }).click();
  await expect(page.getByText(/password set/i).first()).toBeVisible();

  // Using the link again is refused.
  await page.goto(href!);
  await expect(page.getByText(/already been used|used/i).first()).toBeVisible();

  await signIn(page, invitee.email, invitee.password);
  const card = page.getByText(projectName).first();
  await expect(card).toBeVisible();
  await expect(page.getByText('Halvercote Yard')).toHaveCount(0);
  await expect(page.getByRole('main').first()).toContainText(/checker/i);
  await shot(page, '06-invitee-projects');
  await card.click();
  await expect(page).toHaveURL(/\/projects\/\d+/);
  await expect(page.getByRole('main').first()).toContainText(/checker/i);
  await shot(page, '07-invitee-project');
});
