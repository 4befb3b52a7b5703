// Filter menus whose choice lives in the address: quick arrow-key presses on a focused <select>
// must all count, even while the navigation each one starts is still waiting for the page's
// data (the Field Library's route loads its results before the address changes).
import { describe, expect, test } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import { signIn, useBrowser } from './browser';

const WAIT = { timeout: 20_000 };
const chromium = useBrowser();

async function freshPage(): Promise<Page> {
  const page = await chromium.newPage();
  // Each answer is held back a little, as on a slow rural connection, so that the presses below
  // come while the navigation they start is still under way.
  await page.route('**/api/**', async (route) => {
    await new Promise((r) => setTimeout(r, 400));
    await route.continue();
  });
  return page;
}

/** Focuses the select and presses the key `times` times with no wait between. */
async function pressQuickly(page: Page, select: string, key: string, times: number): Promise<void> {
  await page.locator(select).focus();
  for (let i = 0; i < times; i += 1) await page.keyboard.press(key);
}

/** The choice reaches the address, stays there once every navigation has finished, and shows. */
async function expectSettlesOn(page: Page, stage: Locator, value: string | null): Promise<void> {
  await expect.poll(() => new URL(page.url()).searchParams.get('stage'), WAIT).toBe(value);
  await page.waitForTimeout(1500);
  expect(new URL(page.url()).searchParams.get('stage')).toBe(value);
  expect(await stage.inputValue()).toBe(value);
}

describe('filter menus driven quickly from the keyboard', () => {
  test('when a visitor presses ArrowDown three times quickly on the Field Library stage menu, then the third stage is chosen, shown and in the address', async () => {
    const page = await freshPage();
    await page.goto('/library');
    const stage = page.getByLabel('Stage', { exact: true });
    await stage.waitFor(WAIT);
    const third = await stage.locator('option').nth(3).getAttribute('value');
    await pressQuickly(page, 'select[id$="-stage"]', 'ArrowDown', 3);
    await expectSettlesOn(page, stage, third);
  });

  test('when the demo mentor presses ArrowDown twice quickly on the rounds stage menu, then the second stage is chosen, shown and in the address', async () => {
    const page = await freshPage();
    await signIn(page, 'mentor@example.test');
    await expect.poll(() => new URL(page.url()).pathname, WAIT).not.toBe('/sign-in');
    await page.goto('/rounds');
    const menu = page.getByRole('button', { name: /Filters and order/ });
    if (await menu.isVisible()) await menu.click();
    const stage = page.getByLabel('Stage', { exact: true });
    await stage.waitFor(WAIT);
    const second = await stage.locator('option').nth(2).getAttribute('value');
    await pressQuickly(page, '[aria-label="Filter the rounds"] select[id$="-stage"]', 'ArrowDown', 2);
    await expectSettlesOn(page, stage, second);
  });
});
