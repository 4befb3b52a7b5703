// A new member who has not opened the confirmation link yet: the batch shelf asks for it and
// offers a new one (refused, with the wait, right after joining); the mailed link confirms the
// address and the request goes away; the same link a second time says there is nothing to do.
import { describe, expect, test } from 'vitest';
import { axeProblems, PHONE, shot, useBrowser } from './browser';
import { stamp } from './fresh-people';
import { openMailbox } from './journey-helpers';

const WAIT = { timeout: 20_000 };
const chromium = useBrowser();

describe('confirming the e-mail address', () => {
  test('when a grower joins on a phone, then the shelf asks them to confirm, a new link is refused for two minutes with the reason, and the mailed link ends the request', async () => {
    const id = stamp();
    const grower = { name: `Ottilie Fernhall ${id}`, email: `ottilie-${id}@example.test`, password: `crock-and-cloth-${id}` };
    const page = await chromium.newPage(PHONE);
    await page.goto('/join');
    await page.getByLabel('Your name').fill(grower.name);
    await page.getByLabel('E-mail').fill(grower.email);
    await page.getByLabel('Password').fill(grower.password);
    await page.getByRole('button', { name: 'Join Sporewell' }).click();
    await page.getByRole('heading', { level: 1, name: 'Batch shelf' }).waitFor(WAIT);

    const notice = page.getByRole('status').filter({ hasText: 'Please confirm your e-mail address' });
    await notice.waitFor(WAIT);
    expect(await notice.innerText()).toContain(`We sent a link to ${grower.email} when you joined.`);
    expect(await axeProblems(page)).toEqual([]);

    // Asking for another at once: the first one is still fresh, and the screen says so.
    await notice.getByRole('button', { name: 'Send me a new link' }).click();
    await page.getByText(`A link went to ${grower.email} less than 2 minutes ago.`).waitFor(WAIT);
    await shot(page, 'confirm-email-asked-too-soon-phone');

    const mailbox = await openMailbox();
    try {
      const confirm = await mailbox.linkIn(grower.email, /^Confirm your e-mail/, /^\/verify-email$/);
      await page.goto(confirm.path);
      await page.getByText('Thank you — your e-mail is confirmed').waitFor(WAIT);
      await page.getByRole('link', { name: 'batch shelf', exact: true }).click();
      await page.getByRole('heading', { name: 'Your shelf is empty' }).waitFor(WAIT);
      expect(await page.getByText('Please confirm your e-mail address').count()).toBe(0);

      // The same link again: used up, and there is nothing left to do.
      await page.goto(confirm.path);
      await page.getByText('That link did not work').waitFor(WAIT);
      await page.getByText(`Your address ${grower.email} is confirmed already, so there is nothing more to do.`).waitFor(WAIT);
      expect(await page.getByRole('button', { name: 'Send me a new link' }).count()).toBe(0);
    } finally {
      await mailbox.dispose();
    }
  });
});
