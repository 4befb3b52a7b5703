import path from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import sharp from 'sharp';
import type { Browser, Page } from 'playwright-core';
import { checkBatch } from '@shared/batch-check';
import { DESKTOP, launch, newContext, PHONE, SCREENSHOTS, shot, signIn } from './browser';

let browser: Browser;
let photo: Buffer;

// The first page of a fresh server builds its caches; give every wait a little room.
const SOON = { timeout: 10_000 };

beforeAll(async () => {
  browser = await launch();
  // A phone-sized photo full of fine detail, so that it is heavy as a JPEG and the browser has
  // real work to do making it lighter before it is sent.
  photo = await sharp({
    create: { width: 3200, height: 2400, channels: 3, background: { r: 150, g: 140, b: 110 }, noise: { type: 'gaussian', mean: 128, sigma: 60 } },
  })
    .jpeg({ quality: 95 })
    .toBuffer();
});

afterAll(async () => {
  await browser?.close();
});

async function signedInAsGrower(page: Page): Promise<void> {
  await signIn(page, 'grower@example.test');
  await expect.poll(() => new URL(page.url()).pathname, SOON).not.toBe('/sign-in');
}

describe('opening a case', () => {
  for (const [name, device] of [['desktop', DESKTOP], ['phone', PHONE]] as const) {
    test(`when the demo grower opens a case with a photo on a ${name}, then the check's picture, a similar case and the case page with the photo are shown`, async () => {
      const context = await newContext(browser, device);
      const page = await context.newPage();
      await signedInAsGrower(page);
      await page.goto('/cases/new');
      await expect.poll(() => page.getByRole('heading', { level: 1, name: 'Open a case' }).isVisible(), SOON).toBe(true);

      await page.getByLabel('Stage').selectOption('IMO2');
      await page.getByRole('checkbox', { name: 'Bubbling or foaming' }).check();
      await page.getByRole('checkbox', { name: 'Alcoholic or yeasty' }).check();
      await page.getByLabel('Describe it in your own words').fill('Started bubbling two days after the sugar went in; it smells of beer.');
      await page.getByLabel('Culture weight, amount').fill('900');
      await page.getByLabel('Sugar weight, amount').fill('450');

      // The picture follows the numbers as they are typed, with no round trip.
      const expected = checkBatch({ stage: 'IMO2', culture: { value: 900, unit: 'g' }, sugar: { value: 450, unit: 'g' }, symptoms: ['bubbling', 'smell-alcoholic'] });
      const estimate = expected.waterActivity!.estimate;
      const figure = page.getByRole('figure', { name: 'Water activity picture' });
      await expect.poll(() => figure.isVisible(), SOON).toBe(true);
      const picture = figure.getByRole('img', { name: /Water activity scale from 0\.60 to 1\.00: this batch at about/ });
      await expect.poll(() => picture.getAttribute('aria-label'), SOON).toContain(`this batch at about ${estimate.toFixed(2)}`);
      await expect.poll(() => figure.getByText(`This batch: about ${estimate.toFixed(3)}.`).isVisible(), SOON).toBe(true);
      await expect.poll(() => page.getByText(expected.verdict).first().isVisible(), SOON).toBe(true);

      // Batches like this: at least one resolved case from the demo scenario.
      const similar = page.getByRole('list', { name: 'Resolved cases like this one, closest first' });
      await expect.poll(() => similar.getByRole('listitem').count(), { timeout: 15_000 }).toBeGreaterThan(0);
      await expect.poll(() => similar.getByText('Why it matched:').first().isVisible(), SOON).toBe(true);

      // A photo, made lighter in the browser before it goes.
      await page.locator('input[type=file]').setInputFiles({ name: 'crock.jpg', mimeType: 'image/jpeg', buffer: photo });
      await expect.poll(() => page.getByText(/^Ready, /).isVisible(), { timeout: 30_000 }).toBe(true);
      await shot(page, `open-case-form-${name}`);

      const uploads: number[] = [];
      page.on('request', (request) => {
        if (/\/api\/cases\/\d+\/photos$/.test(new URL(request.url()).pathname)) uploads.push(request.postDataBuffer()?.length ?? 0);
      });
      await page.getByRole('button', { name: 'Open the case' }).click();
      await expect.poll(() => new URL(page.url()).pathname, { timeout: 30_000 }).toMatch(/^\/cases\/\d+$/);
      expect(uploads).toHaveLength(1);
      // Downscaled to about 1.5 MB at most (browser-image-compression's target), well under the original.
      expect(uploads[0]).toBeLessThan(photo.length);
      expect(uploads[0]).toBeLessThan(1.7 * 1024 * 1024);

      await expect.poll(() => page.getByRole('heading', { level: 1, name: 'IMO2: bubbling or foaming and 1 more' }).isVisible(), SOON).toBe(true);
      await expect.poll(() => page.getByText('Awaiting a mentor').first().isVisible(), SOON).toBe(true);
      const thumbnail = page.getByRole('list', { name: 'Photos of the batch' }).getByRole('img');
      await expect.poll(() => thumbnail.count(), SOON).toBe(1);
      await expect.poll(() => thumbnail.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0), SOON).toBe(true);
      await shot(page, `case-page-${name}`);

      await thumbnail.click();
      const viewer = page.getByRole('dialog', { name: 'Photo 1 of 1' });
      await expect.poll(() => viewer.isVisible(), SOON).toBe(true);
      // The dialog covers the viewport; a full-page shot would cut it in half.
      await page.screenshot({ path: path.join(SCREENSHOTS, `case-photo-enlarged-${name}.png`) });
      await page.keyboard.press('Escape');
      await expect.poll(() => viewer.isVisible(), SOON).toBe(false);
      await context.close();
    });
  }

  test('when a grower asks for a case that is not theirs or does not exist, then the page says it could not be found', async () => {
    const context = await newContext(browser);
    const page = await context.newPage();
    await signedInAsGrower(page);
    await page.goto('/cases/2147483000');
    await expect.poll(() => page.getByRole('heading', { level: 1, name: 'We could not find that page' }).isVisible(), SOON).toBe(true);
    await context.close();
  });
});
