// The moderation loop in two browsers: a grower reports a mentor's reply from the thread, the
// demo steward hides it from the Reports tab and the grower's open thread shows the placeholder
// at once; on a second look the steward shows it again and the text comes back, live.
import { describe, expect, test } from 'vitest';
import { axeProblems, DESKTOP, PHONE, shot, signIn, useBrowser } from './browser';
import { freshPerson, signInByApi } from './fresh-people';

const WAIT = { timeout: 20_000 };
const chromium = useBrowser();

describe('hiding a reported message, and showing it again', () => {
  test('when a steward hides a reported reply and then shows it again, then the grower sees the placeholder and then the text, without reloading', async () => {
    const grower = await freshPerson(chromium.browser(), 'grower', 'Isolde');
    const mentor = await freshPerson(chromium.browser(), 'mentor', 'Barnaby');
    const growerContext = await chromium.newContext(PHONE);
    await signInByApi(growerContext, grower.email, grower.password);
    const opened = await growerContext.request.post('/api/cases', { data: { stage: 'LAB', symptoms: ['smell-sour'], description: 'The serum smells sharper than last time.' } });
    expect(opened.status()).toBe(201);
    const { id: caseId } = (await opened.json()) as { id: number };
    const mentorContext = await chromium.newContext(DESKTOP);
    await signInByApi(mentorContext, mentor.email, mentor.password);
    expect((await mentorContext.request.post(`/api/cases/${caseId}/claim`)).status()).toBe(200);
    const reply = 'Sharper is normal for LAB. Stop fussing over a jar of whey.';
    expect((await mentorContext.request.post(`/api/cases/${caseId}/messages`, { data: { clientId: `mod-${Date.now().toString(36)}`, body: reply, kind: 'text' } })).status()).toBe(201);

    // The grower reports the reply from the thread.
    const page = await growerContext.newPage();
    await page.goto(`/cases/${caseId}#conversation`);
    await page.getByText(reply).waitFor(WAIT);
    await page.getByRole('button', { name: `Report this message by ${mentor.displayName}` }).click();
    await page.getByLabel('What is wrong with it?').fill('It belittles me for asking.');
    await page.getByRole('button', { name: /^Send the report/ }).click();
    await page.getByText('Reported — a steward will look at it.').waitFor(WAIT);

    // The steward hides it from the Reports tab.
    const stewardContext = await chromium.newContext(DESKTOP);
    const desk = await stewardContext.newPage();
    await signIn(desk, 'steward@example.test');
    await desk.waitForURL((url) => !url.pathname.startsWith('/sign-in'), WAIT);
    await desk.goto('/steward');
    await desk.getByRole('tab', { name: /^Reports/ }).click();
    const card = desk.getByRole('group').filter({ hasText: 'It belittles me for asking.' });
    await card.getByRole('button', { name: 'Hide the message' }).click();
    await desk.getByRole('dialog').getByRole('button', { name: 'Hide the message' }).click();
    await desk.getByText(/is hidden for everyone/).waitFor(WAIT);
    await page.getByText('Hidden by a steward').waitFor(WAIT);
    expect(await page.getByText(reply).count()).toBe(0);

    // On a second look it is shown again.
    await desk.getByLabel('Show').selectOption('hidden');
    const settled = desk.getByRole('group').filter({ hasText: 'It belittles me for asking.' });
    await settled.getByRole('button', { name: 'Show the message again' }).click();
    const dialog = desk.getByRole('dialog');
    await dialog.getByLabel('Note for the audit log (optional)').fill('Blunt, not abusive. Leaving it up.');
    await shot(desk, 'moderation-show-again-desktop');
    expect(await axeProblems(desk)).toEqual([]);
    await dialog.getByRole('button', { name: 'Show the message again' }).click();
    await desk.getByText(`The message by ${mentor.displayName} (mentor) shows in its thread again.`).waitFor(WAIT);
    await page.getByText(reply).waitFor(WAIT);
    expect(await page.getByText('Hidden by a steward').count()).toBe(0);

    await desk.getByRole('tab', { name: 'Audit log' }).click();
    await desk.getByText('showed a hidden message in', { exact: false }).first().waitFor(WAIT);
  });
});
