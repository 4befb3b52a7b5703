// Accessibility (issue: proof): axe-core, injected from its own source, on every main screen of
// PRODUCT.md and client/src/app/router.tsx, signed out and signed in as fits, at desktop and phone
// size: no serious or critical violations. Screens that open on the page (the closing form, the
// photo viewer, each steward desk tab, a filled-in case form) are checked open.
import { createRequire } from 'node:module';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import sharp from 'sharp';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { DESKTOP, launch, newContext, PHONE } from './browser';
import { freshPerson, signInByApi, stamp, type FreshPerson } from './fresh-people';

const require = createRequire(import.meta.url);
const AXE_SOURCE: string = require('axe-core').source;
const WAIT = { timeout: 20_000 };

let browser: Browser;

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

/** Nothing on the page says it is still loading (a spinner, a busy region, the route bar). */
async function quiet(page: Page): Promise<void> {
  await expect
    .poll(() => page.evaluate(() => document.querySelectorAll('[aria-busy="true"], .motion-safe\\:animate-spin, .motion-safe\\:animate-pulse').length), WAIT)
    .toBe(0);
}

async function settle(page: Page, path: string): Promise<void> {
  await page.goto(path);
  await page.locator('main h1').first().waitFor(WAIT);
  await quiet(page);
}

/** What one person sees: each screen opened (and, where given, brought to a state) and checked. */
interface Screen {
  path: string;
  /** what is done on the screen before the check, e.g. opening a dialog; named in failures */
  then?: { what: string; act: (page: Page) => Promise<void> };
}

async function checkScreens(page: Page, screens: Screen[]): Promise<string[]> {
  const found: string[] = [];
  for (const screen of screens) {
    await settle(page, screen.path);
    if (screen.then) await screen.then.act(page);
    const where = screen.then ? `${screen.path} (${screen.then.what})` : screen.path;
    for (const v of await seriousViolations(page)) found.push(`${where}: ${v}`);
  }
  return found;
}

// Data of this file's own, so the screens have something to show and nothing is shared.
let grower: FreshPerson;
let mentor: FreshPerson;
let batchId: number;
/** open, with a photo, claimed by the fresh mentor: the grower's case page and the mentor's closing form */
let openCaseId: number;
/** closed by the fresh mentor, watching: the recovery report form */
let watchingCaseId: number;
let noteSlug: string;
let guideSlug: string;

beforeAll(async () => {
  browser = await launch();
  const run = stamp();
  [grower, mentor] = await Promise.all([freshPerson(browser, 'grower', 'Bryony'), freshPerson(browser, 'mentor', 'Osric')]);
  const setup: BrowserContext[] = [await newContext(browser), await newContext(browser)];
  try {
    const [asGrower, asMentor] = setup.map((c) => c.request);
    await signInByApi(setup[0], grower.email, grower.password);
    await signInByApi(setup[1], mentor.email, mentor.password);

    const batch = await asGrower.post('/api/batches', {
      data: { stage: 'LAB', label: `Rice-wash serum, bottle 2 (${run})`, madeOn: '2026-01-10', culture: { value: 500, unit: 'g' }, sugar: { value: 500, unit: 'g' } },
    });
    expect(batch.status()).toBe(201);
    batchId = ((await batch.json()) as { id: number }).id;

    const open = async (title: string) => {
      const res = await asGrower.post('/api/cases', {
        data: { batchId, stage: 'LAB', symptoms: ['smell-sour', 'wet-sloppy'], title, description: 'The serum went cloudy with a grey film on top after a warm week.' },
      });
      expect(res.status()).toBe(201);
      return ((await res.json()) as { id: number }).id;
    };
    openCaseId = await open(`Grey film on the serum (${run})`);
    watchingCaseId = await open(`Cloudy serum after a warm week (${run})`);

    const photo = await sharp({ create: { width: 480, height: 360, channels: 3, background: { r: 200, g: 190, b: 160 } } }).jpeg().toBuffer();
    const uploaded = await asGrower.post(`/api/cases/${openCaseId}/photos`, { multipart: { photos: { name: 'bottle.jpg', mimeType: 'image/jpeg', buffer: photo } } });
    expect(uploaded.ok()).toBe(true);

    for (const id of [openCaseId, watchingCaseId]) expect((await asMentor.post(`/api/cases/${id}/claim`)).status()).toBe(200);
    const closed = await asMentor.post(`/api/cases/${watchingCaseId}/close`, {
      data: { cause: 'too-warm', remedy: 'move-cooler', summary: 'A warm week let yeasts take over; keep the bottle somewhere cool and watch the film.' },
    });
    expect(closed.ok()).toBe(true);

    const library = async (kind: string) => {
      const res = await asGrower.get(`/api/library?kind=${kind}&pageSize=1`);
      const first = ((await res.json()) as { items: { slug: string }[] }).items[0];
      if (!first) throw new Error(`The Field Library has no ${kind} to check.`);
      return first.slug;
    };
    noteSlug = await library('note');
    guideSlug = await library('guide');
  } finally {
    for (const context of setup) await context.close();
  }
});

afterAll(async () => {
  await browser?.close();
});

const openPhoto = {
  what: 'photo viewer open',
  act: async (page: Page) => {
    await page.getByRole('list', { name: 'Photos of the batch' }).getByRole('button').first().click();
    await page.getByRole('dialog').waitFor(WAIT);
  },
};

const fillCaseForm = {
  what: 'signs ticked and weights typed',
  act: async (page: Page) => {
    await page.getByLabel('Stage').selectOption('IMO2');
    await page.getByRole('checkbox', { name: /^Putrid or rotten/ }).check();
    await page.getByRole('checkbox', { name: /^Bubbling or foaming/ }).check();
    await page.getByLabel('Culture weight, amount').fill('900');
    await page.getByLabel('Sugar weight, amount').fill('300');
    await page.getByRole('figure', { name: 'Water activity picture' }).waitFor(WAIT);
    await page.getByText('This batch should be discarded, not rescued').waitFor(WAIT);
    // Batches like this: asked for once the typing pauses; a list, or word that nothing is close.
    const similar = page.getByRole('list', { name: /like this one, closest first$/ }).or(page.getByText(/^No resolved case is close/));
    await similar.first().waitFor(WAIT);
    await quiet(page);
  },
};

// Opened, not sent: the demo note stays in the library.
const openTakeDown = {
  what: 'the steward’s take-down dialog open',
  act: async (page: Page) => {
    await page.getByRole('button', { name: 'Take it out of the library' }).click();
    await page.getByLabel('Why does it come out?').waitFor(WAIT);
  },
};

const openClosingForm = {
  what: 'closing form open',
  act: async (page: Page) => {
    await page.getByRole('button', { name: 'Close the case…' }).click();
    await page.getByLabel('Likely cause').waitFor(WAIT);
  },
};

type Who = 'visitor' | 'grower' | 'mentor' | 'steward';
const PEOPLE: { who: Who; screens: () => Screen[] }[] = [
  {
    who: 'visitor',
    screens: () => [
      { path: '/' },
      { path: '/sign-in' },
      { path: '/join' },
      { path: '/forgot-password' },
      { path: '/reset-password?token=not-a-real-token' },
      { path: '/verify-email?token=not-a-real-token' },
      { path: '/library' },
      { path: '/library?q=sour+serum&stage=LAB' },
      { path: `/library/${guideSlug}` },
      { path: `/library/${noteSlug}` },
      // A page for members only: the visitor is sent to sign in.
      { path: '/batches' },
      { path: '/no-such-page' },
    ],
  },
  {
    who: 'grower',
    screens: () => [
      { path: '/' },
      { path: '/batches' },
      { path: '/batches/new' },
      { path: `/batches/${batchId}` },
      { path: `/batches/${batchId}/edit` },
      { path: `/batches/${batchId}/label` },
      { path: '/cases/new', then: fillCaseForm },
      // about a batch whose case is still open: the notice leading back to it
      { path: `/cases/new?batch=${batchId}` },
      { path: `/cases/${openCaseId}` },
      { path: `/cases/${openCaseId}`, then: openPhoto },
      { path: `/cases/${watchingCaseId}` },
      { path: `/cases/${watchingCaseId}/recovery-report` },
      { path: `/mentors/${mentor.id}` },
      { path: '/apply-to-mentor' },
      { path: '/account' },
      { path: '/batches?off=1' },
    ],
  },
  {
    who: 'mentor',
    screens: () => [
      { path: '/rounds' },
      { path: `/cases/${openCaseId}`, then: openClosingForm },
      { path: `/mentors/${mentor.id}` },
      { path: '/account' },
    ],
  },
  {
    who: 'steward',
    // The desk last: its tabs are checked on the page it leaves open.
    screens: () => [{ path: `/library/${noteSlug}`, then: openTakeDown }, { path: '/steward' }],
  },
];

describe('axe on the main screens', () => {
  test('when a screen has a button without a name, then the check reports it (the check itself works)', async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    try {
      await settle(page, '/');
      await page.evaluate(() => document.querySelector('main')!.append(document.createElement('button')));
      expect(await seriousViolations(page)).toEqual([expect.stringMatching(/^button-name \(critical\)/)]);
    } finally {
      await context.close();
    }
  });

  for (const [name, device] of [['desktop', DESKTOP], ['phone', PHONE]] as const) {
    for (const { who, screens } of PEOPLE) {
      test(`when ${who === 'visitor' ? 'a visitor' : `a ${who}`} opens each of their screens on a ${name}, then axe finds nothing serious or critical`, async () => {
        const context = await newContext(browser, device);
        const page = await context.newPage();
        try {
          if (who === 'grower') await signInByApi(context, grower.email, grower.password);
          if (who === 'mentor') await signInByApi(context, mentor.email, mentor.password);
          // The demo steward only reads here; nothing is changed.
          if (who === 'steward') await signInByApi(context, 'steward@example.test');
          const found = await checkScreens(page, screens());
          if (who === 'steward') {
            // Every tab of the desk, each with its own panel.
            const tabs = page.getByRole('tab');
            const count = await tabs.count();
            expect(count).toBeGreaterThan(1);
            for (let i = 0; i < count; i += 1) {
              const tab = tabs.nth(i);
              const label = (await tab.textContent())?.trim();
              await tab.click();
              await expect.poll(() => tab.getAttribute('aria-selected'), WAIT).toBe('true');
              await quiet(page);
              for (const v of await seriousViolations(page)) found.push(`/steward (${label} tab): ${v}`);
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
