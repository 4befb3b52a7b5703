import path from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import sharp from 'sharp';
import { getSequelize } from '../../server/src/db/sequelize';
import { casesRepository } from '../../server/src/modules/cases/cases.repository';
import { agent, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { signedIn } from '../factories/sign-in';
import { filesUnder, getBytes, photoRows, uploadPhotos as upload } from '../factories/photos';
import { createCase } from '../factories/cases';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const origin = { Origin: TEST_ORIGIN };

/** A photo as a phone takes it: JPEG with GPS coordinates in its EXIF, taken sideways. */
async function phoneJpeg(width = 1200, height = 900): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 120, g: 110, b: 90 } } })
    .jpeg()
    .withMetadata({ orientation: 6 })
    .withExif({
      IFD0: { Make: 'Field camera' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' },
    })
    .toBuffer();
}

const uploadDir = () => path.resolve(t.config.UPLOAD_DIR);

describe('POST /api/cases/:id/photos', () => {
  test('when the grower uploads a phone photo with GPS in its EXIF, then it comes back upright as a JPEG with no metadata at all, plus a thumbnail', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const original = await phoneJpeg();
    const before = await sharp(original).metadata();
    // the test photo really carries EXIF with GPS and a sideways orientation
    expect(before.exif).toBeDefined();
    expect(before.exif!.includes(Buffer.from('Field camera'))).toBe(true);
    expect(before.orientation).toBe(6);
    const filesBefore = filesUnder(uploadDir()).length;
    const res = await upload(browser, caseId, [{ data: original, name: 'IMG_0001.jpg' }]);
    expect(res.status).toBe(201);
    expect(res.body.photos).toHaveLength(1);
    // the picture and its thumbnail, under server-chosen names
    expect(filesUnder(uploadDir()).length).toBe(filesBefore + 2);
    expect(filesUnder(uploadDir()).some((f) => f.includes('IMG_0001'))).toBe(false);
    const photo = res.body.photos[0];
    // Orientation 6 turns the 1200 × 900 picture upright to 900 × 1200 (EXIF 2.3 orientation tag).
    expect(photo).toMatchObject({ url: `/api/cases/${caseId}/photos/${photo.id}`, thumbUrl: `/api/cases/${caseId}/photos/${photo.id}/thumb`, width: 900, height: 1200 });

    const full = await getBytes(browser, photo.url);
    expect(full.status).toBe(200);
    expect(full.headers['content-type']).toBe('image/jpeg');
    expect(full.headers['x-content-type-options']).toBe('nosniff');
    expect(full.headers['cache-control']).toMatch(/^private/);
    expect(full.headers['content-disposition']).toMatch(/^inline/);
    const meta = await sharp(full.body as Buffer).metadata();
    expect(meta.format).toBe('jpeg');
    expect(meta.exif).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    expect(meta.iptc).toBeUndefined();
    expect(meta.orientation).toBeUndefined();
    expect([meta.width, meta.height]).toEqual([900, 1200]);
    expect((full.body as Buffer).includes(Buffer.from('Field camera'))).toBe(false);

    const thumb = await getBytes(browser, photo.thumbUrl);
    const thumbMeta = await sharp(thumb.body as Buffer).metadata();
    expect(Math.max(thumbMeta.width!, thumbMeta.height!)).toBe(400);
    expect(thumbMeta.exif).toBeUndefined();

    const detail = await browser.get(`/api/cases/${caseId}`);
    expect(detail.body.photos.map((p: { id: number }) => p.id)).toEqual([photo.id]);
  });

  test('when a big photo is uploaded, then it is scaled down to 2048 px on the long side', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const big = await sharp({ create: { width: 4000, height: 3000, channels: 3, background: '#556b2f' } }).jpeg().toBuffer();
    const res = await upload(browser, caseId, [{ data: big, name: 'wide.jpg' }]);
    expect(res.status).toBe(201);
    expect(res.body.photos[0]).toMatchObject({ width: 2048, height: 1536 });
  });

  test('when an HTML page renamed .jpg is among the photos, then 400 and nothing is stored, not even the good photo', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const filesBefore = filesUnder(uploadDir()).length;
    const html = Buffer.from('<!doctype html><html><body><script>alert(1)</script></body></html>');
    const res = await upload(browser, caseId, [
      { data: await phoneJpeg(), name: 'good.jpg' },
      { data: html, name: 'holiday.jpg' },
    ]);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('not_an_image');
    expect(res.body.error.fields.photos).toMatch(/photo 2/);
    expect(filesUnder(uploadDir()).length).toBe(filesBefore);
    expect(await photoRows(caseId)).toBe(0);
  });

  test('when a PNG has 14000 × 14000 pixels, then 400 says too many pixels and nothing is stored', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    // One solid colour compresses to well under the 10 MB file limit, so the pixel cap is what refuses it.
    const huge = await sharp({ create: { width: 14000, height: 14000, channels: 3, background: '#777777' }, limitInputPixels: false })
      .png({ compressionLevel: 9 })
      .toBuffer();
    expect(huge.length).toBeLessThan(10 * 1024 * 1024);
    const filesBefore = filesUnder(uploadDir()).length;
    const res = await upload(browser, caseId, [{ data: huge, name: 'huge.png' }]);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('too_many_pixels');
    expect(res.body.error.message).toMatch(/too many pixels/);
    expect(filesUnder(uploadDir()).length).toBe(filesBefore);
    expect(await photoRows(caseId)).toBe(0);
  });

  test('when a file is over 10 MB, then 413 and nothing is stored', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const jpeg = await phoneJpeg(200, 200);
    const oversize = Buffer.concat([jpeg, Buffer.alloc(10 * 1024 * 1024 + 1 - jpeg.length + 10)]);
    const filesBefore = filesUnder(uploadDir()).length;
    const res = await upload(browser, caseId, [{ data: jpeg, name: 'fine.jpg' }, { data: oversize, name: 'big.jpg' }]);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('file_too_large');
    expect(filesUnder(uploadDir()).length).toBe(filesBefore);
    expect(await photoRows(caseId)).toBe(0);
  });

  test('when seven photos come at once, then 413 says at most six and nothing is stored', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const jpeg = await phoneJpeg(100, 100);
    const filesBefore = filesUnder(uploadDir()).length;
    const res = await upload(browser, caseId, Array.from({ length: 7 }, (_, i) => ({ data: jpeg, name: `p${i}.jpg` })));
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: 'too_many_files', message: 'Send at most 6 photos at a time.' });
    expect(filesUnder(uploadDir()).length).toBe(filesBefore);
    expect(await photoRows(caseId)).toBe(0);
  });

  test('when the database refuses the rows, then the files already written are deleted again', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const filesBefore = filesUnder(uploadDir()).length;
    // A trigger makes the insert fail after the files were written.
    await getSequelize().query(`
      CREATE OR REPLACE FUNCTION refuse_photo_for_test() RETURNS trigger AS $$
      BEGIN IF NEW.case_id = ${caseId} THEN RAISE EXCEPTION 'refused for the test'; END IF; RETURN NEW; END $$ LANGUAGE plpgsql;
      CREATE TRIGGER refuse_photo_for_test BEFORE INSERT ON case_photos FOR EACH ROW EXECUTE FUNCTION refuse_photo_for_test();`);
    try {
      const res = await upload(browser, caseId, [{ data: await phoneJpeg(), name: 'a.jpg' }, { data: await phoneJpeg(), name: 'b.jpg' }]);
      expect(res.status).toBe(500);
    } finally {
      await getSequelize().query(`DROP TRIGGER refuse_photo_for_test ON case_photos; DROP FUNCTION refuse_photo_for_test();`);
    }
    expect(filesUnder(uploadDir()).length).toBe(filesBefore);
    expect(await photoRows(caseId)).toBe(0);
  });

  test('when a mentor adds a photo to a thread message, then it is stored with that purpose and message', async () => {
    const grower = await signedIn(t.app);
    const mentor = await signedIn(t.app, 'mentor');
    const caseId = await createCase(grower.user.id);
    const message = await getSequelize().transaction((transaction) =>
      casesRepository.appendMessage(caseId, { authorId: mentor.user.id, kind: 'text', body: 'Here is how mine looked.' }, transaction),
    );
    const res = await upload(mentor.browser, caseId, [{ data: await phoneJpeg(), name: 'mine.jpg' }], { messageId: String(message.id) });
    expect(res.status).toBe(201);
    expect(res.body.photos[0]).toMatchObject({ purpose: 'thread', messageId: message.id });
    const bad = await upload(mentor.browser, caseId, [{ data: await phoneJpeg(), name: 'x.jpg' }], { purpose: 'selfie' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toContain('purpose');
  });

  test("when another grower uploads to, or asks for, someone's photos, then 404; a visitor gets 404 for the photo too", async () => {
    const owner = await signedIn(t.app);
    const stranger = await signedIn(t.app);
    const caseId = await createCase(owner.user.id);
    const res = await upload(owner.browser, caseId, [{ data: await phoneJpeg(), name: 'mine.jpg' }]);
    const { url, thumbUrl } = res.body.photos[0];
    expect((await stranger.browser.get(url)).status).toBe(404);
    expect((await stranger.browser.get(thumbUrl)).status).toBe(404);
    expect((await agent(t.app).get(url)).status).toBe(404);
    const filesBefore = filesUnder(uploadDir()).length;
    const intruding = await upload(stranger.browser, caseId, [{ data: await phoneJpeg(), name: 'spam.jpg' }]);
    expect(intruding.status).toBe(404);
    expect(filesUnder(uploadDir()).length).toBe(filesBefore);
    // The photo id under another case does not open it either.
    const otherCase = await createCase(stranger.user.id);
    expect((await stranger.browser.get(`/api/cases/${otherCase}/photos/${res.body.photos[0].id}`)).status).toBe(404);
    // A mentor may look.
    const mentor = await signedIn(t.app, 'mentor');
    expect((await mentor.browser.get(url)).status).toBe(200);
  });

  test("when a photo belongs to a mentor aside, then the grower does not see it, in the case or by its URL", async () => {
    const grower = await signedIn(t.app);
    const mentor = await signedIn(t.app, 'mentor');
    const caseId = await createCase(grower.user.id);
    const aside = await getSequelize().transaction((transaction) =>
      casesRepository.appendMessage(caseId, { authorId: mentor.user.id, kind: 'aside', body: 'Compare with the black-mould case.' }, transaction),
    );
    const res = await upload(mentor.browser, caseId, [{ data: await phoneJpeg(), name: 'aside.jpg' }], { messageId: String(aside.id) });
    expect(res.status).toBe(201);
    const { url } = res.body.photos[0];
    expect((await grower.browser.get(url)).status).toBe(404);
    expect((await grower.browser.get(`/api/cases/${caseId}`)).body.photos).toEqual([]);
    expect((await mentor.browser.get(`/api/cases/${caseId}`)).body.photos).toHaveLength(1);
    // …and a grower cannot attach to the aside either.
    const attach = await upload(grower.browser, caseId, [{ data: await phoneJpeg(), name: 'g.jpg' }], { messageId: String(aside.id) });
    expect(attach.status).toBe(400);
  });

  test('when the upload is not multipart or has no photos, then 400 or 415', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const json = await browser.post(`/api/cases/${caseId}/photos`).set({ ...origin, 'Content-Type': 'application/json' }).send({ photos: [] });
    expect(json.status).toBe(400);
    const none = await browser.post(`/api/cases/${caseId}/photos`).set(origin).field('purpose', 'case');
    expect(none.status).toBe(400);
    expect(none.body.error.code).toBe('no_photos');
    const wrongField = await browser.post(`/api/cases/${caseId}/photos`).set(origin).attach('picture', await phoneJpeg(), 'p.jpg');
    expect(wrongField.status).toBe(400);
    expect(wrongField.body.error.code).toBe('unexpected_file');
  });
});
