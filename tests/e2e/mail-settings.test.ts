// A mentor chooses their e-mails at the foot of the rounds, with the keyboard, on a phone: the
// mail when a grower writes (on at first) and the urgent-case mail (off at first). Each choice is
// saved on the server and still there after a reload.
import { describe, expect, test } from 'vitest';
import { axeProblems, PHONE, shot, useBrowser } from './browser';
import { freshPerson, signInByApi } from './fresh-people';

const WAIT = { timeout: 20_000 };
const chromium = useBrowser();

describe('the e-mail choices on the rounds', () => {
  test('when a new mentor ticks the urgent-case e-mail and unticks the grower one with the keyboard, then each is saved, says so, and survives a reload at the link the mails give', async () => {
    const mentor = await freshPerson(chromium.browser(), 'mentor', 'Tamsin');
    const context = await chromium.newContext(PHONE);
    await signInByApi(context, mentor.email, mentor.password);
    const page = await context.newPage();
    const stored = async (choice: string) => ((await (await context.request.get(`/api/cases/preferences/${choice}`)).json()) as { on: boolean }).on;

    await page.goto('/rounds');
    const settings = page.getByRole('group', { name: 'E-mails to you' });
    const urgent = settings.getByRole('checkbox', { name: /E-mail about urgent cases: when a case with high urgency has waited an hour/ });
    const wrote = settings.getByRole('checkbox', { name: /E-mail me when a grower writes on a case I hold and I have not read it within 10 minutes/ });
    await expect.poll(async () => (await urgent.isEnabled()) && (await wrote.isEnabled()), WAIT).toBe(true);
    expect(await urgent.isChecked()).toBe(false);
    expect(await wrote.isChecked()).toBe(true);

    await urgent.focus();
    await page.keyboard.press('Space');
    await settings.getByText('Saved: you will get the urgent-case e-mails.').waitFor(WAIT);
    // The grower-mail box sits just before it: Shift+Tab reaches it.
    await page.keyboard.press('Shift+Tab');
    expect(await wrote.evaluate((el) => el === document.activeElement)).toBe(true);
    await page.keyboard.press('Space');
    await settings.getByText('Saved: no e-mails when a grower writes. The rounds still show what is new.').waitFor(WAIT);
    expect(await stored('urgent-mail')).toBe(true);
    expect(await stored('grower-wrote-mail')).toBe(false);
    await shot(page, 'rounds-mail-settings-phone');
    expect(await axeProblems(page)).toEqual([]);

    // The mails link here: the choices are found at their anchor, as they were left.
    await page.goto('/rounds#mail-settings');
    await expect.poll(async () => (await urgent.isEnabled()) && (await wrote.isEnabled()), WAIT).toBe(true);
    expect(await urgent.isChecked()).toBe(true);
    expect(await wrote.isChecked()).toBe(false);
    expect(await settings.isVisible()).toBe(true);

    await urgent.focus();
    await page.keyboard.press('Space');
    await settings.getByText('Saved: no more urgent-case e-mails.').waitFor(WAIT);
    expect(await stored('urgent-mail')).toBe(false);
  });
});
