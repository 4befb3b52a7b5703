// ASVS 5.2.x / 5.3.x / 5.4.1 (4.0.3: 12.x): what photos.test.ts does not already prove. Files
// that are a picture and a web page at once are re-encoded so no markup survives, or refused;
// markup with a picture's magic bytes, SVG and GIF are refused; what the browser claims about a
// file is not believed; client file names never reach the disk; stored photos are not reachable
// outside the access-checked route; and the multipart limits beyond size and count hold. Every
// refusal leaves no row and no file behind.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import sharp from 'sharp';
import { getSequelize } from '../../server/src/db/sequelize';
import { CLIENT_DIST } from '../../server/src/app';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { signedIn } from '../factories/sign-in';
import { createCase } from '../factories/cases';
import { filesUnder, getBytes, photoRows, uploadPhotos, type UploadFile } from '../factories/photos';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const uploadDir = () => path.resolve(t.config.UPLOAD_DIR);
/** A key as the photo store makes them (server/src/lib/photo-store.ts), relative to the store. */
const STORE_KEY = /^[0-9a-f]{2}\/[0-9a-f]{32}(-thumb)?\.jpg$/;
const PAGE = Buffer.from('<html><body><script>alert(document.cookie)</script></body></html>');
const MARKUP = /<script|<html|<svg|alert\(/i;

const solid = () => sharp({ create: { width: 64, height: 48, channels: 3, background: '#6b8e23' } });

/** A JPEG with the page in a comment segment (FF FE) right after the start-of-image marker. */
async function jpegWithComment(): Promise<Buffer> {
  const jpeg = await solid().jpeg().toBuffer();
  const length = PAGE.length + 2;
  return Buffer.concat([jpeg.subarray(0, 2), Buffer.from([0xff, 0xfe, length >> 8, length & 0xff]), PAGE, jpeg.subarray(2)]);
}

async function storedKeys(caseId: number): Promise<string[]> {
  const rows = await getSequelize().query<{ storage_key: string; thumb_key: string }>(`SELECT storage_key, thumb_key FROM case_photos WHERE case_id = :caseId ORDER BY id`, {
    replacements: { caseId },
    type: QueryTypes.SELECT,
  });
  return rows.flatMap((r) => [r.storage_key, r.thumb_key]);
}

/** Uploads, and expects a refusal that left neither a row nor a file. */
async function expectRefusedAndNothingStored(files: UploadFile[], status: number, code: string) {
  const { browser, user } = await signedIn(t.app);
  const caseId = await createCase(user.id);
  const filesBefore = filesUnder(uploadDir()).length;
  const res = await uploadPhotos(browser, caseId, files);
  expect(res.status).toBe(status);
  expect(res.body.error.code).toBe(code);
  expect(filesUnder(uploadDir()).length).toBe(filesBefore);
  expect(await photoRows(caseId)).toBe(0);
  return res;
}

describe('ASVS 5.2.2 / 5.2.6: files that are a picture and a page at once', () => {
  test.each([
    ['a JPEG with a web page appended after its end marker', async () => Buffer.concat([await solid().jpeg().toBuffer(), PAGE])],
    ['a JPEG carrying a web page in a comment segment', jpegWithComment],
    ['a PNG with a web page appended after IEND', async () => Buffer.concat([await solid().png().toBuffer(), PAGE])],
  ])('ASVS 5.2.2: when %s is uploaded, then it is re-encoded: the stored and served bytes hold no markup and are served as a JPEG with nosniff', async (_what, make) => {
    const polyglot = await make();
    // The file really is both: it decodes as a picture and carries the page.
    expect((await sharp(polyglot).metadata()).width).toBe(64);
    expect(polyglot.includes(Buffer.from('<script>'))).toBe(true);
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const res = await uploadPhotos(browser, caseId, [{ data: polyglot, name: 'jar.jpg' }]);
    expect(res.status).toBe(201);
    const keys = await storedKeys(caseId);
    expect(keys).toHaveLength(2);
    for (const key of keys) {
      const bytes = fs.readFileSync(path.join(uploadDir(), key));
      expect(bytes.subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff]));
      expect(bytes.toString('latin1')).not.toMatch(MARKUP);
    }
    const { url, thumbUrl } = res.body.photos[0];
    for (const served of [await getBytes(browser, url), await getBytes(browser, thumbUrl)]) {
      expect(served.status).toBe(200);
      expect(served.headers['content-type']).toBe('image/jpeg');
      expect(served.headers['x-content-type-options']).toBe('nosniff');
      expect((served.body as Buffer).toString('latin1')).not.toMatch(MARKUP);
      expect((await sharp(served.body as Buffer).metadata()).format).toBe('jpeg');
    }
  });

  test('ASVS 5.2.2: when a decodable GIF has a web page appended, then 400 (GIF is not taken) and nothing is stored', async () => {
    const gif = Buffer.concat([await solid().gif().toBuffer(), PAGE]);
    expect((await sharp(gif).metadata()).format).toBe('gif');
    await expectRefusedAndNothingStored([{ data: gif, name: 'jar.gif', contentType: 'image/gif' }], 400, 'not_an_image');
  });

  test('ASVS 5.2.2: when a GIF/script polyglot (GIF magic that is also a script) is named .jpg, then 400 and nothing is stored', async () => {
    const polyglot = Buffer.from('GIF89a/*\x01\x00\x01\x00\x00\x00\x00*/=1;alert(document.cookie);<script>alert(1)</script>', 'latin1');
    await expectRefusedAndNothingStored([{ data: polyglot, name: 'jar.jpg' }], 400, 'not_an_image');
  });

  test("ASVS 5.2.2: when a web page starts with a JPEG's magic bytes, then it cannot be decoded, 400, and nothing is stored", async () => {
    const disguised = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), PAGE]);
    await expectRefusedAndNothingStored([{ data: disguised, name: 'jar.jpg' }], 400, 'unreadable_image');
  });

  test('ASVS 5.2.2: when an SVG with a script is sent as an image, then 400 and nothing is stored', async () => {
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="64" height="48"><script>alert(1)</script><rect width="64" height="48"/></svg>');
    // sharp itself would read this SVG; the magic-byte check is what refuses it.
    expect((await sharp(svg).metadata()).format).toBe('svg');
    await expectRefusedAndNothingStored([{ data: svg, name: 'jar.svg', contentType: 'image/svg+xml' }], 400, 'not_an_image');
  });

  test('ASVS 5.4.1: when a real JPEG is declared as text/html by the browser, then the claim is ignored: it is stored and served as image/jpeg', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const res = await uploadPhotos(browser, caseId, [{ data: await solid().jpeg().toBuffer(), name: 'jar.html', contentType: 'text/html' }]);
    expect(res.status).toBe(201);
    const served = await getBytes(browser, res.body.photos[0].url);
    expect(served.headers['content-type']).toBe('image/jpeg');
    expect(served.headers['content-disposition']).toBe(`inline; filename="photo-${res.body.photos[0].id}.jpg"`);
  });
});

describe('ASVS 5.3.x: names and places are the server’s', () => {
  const ODD_NAMES = ['../../etc/passwd.jpg', '..\\..\\..\\boot.ini.jpg', '/tmp/sporewell-absolute.jpg', '%2e%2e%2fencoded.jpg', '.htaccess', '<script>alert(1)</script>.jpg'];

  test('ASVS 5.3.2 / 5.4.1: when photos come with path-traversal and other odd names, then each is stored under a server-chosen key inside the photo store and the names are not echoed', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const jpeg = await solid().jpeg().toBuffer();
    const outside = [
      path.resolve(uploadDir(), '../../etc/passwd.jpg'),
      path.resolve(uploadDir(), 'passwd.jpg'),
      '/tmp/sporewell-absolute.jpg',
      path.resolve(uploadDir(), '..', '.htaccess'),
      path.resolve(uploadDir(), '.htaccess'),
    ];
    const existedBefore = outside.filter((f) => fs.existsSync(f));
    const siblingsBefore = fs.readdirSync(path.dirname(uploadDir())).sort();
    const filesBefore = new Set(filesUnder(uploadDir()));

    const res = await uploadPhotos(browser, caseId, ODD_NAMES.map((name) => ({ data: jpeg, name })));
    expect(res.status).toBe(201);
    expect(res.body.photos).toHaveLength(ODD_NAMES.length);
    expect(JSON.stringify(res.body)).not.toMatch(/passwd|boot\.ini|absolute|encoded|htaccess|script/);

    const added = filesUnder(uploadDir()).filter((f) => !filesBefore.has(f));
    expect(added).toHaveLength(ODD_NAMES.length * 2);
    for (const file of added) expect(path.relative(uploadDir(), file).split(path.sep).join('/')).toMatch(STORE_KEY);
    expect((await storedKeys(caseId)).every((key) => STORE_KEY.test(key))).toBe(true);
    expect(outside.filter((f) => fs.existsSync(f))).toEqual(existedBefore);
    expect(fs.readdirSync(path.dirname(uploadDir())).sort()).toEqual(siblingsBefore);
  });

  test('ASVS 5.4.2: when a refused file has markup in its name, then the error names it without the markup', async () => {
    const res = await expectRefusedAndNothingStored([{ data: PAGE, name: '<img src=x onerror=alert(1)>.jpg' }], 400, 'not_an_image');
    expect(res.body.error.fields.photos).toMatch(/^photo 1/);
    expect(res.body.error.fields.photos).not.toMatch(/[<>=]/);
  });

  test('ASVS 5.3.1: when a stored photo is asked for outside its route (static paths, the store key), then nothing serves it', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    expect((await uploadPhotos(browser, caseId, [{ data: await solid().jpeg().toBuffer(), name: 'jar.jpg' }])).status).toBe(201);
    const [key] = await storedKeys(caseId);
    // The store is not inside the folder the client is served from.
    expect(path.relative(CLIENT_DIST, uploadDir()).startsWith('..')).toBe(true);
    for (const url of [`/uploads/${key}`, `/${key}`, `/assets/${key}`, `/api/uploads/${key}`, `/api/cases/${caseId}/photos/${encodeURIComponent(key)}`, `/api/cases/${caseId}/photos/..%2f..%2f${key}`]) {
      const res = await getBytes(browser, url);
      expect(res.status, url).toBe(404);
      expect((res.body as Buffer).subarray(0, 3).equals(Buffer.from([0xff, 0xd8, 0xff])), url).toBe(false);
    }
    // A visitor guessing the photo route of the case gets the same 404 as for a missing photo.
    expect((await agent(t.app).get(`/api/cases/${caseId}/photos/1`)).status).toBe(404);
  });
});

describe('ASVS 5.2.1: multipart limits besides file size and count', () => {
  test('ASVS 5.2.1: when an upload carries more text fields than allowed, then 413 and nothing is stored', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const fields = Object.fromEntries(Array.from({ length: 11 }, (_, i) => [`note${i}`, 'x']));
    const res = await uploadPhotos(browser, caseId, [{ data: await solid().jpeg().toBuffer(), name: 'jar.jpg' }], fields);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_many_fields');
    expect(await photoRows(caseId)).toBe(0);
  });

  test('ASVS 5.2.1: when a text field of the upload is longer than 1 KiB, then 400 and nothing is stored', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const res = await uploadPhotos(browser, caseId, [{ data: await solid().jpeg().toBuffer(), name: 'jar.jpg' }], { purpose: 'x'.repeat(1025) });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_upload');
    expect(await photoRows(caseId)).toBe(0);
  });
});
