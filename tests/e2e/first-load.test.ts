import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, newContext, signIn } from './browser';

let browser: Browser;
// Sign-in (argon2) and the first pages of a fresh server are slow on a loaded machine.
const SOON = { timeout: 15_000 };

beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** Every /api path the page asks for, and every console error, from now on. */
function watch(page: Page): { api: string[]; errors: string[] } {
  const seen = { api: [] as string[], errors: [] as string[] };
  page.on('request', (request) => {
    const url = new URL(request.url());
    if (url.pathname.startsWith('/api/')) seen.api.push(url.pathname);
  });
  page.on('console', (message) => {
    if (message.type() === 'error') seen.errors.push(message.text());
  });
  page.on('pageerror', (error) => seen.errors.push(error.message));
  return seen;
}

describe('the first page a browser opens', () => {
  test('when a signed-in grower opens "Open a case" by its address, then it shows without asking who is signed in', async () => {
    const context = await newContext(browser);
    const first = await context.newPage();
    await signIn(first, 'grower@example.test');
    await expect.poll(() => new URL(first.url()).pathname, SOON).toBe('/batches');

    const page = await context.newPage();
    const seen = watch(page);
    const response = await page.goto('/cases/new');
    // The page names the person: no cache may keep it.
    expect(response?.headers()['cache-control']).toBe('no-store');
    await expect.poll(() => page.getByRole('heading', { level: 1, name: 'Open a case' }).isVisible(), SOON).toBe(true);
    await expect.poll(() => page.getByRole('banner').getByText('Rowan Tillsworth').filter({ visible: true }).count(), SOON).toBeGreaterThan(0);
    expect(seen.api).not.toContain('/api/auth/me');
    expect(seen.errors).toEqual([]);
    await context.close();
  });

  test('when a visitor opens the landing page, then nothing is asked of the API and the console stays clean', async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    const seen = watch(page);
    await page.goto('/');
    await expect.poll(() => page.getByRole('link', { name: 'Sign in' }).filter({ visible: true }).count(), SOON).toBeGreaterThan(0);
    // Before, a visitor's page asked /api/auth/me and logged its 401 as an error.
    expect(seen.api).toEqual([]);
    expect(seen.errors).toEqual([]);
    await context.close();
  });

  test('when a visitor opens a signed-in page by its address, then they are sent to sign in', async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    await page.goto('/cases/new');
    await expect.poll(() => page.url(), SOON).toContain('/sign-in?next=%2Fcases%2Fnew');
    await context.close();
  });
});
