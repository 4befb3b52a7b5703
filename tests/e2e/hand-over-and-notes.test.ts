// Four things a reviewer looked at, in the browser on the demo community: the demo accounts do
// not start with a pile of "new" messages they took part in; the mentor holding a case hands it
// to another mentor from the case page; a grower's "batches like this" are field notes, never
// another grower's case; a freshly approved mentor sees the rounds without a reload. Each makes
// its own people and cases where it changes anything, so the demo cases stay as seeded.
import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { APIRequestContext, Browser, Page } from 'playwright-core';
import { DEMO_CASES, DEMO_USERS } from '../../server/src/db/seeders/demo-data';
import { baseUrl, DESKTOP, launch, newContext, PHONE, shot, signIn } from './browser';

const LIVE = { timeout: 10_000 };
const DEVICES = [
  ['desktop', DESKTOP],
  ['phone', PHONE],
] as const;
const nameOf = (key: string) => DEMO_USERS.find((u) => u.key === key)!.displayName;

let browser: Browser;

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function signedInPage(email: string, device: typeof DESKTOP | typeof PHONE): Promise<Page> {
  const context = await newContext(browser, device);
  const page = await context.newPage();
  await signIn(page, email);
  await page.waitForURL((url) => url.pathname !== '/sign-in');
  return page;
}

/** JSON calls on a page's own session (same cookies as the page), from its own origin. */
function call(request: APIRequestContext, method: 'GET' | 'POST' | 'PATCH', path: string, data?: unknown) {
  return request.fetch(path, { method, data, headers: { Origin: baseUrl(), 'Content-Type': 'application/json' } });
}

async function newGrower(device: typeof DESKTOP | typeof PHONE, name: string): Promise<Page> {
  const context = await newContext(browser, device);
  const page = await context.newPage();
  const email = `e2e-${crypto.randomBytes(4).toString('hex')}@example.test`;
  const res = await call(page.request, 'POST', '/api/auth/register', { email, password: 'a-long-enough-e2e-password', displayName: name });
  expect(res.status()).toBe(201);
  return page;
}

describe('after the review', () => {
  test.each(DEVICES)('when the demo mentor and grower sign in on a %s, then only a fresh line or two reads as new', async (device, size) => {
    for (const [who, email] of [
      ['mentor', 'mentor@example.test'],
      ['grower', 'grower@example.test'],
    ] as const) {
      const page = await signedInPage(email, size);
      const unread = await page.request.get('/api/cases/unread');
      // Seeded: one for the mentor, none for the grower; other browser tests may have added a line or two.
      expect(((await unread.json()) as { total: number }).total).toBeLessThan(5);
      await page.goto(who === 'mentor' ? '/rounds' : '/batches');
      await page.getByRole('heading', { level: 1 }).first().waitFor(LIVE);
      await shot(page, `review-unread-${who}-${device}`);
      await page.context().close();
    }
  });

  test.each(DEVICES)('when the mentor holding a case hands it over on a %s, then the case page names the new mentor and the thread says who handed it to whom', async (device, size) => {
    const grower = await newGrower(DESKTOP, 'Hollis Emberwick');
    const opened = await call(grower.request, 'POST', '/api/cases', { stage: 'IMO2', symptoms: ['bubbling'], description: 'The jar hisses when I lift the paper.' });
    expect(opened.status()).toBe(201);
    const { id } = (await opened.json()) as { id: number };
    const mentor = await signedInPage('mentor@example.test', size);
    expect((await call(mentor.request, 'POST', `/api/cases/${id}/claim`)).status()).toBe(200);

    await mentor.goto(`/cases/${id}`);
    await mentor.getByText('You hold this case.').waitFor(LIVE);
    await mentor.getByRole('button', { name: 'Hand over', exact: true }).click();
    const choice = mentor.getByLabel('Hand to');
    await expect.poll(() => choice.locator('option', { hasText: nameOf('tobiah') }).count(), LIVE).toBe(1);
    // The list says how busy each mentor is, and never offers the one who holds it.
    expect(await choice.locator('option', { hasText: nameOf('marta') }).count()).toBe(0);
    const label = (await choice.locator('option', { hasText: nameOf('tobiah') }).textContent()) ?? '';
    expect(label).toMatch(/ — (no open cases|\d+ open cases?)$/);
    await choice.selectOption({ label });
    await shot(mentor, `review-hand-over-form-${device}`);
    await mentor.getByRole('button', { name: 'Hand over', exact: true }).click();

    await mentor.getByText(`${nameOf('tobiah')} holds this case.`).waitFor(LIVE);
    const log = mentor.getByRole('log', { name: 'Messages' });
    await expect.poll(() => log.getByText(`${nameOf('marta')} handed this case to ${nameOf('tobiah')}.`).count(), LIVE).toBe(1);
    // Closing is the new holder's now: the panel is gone without a reload.
    await expect.poll(() => mentor.getByRole('button', { name: 'Close the case…' }).count(), LIVE).toBe(0);
    await shot(mentor, `review-hand-over-done-${device}`);
    await mentor.context().close();
    await grower.context().close();
  });

  test.each(DEVICES)("when the demo grower reads batches like their open case on a %s, then they are field notes linked into the library, and a mentor sees cases", async (device, size) => {
    const demo = DEMO_CASES.find((c) => c.key === 'c-open-rowan-fpj')!;
    const grower = await signedInPage('grower@example.test', size);
    const mine = await grower.request.get('/api/cases?mine=1&status=all&pageSize=100');
    const { items } = (await mine.json()) as { items: { id: number; title: string }[] };
    const caseId = items.find((c) => c.title === demo.title)!.id;

    await grower.goto(`/cases/${caseId}`);
    const similar = grower.getByRole('region', { name: 'Batches like this' });
    const list = similar.getByRole('list', { name: 'Resolved cases like this one, closest first' });
    await expect.poll(() => list.getByRole('listitem').count(), LIVE).toBeGreaterThan(0);
    const hrefs = await list.getByRole('heading').getByRole('link').evaluateAll((links) => links.map((a) => a.getAttribute('href')));
    expect(hrefs.length).toBeGreaterThan(0);
    for (const href of hrefs) expect(href).toMatch(/^\/library\/[a-z0-9-]+$/);
    await similar.scrollIntoViewIfNeeded();
    await shot(grower, `review-similar-grower-${device}`);

    // The first one opens as a field note.
    await list.getByRole('heading').getByRole('link').first().click();
    await grower.waitForURL(/\/library\//);
    await grower.getByRole('heading', { level: 1 }).waitFor(LIVE);
    await grower.context().close();

    const mentor = await signedInPage('mentor@example.test', size);
    await mentor.goto(`/cases/${caseId}`);
    const staffList = mentor.getByRole('region', { name: 'Batches like this' }).getByRole('list');
    await expect.poll(() => staffList.getByRole('listitem').count(), LIVE).toBeGreaterThan(0);
    const staffHrefs = await staffList.getByRole('heading').getByRole('link').evaluateAll((links) => links.map((a) => a.getAttribute('href')));
    for (const href of staffHrefs) expect(href).toMatch(/^\/cases\/\d+$/);
    await mentor.context().close();
  });

  test.each(DEVICES)('when a steward approves a grower who has a page open on a %s, then the rounds appear in their header without a reload', async (device, size) => {
    const applicant = await newGrower(size, 'Tamsin Ashcombe');
    const applied = await call(applicant.request, 'POST', '/api/mentor-applications', {
      experience: 'Seven springs of IMO from the hazel copse and LAB for the whole lane.',
      stages: ['IMO1', 'LAB'],
      region: 'The hazel copse lane',
    });
    expect(applied.status()).toBe(201);
    const { id } = (await applied.json()) as { id: number };
    // The news arrives on the socket: wait until socket.io says it is connected ("40…").
    const socketUp = new Promise<void>((resolve) => {
      applicant.on('websocket', (ws) => ws.on('framereceived', (frame) => String(frame.payload).startsWith('40') && resolve()));
    });
    await applicant.goto('/batches');
    await applicant.getByRole('heading', { level: 1 }).first().waitFor(LIVE);
    await socketUp;
    // On a phone the main links sit behind the menu button.
    if (device === 'phone') await applicant.getByRole('button', { name: 'Menu' }).click();
    const rounds = applicant.getByRole('link', { name: 'Rounds', exact: true });
    expect(await rounds.count()).toBe(0);

    const steward = await signedInPage('steward@example.test', DESKTOP);
    const decided = await call(steward.request, 'PATCH', `/api/steward/mentor-applications/${id}`, { decision: 'approved', note: 'Welcome to the rounds.' });
    expect(decided.status()).toBe(200);
    await steward.context().close();

    await expect.poll(() => rounds.count(), LIVE).toBe(1);
    await shot(applicant, `review-approved-header-${device}`);
    // A link followed inside the page, not a reload: the rounds let the new mentor in.
    await rounds.click();
    await applicant.waitForURL(/\/rounds/);
    await applicant.getByRole('heading', { level: 1, name: 'Rounds' }).waitFor(LIVE);
    await applicant.getByRole('main').getByRole('link').first().waitFor(LIVE);
    await shot(applicant, `review-approved-rounds-${device}`);
    await applicant.context().close();
  });
});
