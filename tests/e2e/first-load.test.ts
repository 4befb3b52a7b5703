import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { baseUrl, launch, newContext, PHONE, signIn } from './browser';

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

  test('when a signed-in grower opens a case or "Open a case" by its address, then what is below the page\'s text and the live connection are fetched only after that text is painted', async () => {
    const context = await newContext(browser, PHONE);
    const first = await context.newPage();
    await signIn(first, 'grower@example.test');
    await expect.poll(() => new URL(first.url()).pathname, SOON).toBe('/batches');
    const [someCase] = await (await first.request.get('/api/cases?mine=1&status=all&pageSize=1')).json().then((b: { items: { id: number }[] }) => b.items);
    expect(someCase).toBeDefined();

    // Each page: the part that must wait, found by its chunk's name, and what shows once it came.
    const pages = [
      { path: '/cases/new', later: [/\/assets\/open-case-form-[^/]+\.js$/, /\/assets\/socket-io-[^/]+\.js$/], ready: (page: Page) => page.getByLabel('Describe it in your own words').isVisible() },
      { path: `/cases/${someCase.id}`, later: [/\/assets\/case-thread-[^/]+\.js$/, /\/assets\/close-case-panel-[^/]+\.js$/, /\/assets\/socket-io-[^/]+\.js$/], ready: (page: Page) => page.getByRole('heading', { name: 'Conversation' }).isVisible() },
    ];
    for (const { path: address, later, ready } of pages) {
      const page = await context.newPage();
      const seen = watch(page);
      await page.goto(address);
      await expect.poll(() => ready(page), SOON).toBe(true);
      // The page's own text painted first (the largest-paint entries of the page's main content,
      // not of the "Opening Sporewell…" spinner), and when each script was asked for.
      const timing = await page.evaluate(
        () =>
          new Promise<{ painted: number[]; fetched: { name: string; at: number }[] }>((resolve) => {
            new PerformanceObserver((list, observer) => {
              observer.disconnect();
              const painted = list
                .getEntries()
                .filter((e) => {
                  const element = (e as PerformanceEntry & { element: Element | null }).element;
                  return element?.closest('main') && !element.closest('[role="status"]');
                })
                .map((e) => e.startTime);
              const fetched = performance.getEntriesByType('resource').map((e) => ({ name: new URL(e.name).pathname, at: e.startTime }));
              resolve({ painted, fetched });
            }).observe({ type: 'largest-contentful-paint', buffered: true });
          }),
      );
      expect(timing.painted.length, `a paint of ${address}'s text`).toBeGreaterThan(0);
      const textPainted = Math.min(...timing.painted);
      for (const chunk of later) {
        const fetched = timing.fetched.find((f) => chunk.test(f.name));
        expect(fetched, `${chunk} on ${address}`).toBeDefined();
        expect(fetched!.at, `${fetched!.name} asked for before ${address}'s text was painted`).toBeGreaterThan(textPainted);
      }
      expect(seen.errors).toEqual([]);
      await page.close();
    }
    await context.close();
  });

  test('when the scripts of a page are fetched, then each goes as the brotli or gzip copy of the build that the browser accepts, and as it is to one that accepts neither', async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    const scripts: string[] = [];
    page.on('response', (response) => {
      if (new URL(response.url()).pathname.endsWith('.js')) scripts.push(new URL(response.url()).pathname);
    });
    await page.goto('/');
    await expect.poll(() => page.getByRole('link', { name: 'Sign in' }).filter({ visible: true }).count(), SOON).toBeGreaterThan(0);
    await context.close();
    // The entry, the largest script on every page.
    const entry = scripts.find((p) => /\/assets\/index-[^/]+\.js$/.test(p));
    expect(entry).toBeDefined();
    // The bytes as sent (fetch would undo the encoding).
    const raw = (acceptEncoding: string) =>
      new Promise<{ encoding: string | undefined; headers: http.IncomingHttpHeaders; body: Buffer }>((resolve, reject) => {
        http.get(`${baseUrl()}${entry}`, { headers: { 'Accept-Encoding': acceptEncoding } }, (res) => {
          const parts: Buffer[] = [];
          res.on('data', (c: Buffer) => parts.push(c));
          res.on('end', () => resolve({ encoding: res.headers['content-encoding'], headers: res.headers, body: Buffer.concat(parts) }));
        }).on('error', reject);
      });
    // What Chromium asks with.
    const chromium = await raw('gzip, deflate, br, zstd');
    const gzipOnly = await raw('gzip');
    const plain = await raw('identity');
    expect(chromium.encoding).toBe('br');
    expect(gzipOnly.encoding).toBe('gzip');
    expect(plain.encoding).toBeUndefined();
    // The copies the build wrote (vite.config.ts, precompress), not compressed again per request.
    expect(chromium.body.equals(fs.readFileSync(path.resolve('dist/client', `.${entry}.br`)))).toBe(true);
    expect(gzipOnly.body.equals(fs.readFileSync(path.resolve('dist/client', `.${entry}.gz`)))).toBe(true);
    // The same script every way, and the copies smaller than the script.
    expect(brotliDecompressSync(chromium.body).equals(plain.body)).toBe(true);
    expect(gunzipSync(gzipOnly.body).equals(plain.body)).toBe(true);
    expect(chromium.body.length).toBeLessThan(gzipOnly.body.length);
    expect(gzipOnly.body.length).toBeLessThan(plain.body.length / 2);
    // Caches keep one copy per encoding, for a year (the name changes with the content).
    expect(chromium.headers.vary).toContain('Accept-Encoding');
    expect(chromium.headers['cache-control']).toContain('immutable');
    expect(Number(chromium.headers['content-length'])).toBe(chromium.body.length);
  });
});
