// Small pieces the whole-journey test needs that browser.ts does not have: numbered screenshots
// in a folder of their own, the main menu on any width, the local mail catcher read as the demo
// steward, and photos made on the spot.
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { expect } from 'vitest';
import { request, type APIRequestContext, type Page } from 'playwright-core';
import { baseUrl, SCREENSHOTS } from './browser';

/** `take(page, 'joined')` writes 01-joined.png, the next one 02-…, into test-results/screenshots/<folder>/. */
export function numberedShots(folder: string): { take: (page: Page, name: string) => Promise<void>; onFailure: (pages: Page[]) => Promise<void> } {
  const dir = path.join(SCREENSHOTS, folder);
  fs.rmSync(dir, { recursive: true, force: true });
  fs.mkdirSync(dir, { recursive: true });
  let n = 0;
  return {
    take: async (page, name) => {
      n += 1;
      // Nothing on the screen may push the page sideways (a phone would scroll it left and right).
      const { scrollWidth, innerWidth } = await page.evaluate(() => ({ scrollWidth: document.documentElement.scrollWidth, innerWidth: window.innerWidth }));
      expect(scrollWidth, `${name}: the page is wider than the screen`).toBeLessThanOrEqual(innerWidth);
      // One image pixel per CSS pixel: a phone's double density would make tall pages slow to shoot.
      await page.screenshot({ path: path.join(dir, `${String(n).padStart(2, '0')}-${name}.png`), fullPage: true, scale: 'css' });
    },
    // What each open page showed when the test failed, to read the failure by.
    onFailure: async (pages) => {
      for (const [i, page] of pages.entries()) {
        if (!page.isClosed()) await page.screenshot({ path: path.join(dir, `failed-page-${i + 1}.png`), fullPage: true }).catch(() => undefined);
      }
    },
  };
}

/** Follows a link of the main menu as a person would: on a narrow screen the menu opens first. */
export async function followMainMenu(page: Page, linkName: string): Promise<void> {
  const menuButton = page.getByRole('button', { name: 'Menu', exact: true });
  const bar = page.getByRole('navigation', { name: 'Main' });
  // Until the app has drawn its header, neither is there to decide by.
  await expect.poll(async () => (await menuButton.isVisible()) || (await bar.isVisible()), { timeout: 20_000 }).toBe(true);
  if (await menuButton.isVisible()) await menuButton.click();
  // Only the shown one of the two menus (bar and phone panel) has the role: the other is hidden.
  await bar.getByRole('link', { name: linkName, exact: true }).click();
}

export interface CaughtMail {
  to: string;
  subject: string;
  text: string;
}

/**
 * The local mail catcher, as the demo steward reads it. There is no inbox screen for growers
 * (their mail goes to a real mail server in production), so this stands in for their mailbox.
 */
export interface Mailbox {
  /** waits until a caught mail to `to` matches, and gives its first link whose path matches `link` */
  linkIn(to: string, subject: RegExp, link: RegExp, timeoutMs?: number): Promise<{ mail: CaughtMail; path: string }>;
  dispose(): Promise<void>;
}

export async function openMailbox(email = 'steward@example.test', password = 'sporewell-demo'): Promise<Mailbox> {
  const api: APIRequestContext = await request.newContext({ baseURL: baseUrl() });
  const signedIn = await api.post('/api/auth/login', { data: { email, password } });
  expect(signedIn.status(), 'the demo steward signs in to read the caught mail').toBe(200);
  return {
    async linkIn(to, subject, link, timeoutMs = 20_000) {
      let found: CaughtMail | undefined;
      await expect
        .poll(
          async () => {
            const answer = await api.get('/api/steward/mail?pageSize=100');
            const { items } = (await answer.json()) as { items: CaughtMail[] };
            found = items.find((m) => m.to.includes(to) && subject.test(m.subject));
            return found !== undefined;
          },
          { timeout: timeoutMs, message: `a mail to ${to} with a subject like ${subject}` },
        )
        .toBe(true);
      const url = found!.text.match(/https?:\/\/\S+/g)?.map((u) => new URL(u)).find((u) => link.test(u.pathname));
      expect(url, `a link like ${link} in “${found!.subject}”`).toBeDefined();
      // The link's host is the server's PUBLIC_URL; the browser follows its path on this server.
      return { mail: found!, path: `${url!.pathname}${url!.search}` };
    },
    dispose: () => api.dispose(),
  };
}

/** A photo of the given size and format, noisy enough to look like a real close-up. */
export function samplePhoto(format: 'jpeg' | 'png', width: number, height: number, tint: { r: number; g: number; b: number }): Promise<Buffer> {
  // Noise alone comes out grey whatever the background; the tint gives each photo its colour.
  const image = sharp({ create: { width, height, channels: 3, background: tint, noise: { type: 'gaussian', mean: 110, sigma: 40 } } }).tint(tint);
  return (format === 'jpeg' ? image.jpeg({ quality: 85 }) : image.png()).toBuffer();
}
