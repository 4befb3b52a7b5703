// A mentor turns the urgent-case e-mail on and off from the foot of the rounds, with the keyboard,
// on a phone; the choice is saved on the server and still there after a reload.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Browser } from 'playwright-core';
import { axeProblems, launch, newContext, PHONE, shot } from './browser';
import { freshPerson, signInByApi } from './fresh-people';

const WAIT = { timeout: 20_000 };

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});


describe('the urgent-case e-mail setting on the rounds', () => {
  test('when a new mentor ticks it with the keyboard, then it is saved, says so, survives a reload, and unticking stops it', async () => {
    const mentor = await freshPerson(browser, 'mentor', 'Tamsin');
    const context = await newContext(browser, PHONE);
    await signInByApi(context, mentor.email, mentor.password);
    const page = await context.newPage();
    const preference = async () => ((await (await context.request.get('/api/cases/preferences/urgent-mail')).json()) as { on: boolean }).on;

    await page.goto('/rounds');
    const setting = page.getByRole('group', { name: 'E-mail about urgent cases' });
    const box = setting.getByRole('checkbox', { name: /E-mail me when a case with high urgency has waited an hour/ });
    await expect.poll(() => box.isEnabled(), WAIT).toBe(true);
    expect(await box.isChecked()).toBe(false);
    expect(await preference()).toBe(false);

    await box.focus();
    await page.keyboard.press('Space');
    await setting.getByText('Saved: you will get these e-mails.').waitFor(WAIT);
    expect(await preference()).toBe(true);
    await shot(page, 'rounds-urgent-mail-on-phone');
    expect(await axeProblems(page)).toEqual([]);

    // The urgent-case mail links here: the setting is found by its anchor and is still ticked.
    await page.goto('/rounds#urgent-mail');
    await expect.poll(() => box.isEnabled(), WAIT).toBe(true);
    expect(await box.isChecked()).toBe(true);

    await box.focus();
    await page.keyboard.press('Space');
    await setting.getByText('Saved: no more of these e-mails.').waitFor(WAIT);
    expect(await box.isChecked()).toBe(false);
    expect(await preference()).toBe(false);
    await context.close();
  });
});
