// The demo grower and the demo mentor on one of the grower's open cases, each in a browser of
// their own: the mentor finds the case on the rounds and claims it, then they talk live.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { DEMO_CASES } from '../../server/src/db/seeders/demo-data';
import { DESKTOP, launch, newContext, PHONE, shot, signIn } from './browser';

// The demo grower (Rowan) has one open case nobody holds yet: the mentor can claim it.
const demoCase = DEMO_CASES.find((c) => c.growerKey === 'rowan' && c.status === 'awaiting_mentor' && !c.mentorKey);
if (!demoCase) throw new Error('The demo scenario has no open, unclaimed case of the demo grower.');
const TITLE = demoCase.title;

/** Live delivery is fast, but a page load, a socket handshake and a join come first. */
const LIVE = { timeout: 10_000 };

let browser: Browser;
let mentorContext: BrowserContext;
let growerContext: BrowserContext;
let mentor: Page;
let grower: Page;
let caseId: number;

beforeAll(async () => {
  browser = await launch();
  mentorContext = await newContext(browser, DESKTOP);
  growerContext = await newContext(browser, PHONE);
  mentor = await mentorContext.newPage();
  grower = await growerContext.newPage();
  await signIn(mentor, 'mentor@example.test');
  await signIn(grower, 'grower@example.test');
  const signedIn = (url: URL) => url.pathname !== '/sign-in';
  await grower.waitForURL(signedIn);
  await mentor.waitForURL(signedIn);

  // The case's id, as the grower's own list gives it (the same session the browser uses).
  const answer = await grower.request.get('/api/cases?mine=1&status=all&pageSize=100');
  expect(answer.ok()).toBe(true);
  const { items } = (await answer.json()) as { items: Array<{ id: number; title: string }> };
  const found = items.find((c) => c.title === TITLE);
  if (!found) throw new Error(`The demo grower's case "${TITLE}" was not seeded.`);
  caseId = found.id;
});

afterAll(async () => {
  await browser?.close();
});

/** How many times a text shows in the thread's message log. */
function inThread(page: Page, text: string) {
  return page.getByRole('log', { name: 'Messages' }).getByText(text, { exact: true }).count();
}

/** The grower is on a phone, by touch alone: Send is tapped (Return there starts a new line). */
const tapSend = (page: Page) => page.getByRole('button', { name: 'Send', exact: true }).tap();

describe('the rounds and the live thread', () => {
  test('when the mentor opens the rounds, then the grower\'s case is listed and the mentor can claim it', async () => {
    await mentor.goto('/rounds');
    const row = mentor.getByRole('row').filter({ has: mentor.getByRole('link', { name: TITLE, exact: true }) });
    await expect.poll(() => row.count(), LIVE).toBe(1);
    await shot(mentor, 'rounds-desktop');

    await row.getByRole('button', { name: `Claim “${TITLE}”` }).click();
    // Claimed: the row now names the mentor and offers no claim.
    await expect.poll(() => row.getByText('You', { exact: true }).count(), LIVE).toBe(1);
    expect(await row.getByRole('button', { name: /^Claim/ }).count()).toBe(0);

    const phone = await newContext(browser, PHONE);
    const onPhone = await phone.newPage();
    await signIn(onPhone, 'mentor@example.test');
    await onPhone.waitForURL((url) => url.pathname !== '/sign-in');
    await onPhone.goto('/rounds');
    await expect.poll(() => onPhone.getByRole('link', { name: TITLE, exact: true }).count(), LIVE).toBe(1);
    await shot(onPhone, 'rounds-phone');
    await phone.close();
  });

  test('when the grower and the mentor have the case open, then what one types appears for the other without a reload', async () => {
    await mentor.goto(`/cases/${caseId}`);
    await grower.goto(`/cases/${caseId}`);
    // Both are in the room: each sees the other as present.
    await expect.poll(() => mentor.getByText('Here now:').count(), LIVE).toBe(1);
    await expect.poll(() => grower.getByText('Here now:').count(), LIVE).toBe(1);
    // Each is asked for the photos that are theirs to add.
    await grower.getByText('More photos of the batch', { exact: true }).waitFor(LIVE);
    await mentor.getByText('Photos to show the grower', { exact: true }).waitFor(LIVE);
    const stamp = Date.now().toString(36);

    const fromGrower = `The bubbles are smaller this morning (${stamp}).`;
    await grower.getByLabel(/^Write to/).fill(fromGrower);
    await tapSend(grower);
    await expect.poll(() => inThread(mentor, fromGrower), LIVE).toBe(1);
    await expect.poll(() => inThread(grower, fromGrower), LIVE).toBe(1);

    // Typing shows on the other side while it happens.
    await mentor.getByLabel(/^Write to/).pressSequentially('Good', { delay: 40 });
    await expect.poll(() => grower.getByText(/Marta is typing…/).count(), LIVE).toBe(1);
    const fromMentor = `Good. Top it up with 500 g of sugar today (${stamp}).`;
    await mentor.getByLabel(/^Write to/).fill(fromMentor);
    await mentor.keyboard.press('Enter');
    await expect.poll(() => inThread(grower, fromMentor), LIVE).toBe(1);
    await expect.poll(() => inThread(mentor, fromMentor), LIVE).toBe(1);
  });

  test('when the grower presses Return on a phone, then it starts a new line, and Send sends both lines as one message', async () => {
    const stamp = Date.now().toString(36);
    const box = grower.getByLabel(/^Write to/);
    await expect.poll(() => grower.getByText('Tap Send when it is ready.').count(), LIVE).toBe(1);
    await box.fill(`The froth went down (${stamp}).`);
    await box.press('Enter');
    await box.pressSequentially('It smells sweet again.');
    expect(await box.inputValue()).toBe(`The froth went down (${stamp}).\nIt smells sweet again.`);
    expect(await inThread(grower, `The froth went down (${stamp}).`)).toBe(0);

    await tapSend(grower);
    // One message, its line break kept (the text match itself treats the break as a space).
    const both = `The froth went down (${stamp}). It smells sweet again.`;
    await expect.poll(() => inThread(mentor, both), LIVE).toBe(1);
    await expect.poll(() => inThread(grower, both), LIVE).toBe(1);
    const shown = await mentor.getByRole('log', { name: 'Messages' }).getByText(both, { exact: true }).textContent();
    expect(shown).toBe(`The froth went down (${stamp}).\nIt smells sweet again.`);
    expect(await box.inputValue()).toBe('');
    // On the desktop, Enter still sends and the hint says so.
    expect(await mentor.getByText('Enter sends. Shift+Enter starts a new line.').count()).toBe(1);
  });

  test('when the mentor writes a mentor aside, then the grower never sees it, live or after a reload', async () => {
    const stamp = Date.now().toString(36);
    const aside = `Sugar is short by a third; watch for a sour turn (${stamp}).`;
    await mentor.getByRole('checkbox', { name: 'Mentor aside' }).check();
    await mentor.getByLabel('Your mentor aside').fill(aside);
    await mentor.keyboard.press('Enter');
    await expect.poll(() => inThread(mentor, aside), LIVE).toBe(1);
    await expect.poll(() => mentor.getByText('Mentor aside — growers never see this').count(), LIVE).toBeGreaterThan(0);

    // A reply sent after the aside reaches the grower; by then the aside would have too.
    await mentor.getByRole('checkbox', { name: 'Mentor aside' }).uncheck();
    const after = `Tell me how it smells tonight (${stamp}).`;
    await mentor.getByLabel(/^Write to/).fill(after);
    await mentor.keyboard.press('Enter');
    await expect.poll(() => inThread(grower, after), LIVE).toBe(1);
    expect(await grower.getByText(aside).count()).toBe(0);
    await shot(mentor, 'live-thread-mentor-desktop');
    await shot(grower, 'live-thread-grower-phone');

    await grower.reload();
    await expect.poll(() => inThread(grower, after), LIVE).toBe(1);
    expect(await grower.getByText(aside).count()).toBe(0);
  });

  test('when the grower drops offline and comes back, then the missed replies appear once, in order, and what the grower wrote goes out once', async () => {
    await expect.poll(() => mentor.getByText('Here now:').count(), LIVE).toBe(1);
    const stamp = Date.now().toString(36);
    await growerContext.setOffline(true);
    await expect.poll(() => grower.getByText('You are offline').count(), LIVE).toBe(1);

    const missed = [`First while you were away (${stamp}).`, `Second while you were away (${stamp}).`];
    for (const text of missed) {
      await mentor.getByLabel(/^Write to/).fill(text);
      await mentor.keyboard.press('Enter');
      await expect.poll(() => inThread(mentor, text), LIVE).toBe(1);
    }
    const offlineWords = `Written with no signal (${stamp}).`;
    await grower.getByLabel(/^Write to/).fill(offlineWords);
    await tapSend(grower);
    await expect.poll(() => grower.getByText(/waiting for the connection/).count(), LIVE).toBe(1);
    await shot(grower, 'live-thread-offline-phone');

    await growerContext.setOffline(false);
    await expect.poll(() => grower.getByText('Back online.').count(), { timeout: 30_000 }).toBe(1);
    for (const text of missed) await expect.poll(() => inThread(grower, text), LIVE).toBe(1);
    const texts = await grower.getByRole('log', { name: 'Messages' }).getByRole('listitem').allTextContents();
    const at = missed.map((text) => texts.findIndex((t) => t.includes(text)));
    expect(at[0]).toBeGreaterThan(-1);
    expect(at[1]).toBeGreaterThan(at[0]);
    await expect.poll(() => inThread(mentor, offlineWords), LIVE).toBe(1);
    await expect.poll(() => inThread(grower, offlineWords), LIVE).toBe(1);
  });
});
