import { describe, expect, test } from 'vitest';
import type { Page } from 'playwright-core';
import { DESKTOP, PHONE, shot, signIn, useBrowser } from './browser';

const chromium = useBrowser();

async function signedInPage(email: string, device: typeof PHONE | typeof DESKTOP): Promise<Page> {
  const page = await chromium.newPage(device);
  await signIn(page, email);
  await expect.poll(() => new URL(page.url()).pathname, WAIT).not.toBe('/sign-in');
  return page;
}

const TITLE = 'Plum juice foaming over the rim';
// Generous: a loaded machine can take seconds to hash a password or build a page.
const WAIT = { timeout: 20_000 };

describe('closing a case into the Field Library', () => {
  test('when the demo mentor closes a case and the demo grower reports from the e-mail link, then a visitor finds the field note by a misspelt word', async () => {
    // The demo grower opens a case (through the API, as the open-case form would).
    const grower = await signedInPage('grower@example.test', PHONE);
    const opened = await grower.request.post('/api/cases', {
      data: {
        stage: 'FFJ',
        symptoms: ['bubbling', 'smell-alcoholic'],
        title: TITLE,
        description: 'Rowan here. Two kilos of ripe plums packed with sugar, day 3. Pink-purple foam is climbing out under the cloth on the shelf by the stove.',
      },
    });
    expect(opened.status()).toBe(201);
    const caseId: number = (await opened.json()).id;

    // The demo mentor takes it and closes it on the case page.
    const mentor = await signedInPage('mentor@example.test', DESKTOP);
    expect((await mentor.request.post(`/api/cases/${caseId}/claim`)).status()).toBe(200);
    await mentor.goto(`/cases/${caseId}`);
    await mentor.getByRole('button', { name: 'Close the case…' }).click();
    await mentor.getByLabel('Likely cause').selectOption('too-warm');
    await mentor.getByLabel('Remedy to try').selectOption('move-cooler');
    await mentor.getByLabel('How to do it (optional)').fill('Carry the jar to the cool back porch, skim the foam, check again tomorrow.');
    await mentor.getByLabel('Summary in plain words').fill('The plum juice was foaming because the shelf by the stove is too warm. Moved somewhere cool it should settle within a day or two.');
    await mentor.getByRole('button', { name: 'Close and start watching' }).click();
    await expect.poll(() => mentor.getByText('Closed: the case is now watching').isVisible(), WAIT).toBe(true);
    await shot(mentor, 'closing-case-closed-desktop');

    // The grower's e-mail, as the local mail catcher holds it (read as the demo steward).
    const steward = await signedInPage('steward@example.test', DESKTOP);
    let link: string | undefined;
    await expect
      .poll(
        async () => {
          const mail = (await (await steward.request.get('/api/steward/mail?pageSize=50')).json()) as { items: { to: string; subject: string; text: string }[] };
          const closed = mail.items.find((m) => m.to.includes('grower@example.test') && m.subject.includes(TITLE));
          link = closed?.text.match(/https?:\/\/\S+\/cases\/\d+\/recovery-report/)?.[0];
          return link;
        },
        WAIT,
      )
      .toBeTruthy();
    const reportPath = new URL(link!).pathname;
    expect(reportPath).toBe(`/cases/${caseId}/recovery-report`);

    // The grower follows the link on a phone and files the report, agreeing to share it.
    await grower.goto(reportPath);
    await expect.poll(() => grower.getByRole('heading', { name: 'How did the batch do?' }).isVisible(), WAIT).toBe(true);
    await shot(grower, 'recovery-report-phone');
    await grower.getByRole('radio', { name: /Recovered/ }).check();
    await grower.getByRole('radio', { name: /^5 stars/ }).check({ force: true });
    await grower.getByLabel('Anything to add? (optional)').fill('Settled overnight on the porch. Thank you Marta!');
    await grower.getByRole('checkbox', { name: /Share this case in the Field Library/ }).check();
    await grower.getByRole('button', { name: 'Send the report' }).click();
    await expect.poll(() => grower.getByRole('heading', { name: 'Thank you, the report is in' }).isVisible(), WAIT).toBe(true);
    await expect.poll(() => grower.getByRole('link', { name: 'Read the field note' }).isVisible(), WAIT).toBe(true);
    await shot(grower, 'recovery-report-filed-phone');

    // A visitor, not signed in, finds it by misspelt words.
    for (const [name, device] of [['desktop', DESKTOP], ['phone', PHONE]] as const) {
      const visitor = await chromium.newPage(device);
      await visitor.goto('/library');
      await visitor.getByRole('searchbox', { name: 'Search in your own words' }).fill('plumm foamng');
      await visitor.getByRole('button', { name: 'Search' }).click();
      const result = visitor.getByRole('link', { name: TITLE });
      await expect.poll(() => result.isVisible(), WAIT).toBe(true);
      await shot(visitor, `library-misspelt-search-${name}`);
      await result.click();
      await expect.poll(() => visitor.getByRole('heading', { level: 1, name: TITLE }).isVisible(), WAIT).toBe(true);
      await expect.poll(() => visitor.getByRole('heading', { name: 'Stay safe with living cultures' }).isVisible(), WAIT).toBe(true);
      const text = await visitor.locator('main').innerText();
      // The grower's name, e-mail and the mentor's name never reach the public page.
      for (const secret of ['Rowan', 'Tillsworth', 'grower@example.test', 'Marta', 'Veldhoen']) expect(text).not.toContain(secret);
      expect(text).toContain('The grower here.');
      await shot(visitor, `field-note-${name}`);
    }
  });
});
