// Curating the Field Library: a steward takes a field note out, saying why. The note is gone for
// everyone, the case's thread and the audit log say who and why, and it stays out (the mentor's
// re-publish is refused, the grower's consent given again does not bring it back) until a steward
// publishes it again. The grower is mailed when it goes out and when it comes back.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { closeAs, mailTo, reportAs, systemLines, talkedCase } from '../factories/closing';
import { JSON_HEADERS, signedIn } from '../factories/sign-in';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const REASON = 'The remedy text names a farm shop, and the dose is not safe to copy.';

async function slugOf(caseId: number): Promise<string | null> {
  const [row] = await getSequelize().query<{ slug: string }>(`SELECT slug FROM library_entries WHERE case_id = $1 AND kind = 'note'`, {
    bind: [caseId],
    type: QueryTypes.SELECT,
  });
  return row?.slug ?? null;
}

/** A case resolved with the grower's consent, so its field note is in the library. */
async function publishedCase() {
  const talked = await talkedCase(t.app, { title: 'FFJ of windfall plums went fizzy', stage: 'FFJ', symptoms: ['bubbling', 'smell-alcoholic'] });
  await closeAs(talked.mentor.browser, talked.caseId, { remedy: 'use-now', summary: 'Fizzy plum FFJ strained and used diluted.' }).expect(200);
  await reportAs(talked.grower.browser, talked.caseId, { consentToPublish: true }).expect(201);
  const slug = await slugOf(talked.caseId);
  if (!slug) throw new Error('the field note was not published');
  return { ...talked, slug };
}

describe('a steward takes a field note out of the Field Library', () => {
  test('when a steward takes a note out with a reason, then nobody finds it, and the thread and the audit log say who did and why', async () => {
    const { caseId, slug, grower } = await publishedCase();
    const steward = await signedIn(t.app, 'steward', 'Oriel Stavewright');
    const res = await steward.browser.post(`/api/library/${slug}/take-down`).set(JSON_HEADERS).send({ reason: REASON });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      caseId,
      published: false,
      libraryHold: { by: { id: steward.user.id, displayName: 'Oriel Stavewright' }, reason: REASON },
      can: { takeDown: false, publish: true },
    });

    const visitor = agent(t.app);
    expect((await visitor.get(`/api/library/${slug}`)).status).toBe(404);
    const list = await visitor.get('/api/library').query({ q: 'fizzy plum', kind: 'note' }).expect(200);
    expect(list.body.items.map((i: { slug: string }) => i.slug)).not.toContain(slug);
    expect(await slugOf(caseId)).toBeNull();

    expect((await systemLines(caseId)).at(-1)).toBe(`Oriel Stavewright took the field note of this case out of the Field Library: “${REASON}”`);
    const audit = await steward.browser.get(`/api/steward/audit?targetType=case&targetId=${caseId}`).expect(200);
    expect(audit.body.items[0]).toMatchObject({ action: 'field_note.taken_down', actor: { id: steward.user.id }, detail: { slug, reason: REASON } });

    // The grower is told in their own view of the case, reason included, and by mail.
    const seen = await grower.browser.get(`/api/cases/${caseId}/closing`).expect(200);
    expect(seen.body).toMatchObject({ published: false, consentToPublish: true, libraryHold: { reason: REASON }, can: { takeDown: false, publish: false } });
    const mails = (await mailTo(grower.user.email)).filter((m) => m.kind === 'note_taken_out');
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Your field note is out of the Field Library: “FFJ of windfall plums went fizzy”');
    expect(mails[0].body_text).toContain('Oriel Stavewright, a steward of the Field Library, took the field note of your case');
    expect(mails[0].body_text).toContain(`The reason given: “${REASON}”`);
    expect(mails[0].body_text).toContain(`/cases/${caseId}\n`);
  });

  test('when the note is held out, then the mentor cannot put it back, the grower consenting again does not, and a steward publishing it again lifts the hold', async () => {
    const { caseId, slug, grower, mentor } = await publishedCase();
    const steward = await signedIn(t.app, 'steward', 'Oriel Stavewright');
    await steward.browser.post(`/api/library/${slug}/take-down`).set(JSON_HEADERS).send({ reason: REASON }).expect(200);

    // The steward desk lists what is held out, newest first.
    const holds = await steward.browser.get('/api/steward/library-holds').expect(200);
    expect(holds.body.items[0]).toMatchObject({ caseId, title: 'FFJ of windfall plums went fizzy', stage: 'FFJ', reason: REASON, consentToPublish: true, heldBy: { id: steward.user.id } });

    const byMentor = await mentor.browser.post(`/api/cases/${caseId}/publish`).set(JSON_HEADERS).send({});
    expect(byMentor.status).toBe(409);
    expect(byMentor.body.error).toMatchObject({ code: 'held_by_steward' });
    expect(byMentor.body.error.message).toContain(REASON);
    expect((await mentor.browser.get(`/api/cases/${caseId}/closing`).expect(200)).body.can.publish).toBe(false);

    await grower.browser.post(`/api/cases/${caseId}/consent`).set(JSON_HEADERS).send({ consentToPublish: false }).expect(200);
    const again = await grower.browser.post(`/api/cases/${caseId}/consent`).set(JSON_HEADERS).send({ consentToPublish: true }).expect(200);
    expect(again.body).toMatchObject({ consentToPublish: true, published: false, libraryHold: { reason: REASON } });
    expect(await slugOf(caseId)).toBeNull();
    expect((await systemLines(caseId)).at(-1)).toMatch(/agreed to share this case again; a steward took its field note out of the Field Library, so it stays out/);

    const back = await steward.browser.post(`/api/cases/${caseId}/publish`).set(JSON_HEADERS).send({});
    expect(back.status).toBe(200);
    expect(back.body).toMatchObject({ published: true, libraryHold: null, can: { takeDown: true } });
    const restored = await slugOf(caseId);
    expect(restored).not.toBeNull();
    expect((await agent(t.app).get(`/api/library/${restored}`)).status).toBe(200);
    expect((await systemLines(caseId)).at(-1)).toBe('Oriel Stavewright put the field note of this case back in the Field Library.');
    const mailed = await mailTo(grower.user.email);
    expect(mailed.filter((m) => m.kind === 'note_taken_out')).toHaveLength(1);
    const putBack = mailed.filter((m) => m.kind === 'note_put_back');
    expect(putBack).toHaveLength(1);
    expect(putBack[0].subject).toBe('Your field note is back in the Field Library: “FFJ of windfall plums went fizzy”');
    expect(putBack[0].body_text).toContain('You can stop sharing it at any time');
    const after = await steward.browser.get('/api/steward/library-holds?pageSize=100').expect(200);
    expect(after.body.items.map((i: { caseId: number }) => i.caseId)).not.toContain(caseId);
    const audit = await steward.browser.get(`/api/steward/audit?targetType=case&targetId=${caseId}`).expect(200);
    expect(audit.body.items[0]).toMatchObject({ action: 'field_note.restored', detail: { heldFor: REASON } });

    // With the hold lifted, the mentor may update the note again.
    expect((await mentor.browser.post(`/api/cases/${caseId}/publish`).set(JSON_HEADERS).send({})).status).toBe(200);
  });

  test('when the grower\'s account is disabled, then the note still comes out and goes back, and they are mailed neither time', async () => {
    const { caseId, slug, grower } = await publishedCase();
    await getSequelize().query(`UPDATE users SET disabled = true WHERE id = $1`, { bind: [grower.user.id] });
    const steward = await signedIn(t.app, 'steward');
    await steward.browser.post(`/api/library/${slug}/take-down`).set(JSON_HEADERS).send({ reason: REASON }).expect(200);
    expect(await slugOf(caseId)).toBeNull();
    await steward.browser.post(`/api/cases/${caseId}/publish`).set(JSON_HEADERS).send({}).expect(200);
    expect(await slugOf(caseId)).not.toBeNull();
    expect((await mailTo(grower.user.email)).filter((m) => m.kind.startsWith('note_'))).toHaveLength(0);
  });

  test('when the request is wrong, then it is refused and nothing changes: no reason, a guide, an unknown note, a note already out, and anyone but a steward', async () => {
    const { caseId, slug, grower, mentor } = await publishedCase();
    const steward = await signedIn(t.app, 'steward');
    const noReason = await steward.browser.post(`/api/library/${slug}/take-down`).set(JSON_HEADERS).send({ reason: ' ' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields).toHaveProperty('reason');
    expect((await steward.browser.post(`/api/library/${slug}/take-down`).set(JSON_HEADERS).send({ reason: 'x'.repeat(501) })).status).toBe(400);

    await getSequelize().query(
      `INSERT INTO library_entries (slug, kind, title, summary, body, stages) VALUES ('take-down-guide', 'guide', 'A guide', 'A guide', 'Body', '{IMO2}') ON CONFLICT (slug) DO NOTHING`,
    );
    const guide = await steward.browser.post('/api/library/take-down-guide/take-down').set(JSON_HEADERS).send({ reason: REASON });
    expect(guide.status).toBe(409);
    expect(guide.body.error.code).toBe('guide_from_files');
    expect((await steward.browser.post('/api/library/no-such-note/take-down').set(JSON_HEADERS).send({ reason: REASON })).status).toBe(404);

    for (const who of [grower, mentor]) {
      expect((await who.browser.post(`/api/library/${slug}/take-down`).set(JSON_HEADERS).send({ reason: REASON })).status).toBe(403);
    }
    expect((await agent(t.app).post(`/api/library/${slug}/take-down`).set(JSON_HEADERS).send({ reason: REASON })).status).toBe(401);
    expect(await slugOf(caseId)).toBe(slug);
    const heldMails = async () => (await mailTo(grower.user.email)).filter((m) => m.kind === 'note_taken_out').length;
    expect(await heldMails()).toBe(0);

    await steward.browser.post(`/api/library/${slug}/take-down`).set(JSON_HEADERS).send({ reason: REASON }).expect(200);
    const twice = await steward.browser.post(`/api/library/${slug}/take-down`).set(JSON_HEADERS).send({ reason: REASON });
    expect(twice.status).toBe(404);
    const lines = await systemLines(caseId);
    expect(lines.filter((l) => l.includes('out of the Field Library')).length).toBe(1);
    expect(await heldMails()).toBe(1);
  });
});
