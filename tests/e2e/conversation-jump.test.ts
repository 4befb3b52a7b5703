// The conversation sits below the case, its photos and the batches like it, so on a phone it is
// a long way down. A grower told of a mentor's reply (the header's "new" list, or the reply
// e-mail's link, which carries #conversation) lands at the newest messages and the composer, and
// the case header's "Go to the conversation" does the same from the top of the page. A mentor's
// rounds say how many messages wait on a case they hold, and that link goes there too. Each test
// makes its own grower, mentor and case, so the demo cases stay as seeded.
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { baseUrl, DESKTOP, launch, newContext, PHONE, shot } from './browser';
import { freshPerson, signInByApi } from './fresh-people';

const LIVE = { timeout: 10_000 };

let browser: Browser;

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const JSON_CALL = () => ({ Origin: baseUrl(), 'Content-Type': 'application/json' });

/** A case opened by the grower signed in to `context`, its title made unique to this run. */
async function openCase(context: BrowserContext, data: { title: string; stage: string; symptoms: string[]; description: string }) {
  const opened = await context.request.post('/api/cases', {
    headers: JSON_CALL(),
    data: { ...data, title: `${data.title} ${crypto.randomBytes(3).toString('hex')}` },
  });
  expect(opened.status()).toBe(201);
  return (await opened.json()) as { id: number; title: string };
}

/** Whether the whole of an element is inside the window (not merely in the page). */
async function whollyOnScreen(page: Page, target: Locator): Promise<boolean> {
  const box = await target.boundingBox();
  const size = page.viewportSize();
  if (!box || !size) return false;
  return box.y >= 0 && box.y + box.height <= size.height + 1;
}

describe('going to the conversation', () => {
  for (const [name, device] of [
    ['desktop', DESKTOP],
    ['phone', PHONE],
  ] as const) {
    test(`when a grower on a ${name} follows a mentor's reply from the header's new-message list, then the page opens at the newest messages and the composer, and the case header's link goes back there`, async () => {
      const grower = await freshPerson(browser, 'grower', 'Perrin');
      const mentor = await freshPerson(browser, 'mentor', 'Odile');

      // The grower's case and the mentor's reply, made through the API in a context of their own.
      const setup = await newContext(browser);
      await signInByApi(setup, grower.email, grower.password);
      const { id, title } = await openCase(setup, {
        title: 'LAB serum gone ropey',
        stage: 'LAB',
        symptoms: ['slimy', 'smell-sour'],
        description: 'The whey turned thick and stringy overnight and it smells sharper than last time.',
      });
      await setup.request.post('/api/auth/logout', { headers: JSON_CALL() });
      await signInByApi(setup, mentor.email, mentor.password);
      expect((await setup.request.post(`/api/cases/${id}/claim`, { headers: JSON_CALL() })).status()).toBe(200);
      const reply = 'Stringy whey is common when it sat warm. Does it still smell sour rather than rotten?';
      const posted = await setup.request.post(`/api/cases/${id}/messages`, {
        headers: JSON_CALL(),
        data: { clientId: crypto.randomBytes(16).toString('hex'), body: reply, kind: 'text' },
      });
      expect(posted.status()).toBe(201);
      await setup.close();

      const context = await newContext(browser, device);
      await signInByApi(context, grower.email, grower.password);
      const page = await context.newPage();
      await page.goto('/batches');
      // The shelf's list of cases says so too, and its link goes to the conversation.
      const listed = page.getByRole('link', { name: `${title} 1 new message`, exact: true });
      await listed.waitFor(LIVE);
      expect(await listed.getAttribute('href')).toBe(`/cases/${id}#conversation`);
      const badge = page.getByRole('button', { name: /new message in your cases/ }).locator('visible=true');
      await badge.click(LIVE);
      await page.getByRole('link', { name: new RegExp(`^${title}\\s*1 new$`) }).click(LIVE);
      await page.waitForURL(`**/cases/${id}#conversation`, LIVE);

      const composer = page.getByRole('textbox', { name: `Write to ${mentor.displayName.split(' ')[0]}` });
      const newest = page.getByRole('log', { name: 'Messages' }).getByText(reply, { exact: true });
      await composer.waitFor(LIVE);
      await expect.poll(() => whollyOnScreen(page, composer), LIVE).toBe(true);
      await expect.poll(() => whollyOnScreen(page, newest), LIVE).toBe(true);
      // Keyboard users start there too.
      expect(await page.evaluate(() => document.activeElement?.id)).toBe('conversation');
      await shot(page, `conversation-jump-${name}`);

      // From the top of the page, the header's link goes down to the same place.
      await page.evaluate(() => window.scrollTo({ top: 0 }));
      await expect.poll(() => whollyOnScreen(page, composer)).toBe(false);
      await page.getByRole('link', { name: 'Go to the conversation', exact: true }).click();
      await expect.poll(() => whollyOnScreen(page, composer), LIVE).toBe(true);
      await expect.poll(() => whollyOnScreen(page, newest), LIVE).toBe(true);

      // Opened afresh at the reply e-mail's link, the page goes there once the thread is in.
      await page.goto('about:blank');
      await page.goto(`/cases/${id}#conversation`);
      await composer.waitFor(LIVE);
      await expect.poll(() => whollyOnScreen(page, composer), LIVE).toBe(true);
      await expect.poll(() => whollyOnScreen(page, newest), LIVE).toBe(true);

      // Opened without the anchor (from the shelf, the rounds), the case starts at its top.
      await page.goto(`/cases/${id}`);
      await page.getByRole('heading', { level: 1, name: title }).waitFor(LIVE);
      await composer.waitFor(LIVE);
      expect(await page.evaluate(() => window.scrollY)).toBe(0);
      await context.close();
    });

    test(`when a grower writes on a case a mentor on a ${name} holds, then the mentor's rounds say so on the case and that link opens the conversation, while the case's own link still opens it at the top`, async () => {
      const grower = await freshPerson(browser, 'grower', 'Linnea');
      const mentor = await freshPerson(browser, 'mentor', 'Caspar');
      const setup = await newContext(browser);
      await signInByApi(setup, grower.email, grower.password);
      const { id, title } = await openCase(setup, {
        title: 'IMO3 bed crusting over',
        stage: 'IMO3',
        symptoms: ['dry-crusty', 'colour-white'],
        description: 'The top of the bran bed went hard and pale in two days under the tarp.',
      });
      const m = await newContext(browser, device);
      await signInByApi(m, mentor.email, mentor.password);
      expect((await m.request.post(`/api/cases/${id}/claim`, { headers: JSON_CALL() })).status()).toBe(200);
      const page = await m.newPage();
      await page.goto('/rounds?mine=1');
      const caseLink = page.getByRole('link', { name: title, exact: true }).locator('visible=true');
      await caseLink.waitFor(LIVE);
      const fresh = page.getByRole('link', { name: '2 new messages in this conversation', exact: true }).locator('visible=true');
      expect(await fresh.count()).toBe(0);

      // The grower writes twice; the rounds, already open, learn of it without a reload.
      const words = ['I wet it again this morning.', 'It is crusting again already, and a little white on top.'];
      for (const body of words) {
        const posted = await setup.request.post(`/api/cases/${id}/messages`, {
          headers: JSON_CALL(),
          data: { clientId: crypto.randomBytes(16).toString('hex'), body, kind: 'text' },
        });
        expect(posted.status()).toBe(201);
      }
      await setup.close();
      await fresh.waitFor(LIVE);
      // The row's last message follows as well.
      await page.getByText(words[1], { exact: true }).locator('visible=true').waitFor(LIVE);
      expect(await fresh.getAttribute('href')).toBe(`/cases/${id}#conversation`);
      expect(await caseLink.getAttribute('href')).toBe(`/cases/${id}`);
      await shot(page, `rounds-new-messages-${name}`);
      await fresh.click();
      await page.waitForURL(`**/cases/${id}#conversation`, LIVE);
      const composer = page.getByRole('textbox', { name: `Write to ${grower.displayName.split(' ')[0]}` });
      const newest = page.getByRole('log', { name: 'Messages' }).getByText(words[1], { exact: true });
      await composer.waitFor(LIVE);
      await expect.poll(() => whollyOnScreen(page, composer), LIVE).toBe(true);
      await expect.poll(() => whollyOnScreen(page, newest), LIVE).toBe(true);

      // Read now: back on the rounds, the case no longer says so.
      await page.goto('/rounds?mine=1');
      await caseLink.waitFor(LIVE);
      await expect.poll(() => fresh.count(), LIVE).toBe(0);
      await m.close();
    });
  }
});
