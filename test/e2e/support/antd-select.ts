import { expect, test, type Locator, type Page } from '@playwright/test';

/**
 * Picks an option of a single-choice antd Select and waits until the pick has taken: the list closed and the
 * select showing the option. A click on an option can be lost (below): the list then stays open over the dialog's
 * buttons and the select keeps its old value (an assign dialog then skips the flag: "0 flags updated; 1 flag
 * skipped…"). So the pick is tried again until it has taken, and a pick that never takes fails here, not minutes
 * later on a covered button. No Escape afterwards: once the list has closed, Escape closes the whole dialog
 * (antd's layers share one Escape stack).
 *
 * Why a click can be lost: the list is drawn in the page's body while its select sits in the dialog (fixed). When
 * the page behind the dialog scrolls a little (seen: 19 px, just before Playwright's mousedown, likely its scroll
 * into view), the list moves with the page, then re-aligns to its select a frame later. If that falls between
 * Playwright's mousedown and mouseup, the mousedown is on the option, the mouseup on another row or the dialog's
 * wrapper, and the click goes to their common ancestor: nothing is chosen and the list stays open. Playwright
 * checks only the first event's target, so its click "succeeds". Events recorded in the overview journey showed
 * exactly this.
 */
export async function pick(page: Page, select: Locator, text: RegExp): Promise<void> {
  const shown = select.locator('xpath=ancestor::div[contains(@class,"ant-select")][1]');
  let tries = 0;
  const missed: string[] = [];
  await expect(async () => {
    tries += 1;
    try {
      if ((await select.getAttribute('aria-expanded')) !== 'true') await select.click({ timeout: 5_000 });
      await page.locator('.ant-select-dropdown:visible .ant-select-item-option').filter({ hasText: text }).first().click({ timeout: 5_000 });
      await expect(select).toHaveAttribute('aria-expanded', 'false', { timeout: 3_000 });
      await expect(shown).toContainText(text, { timeout: 3_000 });
    } catch (e) {
      missed.push(`${String(e).split('\n')[0]} [shows "${await shown.innerText().catch(() => '?')}", expanded=${await select.getAttribute('aria-expanded').catch(() => '?')}]`);
      throw e;
    }
  }).toPass({ timeout: 45_000 });
  if (tries > 1) {
    // Not hidden: the report's annotations and the log say when a pick needed more than one click, and why.
    const description = `${text} took ${tries} tries: ${missed.join('; ')}`;
    test.info().annotations.push({ type: 'pick repeated', description });
    console.log(`pick repeated: ${description}`);
  }
}

/** Ticks an option of a multiple-choice antd Select (its list stays open), then closes the list with Escape. */
export async function tick(page: Page, select: Locator, text: RegExp): Promise<void> {
  await select.click();
  const option = page.locator('.ant-select-dropdown:visible .ant-select-item-option').filter({ hasText: text }).first();
  await option.click();
  await expect(option).toHaveAttribute('aria-selected', 'true');
  await page.keyboard.press('Escape');
  await expect(select).toHaveAttribute('aria-expanded', 'false');
}
