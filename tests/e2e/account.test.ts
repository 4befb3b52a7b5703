// "Your account", as a new grower uses it on a phone: reached from their name in the menu, the
// name others see changed, a wrong current password refused on its field, the password changed,
// and another device where they were signed in signed out.
import { describe, expect, test } from 'vitest';
import { axeProblems, PHONE, shot, useBrowser } from './browser';
import { freshPerson, signInByApi } from './fresh-people';

const WAIT = { timeout: 20_000 };
const chromium = useBrowser();

describe('your account', () => {
  test('when a grower renames themselves and changes their password, then the header shows the new name, the new password works, and their other device is signed out', async () => {
    const grower = await freshPerson(chromium.browser(), 'grower', 'Rosalind');
    const otherDevice = await chromium.newContext(PHONE);
    await signInByApi(otherDevice, grower.email, grower.password);
    const context = await chromium.newContext(PHONE);
    await signInByApi(context, grower.email, grower.password);
    const page = await context.newPage();

    await page.goto('/batches');
    await page.getByRole('button', { name: 'Menu' }).click();
    await page.getByRole('link', { name: `${grower.displayName}, your account` }).click();
    await page.getByRole('heading', { level: 1, name: 'Your account' }).waitFor(WAIT);
    expect(await axeProblems(page)).toEqual([]);

    const name = page.getByLabel('Your name');
    await name.fill('Ros Larchfield');
    await page.getByRole('button', { name: 'Save the name' }).click();
    await page.getByText('Saved.', { exact: true }).waitFor(WAIT);
    await page.getByRole('button', { name: 'Menu' }).click();
    await page.getByRole('link', { name: 'Ros Larchfield, your account' }).waitFor(WAIT);
    await page.keyboard.press('Escape');

    await page.getByLabel('Current password').fill('not-what-i-had');
    await page.getByLabel('New password').fill('three-hens-and-a-compost-heap');
    await page.getByRole('button', { name: 'Change the password' }).click();
    await page.getByText('That is not your current password.').waitFor(WAIT);

    await page.getByLabel('Current password').fill(grower.password);
    await page.getByRole('button', { name: 'Change the password' }).click();
    await page.getByText(/Your password is changed\. Anywhere else you were signed in, you are signed out/).waitFor(WAIT);
    expect(await page.getByLabel('Current password').inputValue()).toBe('');
    await shot(page, 'account-password-changed-phone');

    expect((await otherDevice.request.get('/api/auth/me')).status()).toBe(401);
    expect((await context.request.get('/api/auth/me')).status()).toBe(200);
    // The reply mail is on at first; unticking it is saved.
    const replies = page.getByRole('checkbox', { name: /E-mail me when a mentor replies on a case of mine/ });
    await expect.poll(() => replies.isEnabled(), WAIT).toBe(true);
    expect(await replies.isChecked()).toBe(true);
    await replies.focus();
    await page.keyboard.press('Space');
    await page.getByText('Saved: no e-mails when a mentor replies.', { exact: false }).waitFor(WAIT);
    expect(((await (await context.request.get('/api/cases/preferences/reply-mail')).json()) as { on: boolean }).on).toBe(false);
    expect(await page.getByRole('checkbox', { name: /urgent cases/ }).count()).toBe(0);

    const fresh = await chromium.newContext(PHONE);
    expect((await fresh.request.post('/api/auth/login', { data: { email: grower.email, password: 'three-hens-and-a-compost-heap' } })).status()).toBe(200);
  });
});
