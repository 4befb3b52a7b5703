// A mentor writes what growers read about them on their profile, from the keyboard on a phone;
// a grower then reads it there as plain text, with no way to change it.
import { describe, expect, test } from 'vitest';
import { axeProblems, DESKTOP, PHONE, shot, useBrowser } from './browser';
import { freshPerson, signInByApi } from './fresh-people';

const WAIT = { timeout: 20_000 };
const chromium = useBrowser();

describe("a mentor's own words on their profile", () => {
  test('when a new mentor writes a few lines with the keyboard, then they show on the profile as typed, and a grower reads them without an edit button', async () => {
    const mentor = await freshPerson(chromium.browser(), 'mentor', 'Perpetua');
    const mentorContext = await chromium.newContext(PHONE);
    await signInByApi(mentorContext, mentor.email, mentor.password);
    const page = await mentorContext.newPage();
    await page.goto('/rounds');
    await page.getByRole('link', { name: 'Your track record' }).click();
    await page.getByRole('heading', { level: 1, name: mentor.displayName }).waitFor(WAIT);

    const open = page.getByRole('button', { name: 'Write a few lines about yourself' });
    await open.focus();
    await page.keyboard.press('Enter');
    const field = page.getByLabel('About you');
    expect(await field.evaluate((el) => el === document.activeElement)).toBe(true);
    const about = 'Nine springs of IMO from the hazel coppice. Ask me about <b>bran piles</b> that run hot.';
    await page.keyboard.type(about);
    await shot(page, 'mentor-about-editing-phone');
    expect(await axeProblems(page)).toEqual([]);
    await page.keyboard.press('Tab');
    await page.keyboard.press('Enter');

    await page.getByText('Saved. Growers see this on your profile.').waitFor(WAIT);
    await page.getByText(about, { exact: true }).waitFor(WAIT);
    const change = page.getByRole('button', { name: 'Change what growers read about you' });
    expect(await change.evaluate((el) => el === document.activeElement)).toBe(true);
    expect(await page.locator('main b').count()).toBe(0);

    const growerContext = await chromium.newContext(DESKTOP);
    const grower = await freshPerson(chromium.browser(), 'grower', 'Linnet');
    await signInByApi(growerContext, grower.email, grower.password);
    const growerPage = await growerContext.newPage();
    await growerPage.goto(`/mentors/${mentor.id}`);
    await growerPage.getByText(about, { exact: true }).waitFor(WAIT);
    expect(await growerPage.getByRole('button', { name: /what growers read about you|about yourself/ }).count()).toBe(0);
    await shot(growerPage, 'mentor-about-as-grower-desktop');

  });
});
