import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Browser } from 'playwright-core';
import { DESKTOP, launch, newContext, PHONE, shot, signIn } from './browser';

/** Signing in hashes a password (argon2id), which takes seconds on a busy machine: wait that long. */
const SIGNED_IN_WAIT = { timeout: 15_000 };

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe('signing in as the demo grower', () => {
  for (const [name, device] of [['desktop', DESKTOP], ['phone', PHONE]] as const) {
    test(`when the demo grower signs in on a ${name}, then the header shows the grower's name`, async () => {
      const context = await newContext(browser, device);
      const page = await context.newPage();
      await page.goto('/batches');
      // Signed out, the batch shelf sends the visitor to sign in and back.
      await expect.poll(() => new URL(page.url()).pathname, SIGNED_IN_WAIT).toBe('/sign-in');
      await shot(page, `sign-in-${name}`);
      await page.getByLabel('E-mail').fill('grower@example.test');
      await page.getByLabel('Password').fill('sporewell-demo');
      await page.getByRole('button', { name: /sign in/i }).click();
      await expect.poll(() => new URL(page.url()).pathname, SIGNED_IN_WAIT).toBe('/batches');
      const banner = page.getByRole('banner');
      if (name === 'phone') await banner.getByRole('button', { name: /menu/i }).click();
      await expect.poll(() => banner.getByText('Rowan Tillsworth').filter({ visible: true }).count(), SIGNED_IN_WAIT).toBeGreaterThan(0);
      await shot(page, `signed-in-${name}`);
      await context.close();
    });
  }

  test('when the demo mentor and the demo steward sign in with nowhere else asked for, then each starts where their work is: the rounds, the steward desk', async () => {
    for (const [email, path, heading] of [
      ['mentor@example.test', '/rounds', 'Rounds'],
      ['steward@example.test', '/steward', 'Steward desk'],
    ] as const) {
      const context = await newContext(browser, PHONE);
      const page = await context.newPage();
      await signIn(page, email);
      await expect.poll(() => new URL(page.url()).pathname, SIGNED_IN_WAIT).toBe(path);
      await page.getByRole('heading', { level: 1, name: heading }).waitFor(SIGNED_IN_WAIT);
      // Signed in already, the sign-in page sends them there too.
      await page.goto('/sign-in');
      await expect.poll(() => new URL(page.url()).pathname, SIGNED_IN_WAIT).toBe(path);
      await context.close();
    }
  });

  test('when the password is wrong, then the page says so and stays on sign-in', async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    await signIn(page, 'grower@example.test', 'not-the-demo-password');
    await expect.poll(() => page.getByText('That e-mail and password do not match.').isVisible(), SIGNED_IN_WAIT).toBe(true);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await context.close();
  });
});
