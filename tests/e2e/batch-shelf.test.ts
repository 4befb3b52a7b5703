// The batch shelf as the demo grower sees it: a batch with a case still open leads back to that
// case, and opening a second one is offered as such (its form says so again and links the case);
// a batch without one offers to open a case.
// Read-only on the demo community.
import { describe, expect, test } from 'vitest';
import { DESKTOP, PHONE, signIn, useBrowser } from './browser';

const chromium = useBrowser();
const WAIT = { timeout: 15_000 };

interface ShelfItem {
  id: number;
  label: string;
  openCase: { id: number; title: string; status: string } | null;
}

describe('batch shelf', () => {
  for (const [name, device] of [
    ['desktop', DESKTOP],
    ['phone', PHONE],
  ] as const) {
    test(`when a grower on a ${name} has a batch with a case still open, then the shelf leads back to that case and offers "Open another case"; other batches offer "Open a case"`, async () => {
      const page = await chromium.newPage(device);
      await signIn(page, 'grower@example.test');
      await page.waitForURL((url) => url.pathname !== '/sign-in', WAIT);
      const res = await page.request.get('/api/batches');
      expect(res.status()).toBe(200);
      const { items } = (await res.json()) as { items: ShelfItem[] };
      const withCase = items.find((b) => b.openCase !== null);
      const without = items.find((b) => b.openCase === null);
      expect(withCase && without, 'the demo grower has batches with and without an open case').toBeTruthy();

      await page.goto('/batches');
      await expect.poll(() => page.getByRole('heading', { level: 1, name: 'Batch shelf' }).isVisible(), WAIT).toBe(true);
      const another = page.getByRole('link', { name: `Open another case about ${withCase!.label}`, exact: true });
      await expect.poll(() => another.isVisible(), WAIT).toBe(true);
      expect(await page.getByRole('link', { name: `Open a case about ${withCase!.label}`, exact: true }).count()).toBe(0);
      await expect.poll(() => page.getByRole('link', { name: `Open a case about ${without!.label}`, exact: true }).isVisible(), WAIT).toBe(true);
      expect(await page.getByRole('link', { name: `Open another case about ${without!.label}`, exact: true }).count()).toBe(0);

      // The way back is the case's own title, right on the shelf; it opens at the conversation,
      // where new signs are told.
      const composer = page.getByRole('textbox', { name: /^Write to / });
      await page.getByRole('link', { name: withCase!.openCase!.title, exact: true }).first().click();
      await page.waitForURL(`**/cases/${withCase!.openCase!.id}#conversation`, WAIT);
      await expect.poll(() => page.getByRole('heading', { level: 1, name: withCase!.openCase!.title }).count(), WAIT).toBe(1);
      await expect.poll(() => composer.isVisible(), WAIT).toBe(true);
      await expect.poll(() => composer.evaluate((el) => { const r = el.getBoundingClientRect(); return r.top >= 0 && r.bottom <= window.innerHeight; }), WAIT).toBe(true);

      // Choosing to open another: the form says a case is open and leads back to it as well.
      await page.goBack();
      await another.click();
      await page.waitForURL(`**/cases/new?batch=${withCase!.id}`, WAIT);
      const notice = page.getByRole('region', { name: 'This batch already has a case open' });
      await expect.poll(() => notice.isVisible(), WAIT).toBe(true);
      await notice.getByRole('link', { name: withCase!.openCase!.title, exact: true }).click();
      await page.waitForURL(`**/cases/${withCase!.openCase!.id}#conversation`, WAIT);
      await expect.poll(() => composer.evaluate((el) => { const r = el.getBoundingClientRect(); return r.top >= 0 && r.bottom <= window.innerHeight; }), WAIT).toBe(true);

      // The batch's own page says the same.
      await page.goto(`/batches/${withCase!.id}`);
      await expect.poll(() => page.getByRole('link', { name: 'Open another case about this batch', exact: true }).isVisible(), WAIT).toBe(true);
      await page.goto(`/batches/${without!.id}`);
      await expect.poll(() => page.getByRole('link', { name: 'Open a case about this batch', exact: true }).isVisible(), WAIT).toBe(true);

      // A batch without one: no notice on its form.
      await page.goto(`/cases/new?batch=${without!.id}`);
      await expect.poll(() => page.getByText(`About your batch ${without!.label}`).isVisible(), WAIT).toBe(true);
      expect(await page.getByRole('region', { name: /already has/ }).count()).toBe(0);
    });
  }
});
