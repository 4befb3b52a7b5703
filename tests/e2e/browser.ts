// Debian's Chromium driven by playwright-core, with the flags this machine needs.
import fs from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, inject } from 'vitest';

export const CHROMIUM = process.env.CHROME_PATH ?? '/usr/bin/chromium';
export const SCREENSHOTS = path.resolve('test-results/screenshots');

export async function launch(): Promise<Browser> {
  // playwright-core gives every launch a fresh, empty profile folder of its own.
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      '--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update',
      '--disable-sync', '--no-first-run', '--disable-quic',
    ],
  });
}

export const PHONE = { viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true };
export const DESKTOP = { viewport: { width: 1280, height: 800 } };

export function baseUrl(): string {
  return inject('baseUrl');
}

export async function newContext(browser: Browser, device: typeof PHONE | typeof DESKTOP = DESKTOP): Promise<BrowserContext> {
  return browser.newContext({ ...device, baseURL: baseUrl() });
}

/**
 * One browser for a test file, launched before its tests and closed after them with every page
 * it opened: `newPage(device)` gives a page in a fresh context (its own cookies).
 */
export function useBrowser(): {
  newPage(device?: typeof PHONE | typeof DESKTOP): Promise<Page>;
  /** a fresh context (its own cookies), closed with the others after the file's tests */
  newContext(device?: typeof PHONE | typeof DESKTOP): Promise<BrowserContext>;
  /** the browser itself, for helpers that open contexts of their own */
  browser(): Browser;
} {
  let browser: Browser | undefined;
  const contexts: BrowserContext[] = [];
  beforeAll(async () => {
    browser = await launch();
  });
  afterAll(async () => {
    for (const context of contexts) await context.close();
    await browser?.close();
  });
  const started = (): Browser => {
    if (!browser) throw new Error('useBrowser(): the browser starts in beforeAll; ask for pages inside tests.');
    return browser;
  };
  const tracked = async (device: typeof PHONE | typeof DESKTOP) => {
    const context = await newContext(started(), device);
    contexts.push(context);
    return context;
  };
  return {
    async newPage(device = DESKTOP) {
      return (await tracked(device)).newPage();
    },
    newContext: (device = DESKTOP) => tracked(device),
    browser: started,
  };
}

export async function shot(page: Page, name: string): Promise<void> {
  fs.mkdirSync(SCREENSHOTS, { recursive: true });
  await page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`), fullPage: true });
}

export async function signIn(page: Page, email: string, password = 'sporewell-demo'): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
}

const AXE_SOURCE: string = createRequire(import.meta.url)('axe-core').source;

/** Serious and critical axe findings on the page as it is now, as "rule (how many nodes)". */
export async function axeProblems(page: Page): Promise<string[]> {
  // Evaluated through the debugging protocol: the page's CSP rightly refuses inline scripts.
  await page.evaluate(AXE_SOURCE);
  return page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: () => Promise<{ violations: Array<{ id: string; impact: string | null; nodes: unknown[] }> }> } }).axe;
    const { violations } = await axe.run();
    return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id} (${v.nodes.length})`);
  });
}
