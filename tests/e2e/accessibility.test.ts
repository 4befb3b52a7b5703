// Accessibility (issue: proof): axe-core, injected from its own source, on every main screen,
// signed out and signed in, at desktop and phone size: no serious or critical violations.
import { createRequire } from 'node:module';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { DESKTOP, launch, newContext, PHONE, signIn } from './browser';

const require = createRequire(import.meta.url);
const AXE_SOURCE: string = require('axe-core').source;

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function seriousViolations(page: Page): Promise<string[]> {
  // Evaluated through the DevTools protocol: the app's CSP (rightly) refuses inline scripts.
  await page.evaluate(AXE_SOURCE);
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: { id: string; impact: string; nodes: { target: string[] }[] }[] }> } }).axe;
    const result = await axe.run(document, { resultTypes: ['violations'] });
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, targets: v.nodes.slice(0, 3).map((n) => n.target.join(' ')) }));
  });
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.id} (${v.impact}): ${v.targets.join(', ')}`);
}

async function settle(page: Page, path: string): Promise<void> {
  await page.goto(path);
  await page.waitForLoadState('networkidle');
  await page.locator('main h1').first().waitFor({ timeout: 15_000 });
}

const SCREENS: { who: 'visitor' | 'grower@example.test' | 'mentor@example.test' | 'steward@example.test'; paths: string[] }[] = [
  { who: 'visitor', paths: ['/', '/sign-in', '/join', '/forgot-password', '/library', '/library/safety'] },
  { who: 'grower@example.test', paths: ['/batches', '/batches/new', '/cases/new'] },
  { who: 'mentor@example.test', paths: ['/rounds'] },
  { who: 'steward@example.test', paths: ['/steward'] },
];

describe('axe on the main screens', () => {
  for (const [name, device] of [['desktop', DESKTOP], ['phone', PHONE]] as const) {
    for (const { who, paths } of SCREENS) {
      test(`when ${who === 'visitor' ? 'a visitor' : who.split('@')[0]} opens ${paths.join(', ')} on a ${name}, then axe finds nothing serious or critical`, async () => {
        const context = await newContext(browser, device);
        const page = await context.newPage();
        try {
          if (who !== 'visitor') {
            await signIn(page, who);
            await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
          }
          const found: string[] = [];
          for (const path of paths) {
            await settle(page, path);
            for (const v of await seriousViolations(page)) found.push(`${path}: ${v}`);
          }
          // The case page of one of the grower's own cases, and its batch page.
          if (who === 'grower@example.test') {
            await settle(page, '/batches');
            const batchLink = page.locator('main a[href^="/batches/"]').filter({ hasNotText: /label|add/i }).first();
            await settle(page, (await batchLink.getAttribute('href'))!);
            for (const v of await seriousViolations(page)) found.push(`batch page: ${v}`);
            const cases = await page.evaluate(() => fetch('/api/cases?mine=1').then((r) => r.json()));
            const first = (cases as { items: { id: number }[] }).items[0];
            if (first) {
              await settle(page, `/cases/${first.id}`);
              for (const v of await seriousViolations(page)) found.push(`case page: ${v}`);
            }
          }
          expect(found).toEqual([]);
        } finally {
          await context.close();
        }
      });
    }
  }
});
