// A grower finished with a batch takes it off the shelf from its page, on a phone, with the
// keyboard: it leaves the shelf and the list "Open a case" offers, waits under "taken off the
// shelf", and goes back on the shelf from its page again.
import { describe, expect, test } from 'vitest';
import { axeProblems, PHONE, shot, useBrowser } from './browser';
import { freshPerson, signInByApi } from './fresh-people';

const WAIT = { timeout: 20_000 };
const chromium = useBrowser();

describe('taking a batch off the shelf', () => {
  test('when a grower takes a used-up batch off the shelf, then the shelf and the case form no longer offer it, it is listed apart, and it can be put back', async () => {
    const grower = await freshPerson(chromium.browser(), 'grower', 'Winifred');
    const context = await chromium.newContext(PHONE);
    await signInByApi(context, grower.email, grower.password);
    const made = new Date(Date.now() - 20 * 86_400_000).toISOString().slice(0, 10);
    const add = async (label: string) => {
      const res = await context.request.post('/api/batches', { data: { stage: 'FPJ', label, madeOn: made } });
      expect(res.status()).toBe(201);
      return ((await res.json()) as { id: number }).id;
    };
    await add('Comfrey FPJ, bucket 2');
    const usedUp = await add('Nettle FPJ, bucket 1');
    const page = await context.newPage();

    await page.goto(`/batches/${usedUp}`);
    await page.getByRole('heading', { name: 'Finished with it?' }).waitFor(WAIT);
    await page.getByRole('button', { name: 'Take it off the shelf' }).focus();
    await page.keyboard.press('Enter');
    await page.getByText('Taken off the shelf.', { exact: true }).waitFor(WAIT);
    await page.getByRole('heading', { name: 'Off the shelf' }).waitFor(WAIT);
    expect(await page.getByText(/off the shelf since/).count()).toBeGreaterThan(0);
    await shot(page, 'batch-off-the-shelf-phone');
    expect(await axeProblems(page)).toEqual([]);

    await page.goto('/batches');
    await page.getByRole('link', { name: '1 batch taken off the shelf' }).waitFor(WAIT);
    expect(await page.getByText('Nettle FPJ, bucket 1').count()).toBe(0);
    expect(await page.getByText('Comfrey FPJ, bucket 2').count()).toBeGreaterThan(0);

    await page.goto('/cases/new');
    const picker = page.getByLabel('Is it a batch on your shelf?');
    await picker.waitFor(WAIT);
    const offered = await picker.locator('option').allInnerTexts();
    expect(offered.some((o) => o.includes('Comfrey FPJ, bucket 2'))).toBe(true);
    expect(offered.some((o) => o.includes('Nettle FPJ, bucket 1'))).toBe(false);

    await page.goto('/batches');
    await page.getByRole('link', { name: '1 batch taken off the shelf' }).click();
    await page.getByRole('heading', { level: 1, name: 'Taken off the shelf' }).waitFor(WAIT);
    expect(await page.getByText('Comfrey FPJ, bucket 2').count()).toBe(0);
    await page.getByRole('link', { name: /Nettle FPJ, bucket 1/ }).first().click();
    await page.getByRole('button', { name: 'Put it back on the shelf' }).click();
    await page.getByText('Back on the shelf.', { exact: true }).waitFor(WAIT);
    await page.goto('/batches');
    await page.getByText('Nettle FPJ, bucket 1').first().waitFor(WAIT);
    expect(await page.getByRole('link', { name: /taken off the shelf/ }).count()).toBe(0);
  });
});
