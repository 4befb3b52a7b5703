// Curating the Field Library in the browser: the demo steward, on a field note's page, takes the
// note out with a reason; visitors no longer find it; the case page says who took it out and why,
// to the steward (who can put it back) and to the grower, who is mailed the reason. The note is
// made for the test by a fresh grower and mentor, so the demo notes stay as seeded.
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Browser, BrowserContext } from 'playwright-core';
import { baseUrl, DESKTOP, launch, newContext, PHONE, shot } from './browser';
import { freshPerson, signInByApi, type FreshPerson } from './fresh-people';
import { openMailbox } from './journey-helpers';

const LIVE = { timeout: 15_000 };
const JSON_CALL = { Origin: baseUrl(), 'Content-Type': 'application/json' };

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function as(person: FreshPerson | string): Promise<BrowserContext> {
  const context = await newContext(browser);
  if (typeof person === 'string') await signInByApi(context, person);
  else await signInByApi(context, person.email, person.password);
  return context;
}

/** A case opened, closed and reported with consent through the API: its field note is published. */
async function publishedNote(): Promise<{ caseId: number; slug: string; title: string; grower: FreshPerson }> {
  const grower = await freshPerson(browser, 'grower', 'Tamsin');
  const mentor = await freshPerson(browser, 'mentor', 'Bram');
  const title = `Quince FFJ frothing in the shed ${crypto.randomBytes(3).toString('hex')}`;
  const g = await as(grower);
  const opened = await g.request.post('/api/cases', {
    headers: JSON_CALL,
    data: { title, stage: 'FFJ', symptoms: ['bubbling', 'smell-alcoholic'], description: 'Quince and sugar, day 5, frothing and smelling of cider.' },
  });
  expect(opened.status()).toBe(201);
  const { id: caseId } = (await opened.json()) as { id: number };
  const m = await as(mentor);
  expect((await m.request.post(`/api/cases/${caseId}/claim`, { headers: JSON_CALL })).status()).toBe(200);
  const closed = await m.request.post(`/api/cases/${caseId}/close`, {
    headers: JSON_CALL,
    data: { cause: 'too-warm', remedy: 'move-cooler', summary: 'A warm shed made the quince juice froth; somewhere cooler it settled.', askToPublish: true },
  });
  expect(closed.status()).toBe(200);
  const reported = await g.request.post(`/api/cases/${caseId}/recovery-report`, {
    headers: JSON_CALL,
    data: { outcome: 'recovered', stars: 4, consentToPublish: true },
  });
  expect(reported.status()).toBe(201);
  const { noteSlug } = (await reported.json()) as { noteSlug: string | null };
  expect(noteSlug).toBeTruthy();
  await Promise.all([g.close(), m.close()]);
  return { caseId, slug: noteSlug!, title, grower };
}

describe('a steward curating the Field Library', () => {
  for (const [name, device] of [
    ['desktop', DESKTOP],
    ['phone', PHONE],
  ] as const) {
    test(`when the steward on a ${name} takes a field note out with a reason, then visitors no longer find it, the case says who and why, and the steward can put it back`, async () => {
      const { caseId, slug, title, grower } = await publishedNote();
      const reason = 'It names the lane the shed is on.';
      const visitorStatus = async () => {
        const visitor = await newContext(browser);
        const status = (await visitor.request.get(`/api/library/${slug}`)).status();
        await visitor.close();
        return status;
      };
      expect(await visitorStatus()).toBe(200);

      const context = await newContext(browser, device);
      await signInByApi(context, 'steward@example.test');
      const page = await context.newPage();
      await page.goto(`/library/${slug}`);
      const panel = page.getByRole('region', { name: 'For stewards' });
      await panel.getByRole('button', { name: 'Take it out of the library' }).click(LIVE);
      const dialog = page.getByRole('dialog', { name: 'Take this note out of the Field Library' });
      // Without a reason it does not go.
      await dialog.getByRole('button', { name: 'Take it out', exact: true }).click();
      await dialog.getByText('Say in a few words why the note comes out of the library.').waitFor(LIVE);
      await dialog.getByLabel('Why does it come out?').fill(reason);
      await shot(page, `library-take-down-dialog-${name}`);
      await dialog.getByRole('button', { name: 'Take it out', exact: true }).click();
      await page.getByText('This note is out of the Field Library').waitFor(LIVE);
      expect(await visitorStatus()).toBe(404);
      await shot(page, `library-take-down-done-${name}`);
      // A visitor with the old link is told it is gone and where to look instead.
      const visitorContext = await newContext(browser, device);
      const visitorPage = await visitorContext.newPage();
      await visitorPage.goto(`/library/${slug}`);
      await visitorPage.getByRole('heading', { level: 1, name: 'That Field Library page is not there' }).waitFor(LIVE);
      await visitorPage.getByRole('link', { name: 'Search the Field Library' }).click();
      await visitorPage.getByRole('heading', { level: 1, name: 'Field Library' }).waitFor(LIVE);
      await visitorContext.close();

      await page.getByRole('link', { name: 'Open the case' }).click();
      await page.waitForURL(`**/cases/${caseId}`, LIVE);
      const held = page.locator('p', { hasText: /^Out of the Field Library:/ });
      await held.waitFor(LIVE);
      // A recovered case waits on nobody: its header shows no urgency.
      expect(await page.getByText(/^(High|Medium|Low) urgency/).count()).toBe(0);
      expect(await held.innerText()).toContain(`“${reason}”`);
      const log = page.getByRole('log', { name: 'Messages' });
      await expect.poll(() => log.getByText(`took the field note of this case out of the Field Library: “${reason}”`, { exact: false }).count(), LIVE).toBe(1);

      // The grower is mailed the reason, and the mail's link opens their case page, which says the same.
      const mailbox = await openMailbox();
      const mailed = await mailbox.linkIn(grower.email, /^Your field note is out of the Field Library/, /^\/cases\/\d+$/);
      await mailbox.dispose();
      expect(mailed.mail.text).toContain(`The reason given: “${reason}”`);
      expect(mailed.path).toBe(`/cases/${caseId}`);
      const growerContext = await newContext(browser, device);
      await signInByApi(growerContext, grower.email, grower.password);
      const growerPage = await growerContext.newPage();
      await growerPage.goto(mailed.path);
      await growerPage.getByRole('heading', { level: 1, name: title }).waitFor(LIVE);
      const sharing = growerPage.getByRole('region', { name: 'Sharing this case' });
      await sharing.getByText(`“${reason}”`, { exact: false }).waitFor(LIVE);
      expect(await sharing.innerText()).toContain('it stays out until a steward puts it back');
      // Once the grower stops sharing, it is their choice that keeps the note out; sharing again hands it back to the steward.
      await sharing.getByRole('button', { name: 'Stop sharing it' }).click();
      await sharing.getByText('since you no longer agree to share this case, it stays out', { exact: false }).waitFor(LIVE);
      await shot(growerPage, `library-take-down-grower-${name}`);
      await sharing.getByRole('button', { name: 'Share it as a field note' }).click();
      await sharing.getByText('it stays out until a steward puts it back', { exact: false }).waitFor(LIVE);
      await growerContext.close();

      // The steward desk lists it among the notes held out, with the reason, linking the case.
      const desk = await context.newPage();
      await desk.goto('/steward?tab=library');
      const item = desk.getByRole('listitem').filter({ has: desk.getByRole('link', { name: title, exact: true }) });
      await item.waitFor(LIVE);
      expect(await item.innerText()).toContain(`“${reason}”`);
      await shot(desk, `library-holds-desk-${name}`);

      await page.getByRole('button', { name: 'Put it back in the Field Library' }).click();
      await page.getByText('Shared in the Field Library').waitFor(LIVE);
      await expect.poll(() => held.count(), LIVE).toBe(0);
      expect(await visitorStatus()).toBe(200);
      await desk.reload();
      await desk.getByRole('tab', { name: 'Notes held out' }).waitFor(LIVE);
      await expect.poll(() => item.count(), LIVE).toBe(0);
      await context.close();
    });
  }
});
