import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import sharp from 'sharp';
import { getSequelize } from '../../server/src/db/sequelize';
import { agent, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { caseRow, reportAs, systemLines, talkedCase, watchingCase, type Browser } from '../factories/closing';
import { JSON_HEADERS, signedIn } from '../factories/sign-in';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

async function noteOf(caseId: number) {
  const rows = await getSequelize().query<{ slug: string; kind: string; detail: { photos?: { id: number }[] } }>(
    `SELECT slug, kind, detail FROM library_entries WHERE case_id = $1`,
    { bind: [caseId], type: QueryTypes.SELECT },
  );
  return rows[0] ?? null;
}

async function unsentCheckIns(caseId: number): Promise<number> {
  const [row] = await getSequelize().query<{ n: number }>(`SELECT count(*)::int AS n FROM check_ins WHERE case_id = $1 AND sent_at IS NULL`, {
    bind: [caseId],
    type: QueryTypes.SELECT,
  });
  return row.n;
}

async function uploadRecoveryPhoto(browser: Browser, caseId: number): Promise<number> {
  const jpeg = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: 200, g: 190, b: 160 } } }).jpeg().toBuffer();
  const res = await browser
    .post(`/api/cases/${caseId}/photos`)
    .set({ Origin: TEST_ORIGIN })
    .field('purpose', 'recovery')
    .attach('photos', jpeg, { filename: 'after.jpg', contentType: 'image/jpeg' });
  if (res.status !== 201) throw new Error(`upload failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.photos[0].id;
}

describe('POST /api/cases/:id/recovery-report', () => {
  test('when the grower reports it recovered, then the case is recovered, the rest of the check-ins are dropped and a system line says so', async () => {
    const { caseId, grower } = await watchingCase(t.app, { growerName: 'Perrin Grower' });
    expect(await unsentCheckIns(caseId)).toBe(3);
    const res = await reportAs(grower.browser, caseId, { outcome: 'recovered', stars: 4, comment: 'Calm again.' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: 'recovered', outcome: 'recovered', stars: 4, recoveryComment: 'Calm again.', published: false });
    const row = await caseRow(caseId);
    expect(row.resolved_at).not.toBeNull();
    expect(await unsentCheckIns(caseId)).toBe(0);
    expect((await systemLines(caseId)).at(-1)).toBe('Perrin Grower filed the recovery report: Recovered, 4 of 5 stars for the advice. The case is now “Recovered”.');
    expect(await noteOf(caseId)).toBeNull();
  });

  test.each([
    ['partly', 'recovered'],
    ['lost', 'lost'],
  ] as const)('when the outcome is %s, then the case ends %s', async (outcome, status) => {
    const { caseId, grower } = await watchingCase(t.app);
    const res = await reportAs(grower.browser, caseId, { outcome });
    expect(res.status).toBe(201);
    expect(res.body.status).toBe(status);
    expect((await caseRow(caseId)).outcome).toBe(outcome);
  });

  test('when a second report comes in, then 409 and the first one stands', async () => {
    const { caseId, grower } = await watchingCase(t.app);
    await reportAs(grower.browser, caseId, { outcome: 'recovered', stars: 5 }).expect(201);
    const again = await reportAs(grower.browser, caseId, { outcome: 'lost', stars: 1 });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_reported');
    const row = await caseRow(caseId);
    expect(row).toMatchObject({ outcome: 'recovered', stars: 5, status: 'recovered' });
  });

  test.each([0, 6, 3.5, '5', null])('when the stars are %s, then 400 names the stars and nothing is written', async (stars) => {
    const { caseId, grower } = await watchingCase(t.app);
    const res = await reportAs(grower.browser, caseId, { stars: stars as never });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.stars).toBe('Choose from 1 to 5 stars.');
    expect(await caseRow(caseId)).toMatchObject({ status: 'watching', outcome: null, stars: null });
  });

  test('when the outcome is not one of ours, then 400 names it', async () => {
    const { caseId, grower } = await watchingCase(t.app);
    const res = await reportAs(grower.browser, caseId, { outcome: 'solved' as never });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('outcome');
  });

  test('when the mentor, a steward or another grower files it, then 403, 403 and 404, and nothing changes', async () => {
    const { caseId, mentor } = await watchingCase(t.app);
    expect((await reportAs(mentor.browser, caseId)).status).toBe(403);
    const steward = await signedIn(t.app, 'steward');
    expect((await reportAs(steward.browser, caseId)).status).toBe(403);
    const stranger = await signedIn(t.app, 'grower');
    expect((await reportAs(stranger.browser, caseId)).status).toBe(404);
    expect((await reportAs(agent(t.app), caseId)).status).toBe(401);
    expect((await caseRow(caseId)).status).toBe('watching');
  });

  test('when the case has not been closed yet, then 409', async () => {
    const { caseId, grower } = await talkedCase(t.app);
    const res = await reportAs(grower.browser, caseId);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('case_not_watching');
  });

  test('when a photo of someone else’s is named, then 400 and nothing is half-written', async () => {
    const { caseId, grower } = await watchingCase(t.app);
    const other = await watchingCase(t.app);
    const foreignPhoto = await uploadRecoveryPhoto(other.grower.browser, other.caseId);
    const res = await reportAs(grower.browser, caseId, { photoIds: [foreignPhoto], consentToPublish: true });
    expect(res.status).toBe(400);
    expect(await caseRow(caseId)).toMatchObject({ status: 'watching', outcome: null, published: false });
    expect(await unsentCheckIns(caseId)).toBe(3);
    expect(await noteOf(caseId)).toBeNull();
  });
});

describe('publishing with the report, and consent', () => {
  test('when the grower consents, then a field note is published in the same step and the library serves it', async () => {
    const { caseId, grower } = await watchingCase(t.app);
    const res = await reportAs(grower.browser, caseId, { consentToPublish: true });
    expect(res.status).toBe(201);
    expect(res.body.published).toBe(true);
    const note = await noteOf(caseId);
    expect(note?.kind).toBe('note');
    expect(res.body.noteSlug).toBe(note!.slug);
    expect((await caseRow(caseId)).published).toBe(true);
    const page = await agent(t.app).get(`/api/library/${note!.slug}`);
    expect(page.status).toBe(200);
    expect(page.body).toMatchObject({ kind: 'note', stages: ['IMO2'], cause: 'too-little-sugar', remedy: 'add-sugar', outcome: 'recovered' });
    expect(page.body.remedyRecord.text).toMatch(/^saved \d+ of \d+ batch/);
  });

  test('when the grower withdraws consent later, then the note is gone from the library and the case is unpublished', async () => {
    const { caseId, grower } = await watchingCase(t.app);
    await reportAs(grower.browser, caseId, { consentToPublish: true }).expect(201);
    const slug = (await noteOf(caseId))!.slug;
    const res = await grower.browser.post(`/api/cases/${caseId}/consent`).set(JSON_HEADERS).send({ consentToPublish: false });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ published: false, consentToPublish: false, noteSlug: null });
    expect(await noteOf(caseId)).toBeNull();
    expect((await caseRow(caseId)).published).toBe(false);
    expect((await agent(t.app).get(`/api/library/${slug}`)).status).toBe(404);
    expect((await systemLines(caseId)).at(-1)).toMatch(/withdrew consent/);
    // And agreeing again brings it back.
    const again = await grower.browser.post(`/api/cases/${caseId}/consent`).set(JSON_HEADERS).send({ consentToPublish: true });
    expect(again.body.published).toBe(true);
  });

  test('when someone other than the grower changes consent, then 403', async () => {
    const { caseId, grower, mentor } = await watchingCase(t.app);
    await reportAs(grower.browser, caseId).expect(201);
    const res = await mentor.browser.post(`/api/cases/${caseId}/consent`).set(JSON_HEADERS).send({ consentToPublish: true });
    expect(res.status).toBe(403);
    expect(await noteOf(caseId)).toBeNull();
  });

  test('when a mentor publishes without the grower’s consent, then 409 and no note exists', async () => {
    const { caseId, grower, mentor } = await watchingCase(t.app);
    await reportAs(grower.browser, caseId, { consentToPublish: false }).expect(201);
    const res = await mentor.browser.post(`/api/cases/${caseId}/publish`).set(JSON_HEADERS).send({});
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('no_consent');
    expect(await noteOf(caseId)).toBeNull();
    expect((await caseRow(caseId)).published).toBe(false);
  });

  test('when consent is given before the report exists, then 409', async () => {
    const { caseId, grower } = await watchingCase(t.app);
    const res = await grower.browser.post(`/api/cases/${caseId}/consent`).set(JSON_HEADERS).send({ consentToPublish: true });
    expect(res.status).toBe(409);
  });

  test('when the grower agrees to share photos, then the note shows the recovery photo to visitors; without that, it does not', async () => {
    const withPhotos = await watchingCase(t.app);
    const photoId = await uploadRecoveryPhoto(withPhotos.grower.browser, withPhotos.caseId);
    await reportAs(withPhotos.grower.browser, withPhotos.caseId, { consentToPublish: true, consentPhotos: true, photoIds: [photoId] }).expect(201);
    const note = (await noteOf(withPhotos.caseId))!;
    const entry = await agent(t.app).get(`/api/library/${note.slug}`);
    expect(entry.body.note.photos).toHaveLength(1);
    const image = await agent(t.app).get(entry.body.note.photos[0].url);
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/jpeg');
    expect(image.headers['x-content-type-options']).toBe('nosniff');
    // The photo is also on the thread, with the report's system line.
    const [attached] = await getSequelize().query<{ kind: string }>(
      `SELECT m.kind FROM case_photos p JOIN messages m ON m.id = p.message_id WHERE p.id = $1`,
      { bind: [photoId], type: QueryTypes.SELECT },
    );
    expect(attached.kind).toBe('system');

    const without = await watchingCase(t.app);
    const hidden = await uploadRecoveryPhoto(without.grower.browser, without.caseId);
    await reportAs(without.grower.browser, without.caseId, { consentToPublish: true, consentPhotos: false, photoIds: [hidden] }).expect(201);
    const plain = (await noteOf(without.caseId))!;
    expect((await agent(t.app).get(`/api/library/${plain.slug}`)).body.note.photos).toEqual([]);
    expect((await agent(t.app).get(`/api/library/${plain.slug}/photos/${hidden}`)).status).toBe(404);
    // Nor can one note's URL be used to reach another case's photo.
    expect((await agent(t.app).get(`/api/library/${plain.slug}/photos/${photoId}`)).status).toBe(404);
  });
});
