import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Browser, BrowserContext } from 'playwright-core';
import { axeProblems, DESKTOP, launch, newContext, PHONE, shot, signIn } from './browser';

/** Signing in hashes a password (argon2id), which takes seconds on a busy machine: wait that long. */
const SIGNED_IN_WAIT = { timeout: 15_000 };

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});


/** A new grower, signed in through the join API in this context, as a newcomer would be. */
async function newGrower(context: BrowserContext): Promise<{ name: string; email: string }> {
  const stamp = Date.now().toString(36);
  const grower = { name: `Hazel Quinby ${stamp}`, email: `hazel-${stamp}@example.test` };
  const res = await context.request.post('/api/auth/register', {
    data: { email: grower.email, password: 'fern-and-bran-every-spring', displayName: grower.name },
  });
  expect(res.status()).toBe(201);
  return grower;
}

describe('a grower becomes a mentor through the steward desk', () => {
  test('when a grower applies and the demo steward approves in the steward desk, then the new mentor sees the rounds without signing in again', async () => {
    // The grower, on a phone.
    const growerContext = await newContext(browser, PHONE);
    const grower = await newGrower(growerContext);
    const growerPage = await growerContext.newPage();
    await growerPage.goto('/');
    await growerPage.getByRole('link', { name: 'Apply to mentor' }).click();
    await expect.poll(() => new URL(growerPage.url()).pathname, SIGNED_IN_WAIT).toBe('/apply-to-mentor');
    await growerPage.getByRole('heading', { level: 1, name: 'Apply to mentor' }).waitFor();
    // An empty form is refused in the browser, saying what is missing.
    await growerPage.getByRole('button', { name: 'Send my application' }).click();
    await expect.poll(() => growerPage.getByText('Choose at least one stage you know well.').isVisible(), SIGNED_IN_WAIT).toBe(true);
    await growerPage.getByLabel(/^IMO1/).check();
    await growerPage.getByLabel(/^LAB/).check();
    await growerPage.getByLabel('Your experience').fill('Four springs of IMO1 from the beech hanger, and LAB from rice wash every month for the polytunnel beds.');
    await growerPage.getByLabel('Where you grow').fill('Larchmere Commons, upper terraces');
    await shot(growerPage, 'apply-to-mentor-phone');
    expect(await axeProblems(growerPage)).toEqual([]);
    await growerPage.getByRole('button', { name: 'Send my application' }).click();
    await growerPage.getByText('Your application is with the stewards').waitFor();

    // Still a grower: the rounds are not for them yet.
    await growerPage.goto('/rounds');
    await growerPage.getByRole('heading', { level: 1, name: 'This page is not for your role' }).waitFor();

    // The demo steward, at a desk.
    const stewardContext = await newContext(browser, DESKTOP);
    const stewardPage = await stewardContext.newPage();
    await signIn(stewardPage, 'steward@example.test');
    await expect.poll(() => new URL(stewardPage.url()).pathname, SIGNED_IN_WAIT).not.toBe('/sign-in');
    await stewardPage.goto('/steward');
    await stewardPage.getByRole('heading', { level: 3, name: 'Open cases right now, by urgency' }).waitFor();
    await shot(stewardPage, 'steward-desk-health-desktop');
    expect(await axeProblems(stewardPage)).toEqual([]);

    await stewardPage.getByRole('tab', { name: /Mentor applications/ }).click();
    const card = stewardPage.getByRole('group', { name: grower.name });
    await card.waitFor();
    await card.getByLabel(`Note to ${grower.name}`).fill('Welcome to the rounds — start with the IMO cases.');
    await shot(stewardPage, 'steward-desk-applications-desktop');
    expect(await axeProblems(stewardPage)).toEqual([]);
    await card.getByRole('button', { name: `Approve ${grower.name} as a mentor` }).click();
    await stewardPage.getByText(`${grower.name} is a mentor now and has been e-mailed.`).waitFor();

    // The same grower session, no new sign-in: a full page load reads the role afresh.
    await growerPage.goto('/rounds');
    await growerPage.getByRole('heading', { level: 1, name: 'Rounds' }).waitFor();
    expect(await growerPage.getByText('This page is not for your role').count()).toBe(0);
    await growerPage.waitForLoadState('networkidle');
    await shot(growerPage, 'new-mentor-rounds-phone');

    // The decision went out by e-mail; the local catcher holds it on the Mail tab (the outbox
    // worker sends within a second or so, so the tab is reopened until it is there).
    const approvalMail = stewardPage.locator('summary', { hasText: 'You are now a Sporewell mentor' }).filter({ hasText: grower.email });
    await expect
      .poll(
        async () => {
          await stewardPage.getByRole('tab', { name: 'Audit log' }).click();
          await stewardPage.getByRole('tab', { name: 'Mail' }).click();
          await stewardPage.getByText(/caught here instead of delivered/).waitFor();
          await stewardPage.waitForLoadState('networkidle');
          return approvalMail.count();
        },
        { timeout: 20_000 },
      )
      .toBeGreaterThan(0);
    await approvalMail.first().click();
    await stewardPage.getByText('Welcome to the rounds — start with the IMO cases.').first().waitFor();
    await stewardPage.getByRole('tab', { name: 'Audit log' }).click();
    await stewardPage.getByText(`approved ${grower.name}'s application to mentor`).waitFor();
    await shot(stewardPage, 'steward-desk-audit-desktop');

    await growerContext.close();
    await stewardContext.close();
  });

  test('when the applicant was disabled meanwhile, then their card says so, offers no approval, and declining says no e-mail went out', async () => {
    const growerContext = await newContext(browser, DESKTOP);
    const grower = await newGrower(growerContext);
    const applied = await growerContext.request.post('/api/mentor-applications', {
      data: { experience: 'Three springs of IMO1 and IMO2 from the birch copse, and FPJ from mugwort each June.', stages: ['IMO1', 'FPJ'], region: 'Larchmere Commons, lower field' },
    });
    expect(applied.status()).toBe(201);
    const me = (await (await growerContext.request.get('/api/auth/me')).json()) as { id: number };

    const stewardContext = await newContext(browser, PHONE);
    const stewardPage = await stewardContext.newPage();
    await signIn(stewardPage, 'steward@example.test');
    await expect.poll(() => new URL(stewardPage.url()).pathname, SIGNED_IN_WAIT).not.toBe('/sign-in');
    const disabled = await stewardContext.request.patch(`/api/steward/users/${me.id}`, { data: { disabled: true } });
    expect(disabled.status()).toBe(200);

    await stewardPage.goto('/steward');
    await stewardPage.getByRole('tab', { name: /Mentor applications/ }).click();
    const card = stewardPage.getByRole('group', { name: grower.name });
    await card.getByText('This account is disabled').waitFor();
    expect(await card.getByRole('button', { name: /^Approve/ }).count()).toBe(0);
    await card.getByLabel('Note for the record').fill('Declined: the account was turned off after the spam reports.');
    await shot(stewardPage, 'steward-desk-application-disabled-phone');
    expect(await axeProblems(stewardPage)).toEqual([]);
    await card.getByRole('button', { name: 'Decline' }).click();
    await stewardPage.getByText(`${grower.name}'s application was declined. No e-mail went out, since the account is disabled.`).waitFor();

    await growerContext.close();
    await stewardContext.close();
  });

  test('when the demo steward opens the desk on a phone, then every tab is reachable, the health charts have their text and a mentor in People links their track record', async () => {
    const context = await newContext(browser, PHONE);
    const page = await context.newPage();
    await signIn(page, 'steward@example.test');
    await expect.poll(() => new URL(page.url()).pathname, SIGNED_IN_WAIT).not.toBe('/sign-in');
    await page.goto('/steward');
    await page.getByRole('heading', { level: 3, name: 'Cases opened per week, by stage' }).waitFor();
    expect(await page.getByText('The numbers as a table').count()).toBeGreaterThanOrEqual(5);
    await shot(page, 'steward-desk-health-phone');
    expect(await axeProblems(page)).toEqual([]);
    for (const tab of ['People', 'Reports', 'Notes held out', 'Audit log']) {
      await page.getByRole('tab', { name: new RegExp(`^${tab}`) }).click();
      await expect.poll(() => page.getByRole('tab', { name: new RegExp(`^${tab}`) }).getAttribute('aria-selected'), SIGNED_IN_WAIT).toBe('true');
    }
    await page.getByRole('tab', { name: /^People/ }).click();
    await page.getByLabel('Search by name or e-mail').fill('Marta');
    await page.getByText('mentor@example.test').waitFor();
    await shot(page, 'steward-desk-people-phone');
    expect(await axeProblems(page)).toEqual([]);
    // A mentor's line leads to their track record.
    await page.getByRole('link', { name: 'track record of Marta Veldhoen', exact: true }).click();
    await expect.poll(() => page.getByRole('heading', { level: 1, name: 'Marta Veldhoen' }).isVisible(), SIGNED_IN_WAIT).toBe(true);
    await expect.poll(() => page.getByRole('heading', { name: 'Track record' }).isVisible(), SIGNED_IN_WAIT).toBe(true);
    await context.close();
  });
});
