// The mentor profile as a grower reaches it: from the mentor's name on their own case page, to
// the mentor's track record and the field notes of cases they closed, each card led by its
// title, and on to the note itself. Read-only on the demo community.
import { describe, expect, test } from 'vitest';
import type { Page } from 'playwright-core';
import { REMEDIES, labelOf } from '@shared/vocabulary';
import { DESKTOP, PHONE, shot, signIn, useBrowser } from './browser';

const chromium = useBrowser();
const WAIT = { timeout: 15_000 };

interface CaseItem {
  id: number;
  status: string;
  title: string;
  mentor: { id: number; displayName: string } | null;
}
interface Profile {
  displayName: string;
  recentNotes: { slug: string; title: string; remedy: string | null }[];
}

async function json<T>(page: Page, path: string): Promise<T> {
  const res = await page.request.get(path);
  expect(res.status()).toBe(200);
  return (await res.json()) as T;
}

describe('mentor profile', () => {
  for (const [name, device] of [
    ['desktop', DESKTOP],
    ['phone', PHONE],
  ] as const) {
    test(`when a grower on a ${name} follows their mentor's name on the case page, then the mentor's track record shows and each recent field note leads with its title`, async () => {
      const page = await chromium.newPage(device);
      await signIn(page, 'grower@example.test');
      await page.waitForURL((url) => url.pathname !== '/sign-in', WAIT);
      const { items } = await json<{ items: CaseItem[] }>(page, '/api/cases?mine=true');
      const held = items.find((c) => c.mentor !== null && c.status === 'in_conversation');
      expect(held, 'the demo grower has a case in conversation with a mentor').toBeDefined();
      const mentor = held!.mentor!;

      await page.goto(`/cases/${held!.id}`);
      await expect.poll(() => page.getByRole('heading', { level: 1, name: held!.title }).isVisible(), WAIT).toBe(true);
      await page.getByText(/^Opened /).getByRole('link', { name: mentor.displayName, exact: true }).click();

      await page.waitForURL(`**/mentors/${mentor.id}`, WAIT);
      await expect.poll(() => page.getByRole('heading', { level: 1, name: mentor.displayName }).isVisible(), WAIT).toBe(true);
      await expect.poll(() => page.getByRole('heading', { name: 'Track record' }).isVisible(), WAIT).toBe(true);
      const profile = await json<Profile>(page, `/api/mentors/${mentor.id}`);
      expect(profile.recentNotes.length).toBeGreaterThan(0);

      const cards = page.getByRole('region', { name: 'Recent field notes' }).getByRole('listitem').filter({ has: page.getByRole('link') });
      await expect.poll(() => cards.count(), WAIT).toBe(profile.recentNotes.length);
      for (const [i, note] of profile.recentNotes.entries()) {
        const card = cards.nth(i);
        // The title is the card's first line; the remedy is named as what was done.
        expect((await card.innerText()).split('\n')[0]).toBe(note.title);
        if (note.remedy) await expect.poll(() => card.innerText()).toContain(`What was done: ${labelOf(REMEDIES, note.remedy)}`);
      }
      await shot(page, `mentor-profile-${name}`);

      const first = profile.recentNotes[0];
      await cards.first().getByRole('link', { name: first.title }).click();
      await page.waitForURL(`**/library/${first.slug}`, WAIT);
      await expect.poll(() => page.getByRole('heading', { level: 1, name: first.title }).isVisible(), WAIT).toBe(true);
    });

    test(`when a mentor on a ${name} looks for their own track record, then the rounds page links it${name === 'phone' ? ', and so does the menu' : ''}`, async () => {
      const page = await chromium.newPage(device);
      await signIn(page, 'mentor@example.test');
      await page.waitForURL((url) => url.pathname !== '/sign-in', WAIT);
      const me = await json<{ id: number; displayName: string }>(page, '/api/auth/me');
      const mine = async () => {
        await page.waitForURL(`**/mentors/${me.id}`, WAIT);
        await expect.poll(() => page.getByRole('heading', { level: 1, name: me.displayName }).isVisible(), WAIT).toBe(true);
        await expect.poll(() => page.getByRole('heading', { name: 'Track record' }).isVisible(), WAIT).toBe(true);
      };
      await page.goto('/rounds');
      await page.getByRole('link', { name: 'Your track record', exact: true }).click();
      await mine();
      if (name === 'phone') {
        await page.goto('/library');
        await page.getByRole('button', { name: 'Menu', exact: true }).click();
        await page.getByRole('link', { name: 'your track record', exact: true }).click();
        await mine();
      }
    });
  }
});
