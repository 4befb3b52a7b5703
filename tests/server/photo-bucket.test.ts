// Photos in an S3-compatible bucket (S3_ settings), against a local S3 fake on loopback: the
// API stores and serves them through the bucket and nothing reaches UPLOAD_DIR.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import sharp from 'sharp';
import { getSequelize } from '../../server/src/db/sequelize';
import { closePhotoStores, newPhotoKeys } from '../../server/src/lib/photo-store';
import { createS3PhotoStore } from '../../server/src/lib/s3-photo-store';
import { makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { startS3Fake, type S3Fake } from '../setup/s3-fake';
import { signedIn } from '../factories/sign-in';
import { createCase } from '../factories/cases';
import { getBytes } from '../factories/photos';

let fake: S3Fake;
let t: TestApp;
let uploadDir: string;

beforeAll(async () => {
  fake = await startS3Fake();
  uploadDir = fs.mkdtempSync(path.join(process.env.TEST_TMP ?? os.tmpdir(), 'bucket-uploads-'));
  t = makeTestApp({ ...fake.env, UPLOAD_DIR: uploadDir });
});
afterAll(async () => {
  await t?.close();
  await closePhotoStores();
  await fake?.close();
});

function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => e.name);
}

async function storedKeys(photoId: number): Promise<{ storageKey: string; thumbKey: string }> {
  const [row] = await getSequelize().query<{ storageKey: string; thumbKey: string }>(
    `SELECT storage_key AS "storageKey", thumb_key AS "thumbKey" FROM case_photos WHERE id = :photoId`,
    { replacements: { photoId }, type: QueryTypes.SELECT },
  );
  return row;
}

describe('photos in an S3-compatible bucket', () => {
  test('when a grower uploads a photo, then it is read back through the API from the bucket and nothing is written to local disk', async () => {
    expect(t.config.s3).toMatchObject({ bucket: fake.bucket, endpoint: fake.endpoint, forcePathStyle: true });
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const original = await sharp({ create: { width: 800, height: 600, channels: 3, background: { r: 90, g: 120, b: 70 } } }).jpeg().toBuffer();

    const res = await browser.post(`/api/cases/${caseId}/photos`).set({ Origin: TEST_ORIGIN }).attach('photos', original, { filename: 'crock.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(201);
    const photo = res.body.photos[0] as { id: number; url: string; thumbUrl: string };

    const { storageKey, thumbKey } = await storedKeys(photo.id);
    expect(await fake.has(storageKey)).toBe(true);
    expect(await fake.has(thumbKey)).toBe(true);
    expect(filesUnder(uploadDir)).toEqual([]);

    const full = await getBytes(browser, photo.url);
    expect(full.status).toBe(200);
    expect(full.headers['content-type']).toBe('image/jpeg');
    expect(Number(full.headers['content-length'])).toBe((full.body as Buffer).length);
    const meta = await sharp(full.body as Buffer).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(['jpeg', 800, 600]);

    const thumb = await getBytes(browser, photo.thumbUrl);
    expect(thumb.status).toBe(200);
    expect((await sharp(thumb.body as Buffer).metadata()).format).toBe('jpeg');
    expect(filesUnder(uploadDir)).toEqual([]);
  });

  test('when someone who may not read the case asks for its photo, then the answer is 404 as on local disk', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const original = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: 10, g: 10, b: 10 } } }).jpeg().toBuffer();
    const res = await browser.post(`/api/cases/${caseId}/photos`).set({ Origin: TEST_ORIGIN }).attach('photos', original, { filename: 'a.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(201);
    const stranger = await signedIn(t.app);
    expect((await stranger.browser.get(res.body.photos[0].url)).status).toBe(404);
  });

  test('when the bucket has no such object, then the store answers null; a delete of it succeeds; a key not of ours is refused', async () => {
    const store = createS3PhotoStore(t.config.s3!);
    try {
      const { key } = newPhotoKeys();
      expect(await store.get(key)).toBeNull();
      await store.put(key, Buffer.from('not really a jpeg'), 'image/jpeg');
      expect(await fake.has(key)).toBe(true);
      const got = await store.get(key);
      expect(got?.size).toBe(17);
      got?.stream.resume();
      await store.delete(key);
      await store.delete(key);
      expect(await fake.has(key)).toBe(false);
      await expect(store.put('../escape.jpg', Buffer.from('x'), 'image/jpeg')).rejects.toThrow(/Not a photo key/);
      expect(await store.get('../escape.jpg')).toBeNull();
    } finally {
      await store.close();
    }
  });
});
