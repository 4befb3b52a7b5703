// ASVS 1.2.1 / 1.3.1: output is encoded. A <script> and an onerror image in a case's title,
// description and a thread message are shown as text on every screen that shows them, and run
// nowhere: the grower's case page and batch shelf, the mentor's rounds and case page; and the
// lines a mentor writes about themselves, on their profile as a grower reads it.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { baseUrl, launch, newContext, signIn } from './browser';
import { freshPerson, signInByApi } from './fresh-people';

const PAYLOAD = `<script>window.__xss = 1</script><img src=x onerror="window.__xss = 2">`;
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function expectInert(page: Page, where: string): Promise<void> {
  await page.waitForLoadState('networkidle');
  expect(await page.evaluate(() => (window as unknown as { __xss?: number }).__xss), `${where}: script ran`).toBeUndefined();
  expect(await page.locator('main img[src="x"]').count(), `${where}: markup was rendered`).toBe(0);
}

describe('a script in a case and a message', () => {
  test('when a grower writes markup into a case and the thread, then every screen shows it as text and nothing runs', async () => {
    const growerContext = await newContext(browser);
    const grower = await growerContext.newPage();
    const email = `xss-${Date.now()}@example.test`;
    await grower.goto('/');
    const joined = await grower.evaluate(
      async ({ email, origin }) => {
        const res = await fetch('/api/auth/register', {
          method: 'POST',
          headers: { 'Content-Type': 'application/json', Origin: origin },
          body: JSON.stringify({ email, password: 'a-long-test-password-for-xss', displayName: 'Markup Tester' }),
        });
        return res.status;
      },
      { email, origin: baseUrl() },
    );
    expect(joined).toBe(201);
    const caseId = await grower.evaluate(async (payload) => {
      const res = await fetch('/api/cases', {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ stage: 'IMO2', symptoms: ['bubbling'], title: `Jar ${payload}`, description: `It says ${payload}` }),
      });
      const body = (await res.json()) as { id: number };
      await fetch(`/api/cases/${body.id}/messages`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ clientId: `xss${Date.now()}abcdef`, body: `Message ${payload}` }),
      });
      return body.id;
    }, PAYLOAD);

    await grower.goto(`/cases/${caseId}`);
    await grower.getByText('Message <script>', { exact: false }).first().waitFor({ timeout: 15_000 });
    await expectInert(grower, 'case page (grower)');
    expect(await grower.getByText('<script>window.__xss = 1</script>', { exact: false }).count()).toBeGreaterThan(0);
    await grower.goto('/batches');
    await expectInert(grower, 'batch shelf');

    const mentorContext = await newContext(browser);
    const mentor = await mentorContext.newPage();
    await signIn(mentor, 'mentor@example.test');
    await mentor.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    await mentor.goto('/rounds?sort=newest');
    await mentor.getByText('Jar <script>', { exact: false }).first().waitFor({ timeout: 15_000 });
    await expectInert(mentor, 'rounds');
    await mentor.goto(`/cases/${caseId}`);
    await mentor.getByText('Message <script>', { exact: false }).first().waitFor({ timeout: 15_000 });
    await expectInert(mentor, 'case page (mentor)');
    await mentorContext.close();
    // Leave the shared demo rounds as they were for the other browser tests.
    const withdrawn = await grower.evaluate(async (id) => {
      const res = await fetch(`/api/cases/${id}/status`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ status: 'withdrawn' }) });
      return res.status;
    }, caseId);
    expect(withdrawn).toBe(200);
    await growerContext.close();
  });

  test("when a mentor writes markup into what growers read about them, then their profile shows it as text and nothing runs", async () => {
    const mentor = await freshPerson(browser, 'mentor', 'Xanthe');
    const mentorContext = await newContext(browser);
    await signInByApi(mentorContext, mentor.email, mentor.password);
    const saved = await mentorContext.request.patch('/api/mentors/me', { data: { about: `About <script> ${PAYLOAD}` } });
    expect(saved.status()).toBe(200);
    await mentorContext.close();

    const growerContext = await newContext(browser);
    await signInByApi(growerContext, 'grower@example.test');
    const grower = await growerContext.newPage();
    await grower.goto(`/mentors/${mentor.id}`);
    await grower.getByText('About <script>', { exact: false }).first().waitFor({ timeout: 15_000 });
    await expectInert(grower, 'mentor profile');
    await growerContext.close();
  });
});
