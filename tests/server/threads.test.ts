import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Role } from '../../server/shared/case-status';
import type { ThreadMessage } from '../../server/shared/socket-events';
import { getSequelize } from '../../server/src/db/sequelize';
import { urgencyAt, urgencyNow } from '../../server/src/modules/threads/urgency-recompute';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { createUser } from '../factories/users';
import { caseRow, createThreadCase, JSON_HEADERS, messageRows, newClientId, signedInAs } from '../factories/threads';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const json = JSON_HEADERS;
const signedIn = (role: Role, displayName?: string) => signedInAs(t.app, role, displayName);

async function growerWithCase(options: Partial<Parameters<typeof createThreadCase>[0]> = {}) {
  const grower = await signedIn('grower', 'Ada Fernhill');
  const kase = await createThreadCase({ growerId: grower.user.id, ...options });
  return { ...grower, caseId: kase.id };
}

function post(browser: ReturnType<typeof agent>, caseId: number, body: Record<string, unknown>) {
  return browser.post(`/api/cases/${caseId}/messages`).set(json).send({ clientId: newClientId(), ...body });
}

describe('POST /api/cases/:id/messages', () => {
  test('when the grower writes in their own case, then 201 with the next seq, and the case shows it as its last message', async () => {
    const { browser, user, caseId } = await growerWithCase();
    const clientId = newClientId();
    const res = await browser.post(`/api/cases/${caseId}/messages`).set(json).send({ clientId, body: '  The crock smells like vinegar since this morning.  ' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      caseId,
      seq: 2,
      clientId,
      kind: 'text',
      body: 'The crock smells like vinegar since this morning.',
      hidden: false,
      author: { id: user.id, displayName: 'Ada Fernhill', role: 'grower' },
      photos: [],
    });
    const row = await caseRow(caseId);
    expect(row.last_message_preview).toBe('The crock smells like vinegar since this morning.');
    expect(row.last_message_at).not.toBeNull();
    expect(row.first_reply_at).toBeNull();
  });

  test('when the same clientId is posted twice, then it is stored once and the second answer is the stored message with 200', async () => {
    const { browser, caseId } = await growerWithCase();
    const clientId = newClientId();
    const first = await browser.post(`/api/cases/${caseId}/messages`).set(json).send({ clientId, body: 'Only once, please.' });
    const second = await browser.post(`/api/cases/${caseId}/messages`).set(json).send({ clientId, body: 'Only once, please.' });
    expect(first.status).toBe(201);
    expect(second.status).toBe(200);
    expect(second.body.id).toBe(first.body.id);
    expect(second.body.seq).toBe(first.body.seq);
    const rows = (await messageRows(caseId)).filter((m) => m.clientId === clientId);
    expect(rows).toHaveLength(1);
  });

  test('when another person reuses a clientId already taken in the case, then 409 and their text is not stored', async () => {
    const { browser, caseId } = await growerWithCase();
    const mentor = await signedIn('mentor');
    const clientId = newClientId();
    await mentor.browser.post(`/api/cases/${caseId}/messages`).set(json).send({ clientId, body: 'A private note for mentors.', kind: 'aside' }).expect(201);
    const res = await browser.post(`/api/cases/${caseId}/messages`).set(json).send({ clientId, body: 'Let me see that aside.' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('client_id_taken');
    expect(JSON.stringify(res.body)).not.toContain('private note');
  });

  test('when the body is empty, only spaces or over 5,000 characters, then 400 with the body field; 5,000 is accepted', async () => {
    // 1–5,000 characters: the limit set in issue 4 and MESSAGE_MAX in socket-events.ts.
    const { browser, caseId } = await growerWithCase();
    for (const body of ['', '   \n  ', 'x'.repeat(5001)]) {
      const res = await post(browser, caseId, { body });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.body).toBeTruthy();
    }
    expect((await post(browser, caseId, { body: 'y'.repeat(5000) })).status).toBe(201);
    expect((await messageRows(caseId)).filter((m) => m.kind === 'text')).toHaveLength(1);
  });

  test('when the clientId is malformed or missing, then 400 names it', async () => {
    const { browser, caseId } = await growerWithCase();
    for (const clientId of [undefined, 'short', 'has spaces in it', 'x'.repeat(65)]) {
      const res = await browser.post(`/api/cases/${caseId}/messages`).set(json).send({ clientId, body: 'Hello' });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.clientId).toBeTruthy();
    }
  });

  test('when a grower tries to write a mentor aside, then 403 and nothing is stored', async () => {
    const { browser, caseId } = await growerWithCase();
    const res = await post(browser, caseId, { body: 'Am I a mentor now?', kind: 'aside' });
    expect(res.status).toBe(403);
    expect((await messageRows(caseId)).map((m) => m.kind)).toEqual(['system']);
  });

  test('when another grower, or a visitor, writes in the case, then 404 / 401 and nothing is stored', async () => {
    const { caseId } = await growerWithCase();
    const other = await signedIn('grower');
    expect((await post(other.browser, caseId, { body: 'Not my case' })).status).toBe(404);
    expect((await post(agent(t.app), caseId, { body: 'Nobody' })).status).toBe(401);
    expect((await post(other.browser, 99_999_999, { body: 'No such case' })).status).toBe(404);
    expect((await post(other.browser, 'abc' as unknown as number, { body: 'Bad id' })).status).toBe(404);
    expect(await messageRows(caseId)).toHaveLength(1);
  });

  test('when the body holds HTML, then it is stored and answered as the very same plain text', async () => {
    const { browser, caseId } = await growerWithCase();
    const body = '<script>alert(1)</script> & <b>bold</b>';
    const res = await post(browser, caseId, { body });
    expect(res.body.body).toBe(body);
  });

  test('when a mentor replies first, then first_reply_at is set and the grower stops waiting; an aside sets neither', async () => {
    const { caseId } = await growerWithCase({ openedHoursAgo: 2 });
    const mentor = await signedIn('mentor');
    await post(mentor.browser, caseId, { body: 'Note: looks like a sugar problem.', kind: 'aside' }).expect(201);
    let row = await caseRow(caseId);
    expect(row.first_reply_at).toBeNull();
    expect(row.waiting_since).not.toBeNull();
    expect(row.last_message_preview).toBeNull();
    await post(mentor.browser, caseId, { body: 'How warm is the room where it sits?' }).expect(201);
    row = await caseRow(caseId);
    expect(row.first_reply_at).not.toBeNull();
    expect(row.waiting_since).toBeNull();
    expect(row.last_message_preview).toBe('How warm is the room where it sits?');
  });

  test('when the grower writes while the case is over to them, then it is back in conversation with a system line', async () => {
    const mentor = await signedIn('mentor', 'Bea Hollow');
    const { browser, caseId } = await growerWithCase({ status: 'over_to_grower', mentorId: mentor.user.id });
    const res = await post(browser, caseId, { body: 'I drained it and added sugar.' });
    expect(res.status).toBe(201);
    const row = await caseRow(caseId);
    expect(row.status).toBe('in_conversation');
    expect(row.waiting_since).not.toBeNull();
    const rows = await messageRows(caseId);
    expect(rows.slice(-2).map((m) => [m.kind, m.body])).toEqual([
      ['text', 'I drained it and added sugar.'],
      ['system', 'Ada Fernhill replied, so the case is back in conversation.'],
    ]);
  });

  test('when a case has ended, then text is refused with 409 but a mentor can still note an aside', async () => {
    const mentor = await signedIn('mentor');
    const { browser, caseId } = await growerWithCase({ status: 'withdrawn' });
    const res = await post(browser, caseId, { body: 'Hello again' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('thread_closed');
    expect((await post(mentor.browser, caseId, { body: 'For the record: withdrawn after a day.', kind: 'aside' })).status).toBe(201);
  });

  test('when photos the writer uploaded to the case are named, then they come with the message; anyone else’s photo is refused', async () => {
    const { browser, user, caseId } = await growerWithCase();
    const insertPhoto = async (uploaderId: number, key: string) => {
      const [p] = await getSequelize().query<{ id: number }>(
        `INSERT INTO case_photos (case_id, uploader_id, storage_key, thumb_key, width, height, bytes, purpose)
         VALUES (:caseId, :uploaderId, :key, :thumb, 800, 600, 1234, 'thread') RETURNING id`,
        { replacements: { caseId, uploaderId, key: `${key}.jpg`, thumb: `${key}-thumb.jpg` }, type: QueryTypes.SELECT },
      );
      return p.id;
    };
    const mine = await insertPhoto(user.id, `mine-${newClientId()}`);
    const mentor = await createUser({ role: 'mentor' });
    const theirs = await insertPhoto(mentor.id, `theirs-${newClientId()}`);
    const ok = await post(browser, caseId, { body: 'Here is the top of the jar.', photoIds: [mine] });
    expect(ok.status).toBe(201);
    expect(ok.body.photos).toEqual([{ id: mine, width: 800, height: 600, url: expect.stringContaining(`/cases/${caseId}/photos/${mine}`), thumbUrl: expect.any(String) }]);
    const refused = await post(browser, caseId, { body: 'And this one.', photoIds: [theirs] });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.photoIds).toBeTruthy();
    expect((await messageRows(caseId)).filter((m) => m.kind === 'text')).toHaveLength(1);
  });
});

describe('GET /api/cases/:id/messages', () => {
  test('when after= is given, then only later messages come, in seq order', async () => {
    const { browser, caseId } = await growerWithCase();
    for (const body of ['one', 'two', 'three', 'four']) await post(browser, caseId, { body }).expect(201);
    const all = await browser.get(`/api/cases/${caseId}/messages`);
    expect(all.body.items.map((m: ThreadMessage) => m.seq)).toEqual([1, 2, 3, 4, 5]);
    const later = await browser.get(`/api/cases/${caseId}/messages?after=3`);
    expect(later.status).toBe(200);
    expect(later.body.items.map((m: ThreadMessage) => [m.seq, m.body])).toEqual([
      [4, 'three'],
      [5, 'four'],
    ]);
    expect(later.body.hasMore).toBe(false);
    expect((await browser.get(`/api/cases/${caseId}/messages?after=-1`)).status).toBe(400);
    expect((await browser.get(`/api/cases/${caseId}/messages?after=soon`)).status).toBe(400);
  });

  test('when a mentor wrote an aside, then the grower never gets it over HTTP, and mentors and stewards do', async () => {
    const { browser, caseId } = await growerWithCase();
    const mentor = await signedIn('mentor');
    const steward = await signedIn('steward');
    await post(mentor.browser, caseId, { body: 'ASIDE: suspect the lid was sealed too tight.', kind: 'aside' }).expect(201);
    await post(mentor.browser, caseId, { body: 'Could you loosen the lid a little?' }).expect(201);
    const growerView = await browser.get(`/api/cases/${caseId}/messages`);
    expect(growerView.body.items.map((m: ThreadMessage) => m.kind)).toEqual(['system', 'text']);
    expect(JSON.stringify(growerView.body)).not.toContain('ASIDE');
    const afterView = await browser.get(`/api/cases/${caseId}/messages?after=1`);
    expect(JSON.stringify(afterView.body)).not.toContain('ASIDE');
    for (const who of [mentor, steward]) {
      const view = await who.browser.get(`/api/cases/${caseId}/messages`);
      expect(view.body.items.map((m: ThreadMessage) => m.kind)).toEqual(['system', 'aside', 'text']);
    }
  });

  test('when a steward hid a message, then everyone gets it flagged with the body replaced, and the text stays in the database', async () => {
    const { browser, caseId } = await growerWithCase();
    const res = await post(browser, caseId, { body: 'Something rude' });
    await getSequelize().query(`UPDATE messages SET hidden = true, hidden_at = now() WHERE id = :id`, { replacements: { id: res.body.id } });
    const mentor = await signedIn('mentor');
    for (const who of [browser, mentor.browser]) {
      const view = await who.get(`/api/cases/${caseId}/messages`);
      const hidden = view.body.items.find((m: ThreadMessage) => m.id === res.body.id);
      expect(hidden).toMatchObject({ hidden: true, body: 'Hidden by a steward' });
      expect(JSON.stringify(view.body)).not.toContain('rude');
    }
    expect((await messageRows(caseId)).find((m) => Number(m.id) === res.body.id)?.body).toBe('Something rude');
  });

  test('when another grower or a visitor asks, then 404 / 401', async () => {
    const { caseId } = await growerWithCase();
    const other = await signedIn('grower');
    expect((await other.browser.get(`/api/cases/${caseId}/messages`)).status).toBe(404);
    expect((await agent(t.app).get(`/api/cases/${caseId}/messages`)).status).toBe(401);
    expect((await other.browser.get(`/api/cases/0/messages`)).status).toBe(404);
  });
});

describe('GET /api/cases/unread', () => {
  test('when a mentor replied, then the grower has it unread until they fetch the thread; their own posts never count', async () => {
    const { browser, caseId } = await growerWithCase();
    const mentor = await signedIn('mentor');
    await post(browser, caseId, { body: 'Anyone there?' }).expect(201);
    expect((await browser.get('/api/cases/unread')).body).toEqual({ total: 0, byCase: {} });
    await post(mentor.browser, caseId, { body: 'Yes, looking now.' }).expect(201);
    await post(mentor.browser, caseId, { body: 'Mentor-only thought.', kind: 'aside' }).expect(201);
    await post(mentor.browser, caseId, { body: 'What sugar did you use?' }).expect(201);
    const before = await browser.get('/api/cases/unread');
    expect(before.body).toEqual({ total: 2, byCase: { [String(caseId)]: 2 } });
    await browser.get(`/api/cases/${caseId}/messages?after=2`).expect(200);
    expect((await browser.get('/api/cases/unread')).body).toEqual({ total: 0, byCase: {} });
  });

  test('when the grower writes in a case a mentor holds, then it is unread for that mentor, asides of others included', async () => {
    const mentor = await signedIn('mentor');
    const colleague = await signedIn('mentor');
    const { browser, caseId } = await growerWithCase({ status: 'in_conversation', mentorId: mentor.user.id });
    await post(browser, caseId, { body: 'Photo coming.' }).expect(201);
    await post(colleague.browser, caseId, { body: 'I have seen this before.', kind: 'aside' }).expect(201);
    expect((await mentor.browser.get('/api/cases/unread')).body.byCase[String(caseId)]).toBe(2);
    // The colleague does not hold the case, so it is not in their count.
    expect((await colleague.browser.get('/api/cases/unread')).body.byCase[String(caseId)]).toBeUndefined();
  });

  test('when signed out, then 401', async () => {
    expect((await agent(t.app).get('/api/cases/unread')).status).toBe(401);
  });
});

describe('the urgent-case mail preference', () => {
  test('when a mentor turns it on and off, then users.notify_urgent follows; a grower is refused', async () => {
    const mentor = await signedIn('mentor');
    expect((await mentor.browser.patch('/api/cases/preferences/urgent-mail').set(json).send({ on: true })).body).toEqual({ on: true });
    expect((await mentor.browser.get('/api/cases/preferences/urgent-mail')).body).toEqual({ on: true });
    const [row] = await getSequelize().query<{ notify_urgent: boolean }>(`SELECT notify_urgent FROM users WHERE id = :id`, { replacements: { id: mentor.user.id }, type: QueryTypes.SELECT });
    expect(row.notify_urgent).toBe(true);
    expect((await mentor.browser.patch('/api/cases/preferences/urgent-mail').set(json).send({ on: false })).body).toEqual({ on: false });
    expect((await mentor.browser.patch('/api/cases/preferences/urgent-mail').set(json).send({ on: 'yes' })).status).toBe(400);
    const grower = await signedIn('grower');
    expect((await grower.browser.patch('/api/cases/preferences/urgent-mail').set(json).send({ on: true })).status).toBe(403);
  });
});

describe('the waiting clock behind the urgency', () => {
  test('when the stored part is 25 and the grower has waited 3 hours, then the urgency is 28; a mentor reply stops the clock at 25', async () => {
    // Points from the table in server/shared/urgency.ts: putrid smell 25, waiting 1 an hour up to 20.
    const { caseId } = await growerWithCase({ symptoms: ['smell-putrid'], urgency: 25, openedHoursAgo: 3 });
    expect(await urgencyNow(caseId)).toEqual({ urgency: 28, urgencyLevel: 'medium' });
    const mentor = await signedIn('mentor');
    await post(mentor.browser, caseId, { body: 'Discard it if it smells rotten.' }).expect(201);
    expect(await urgencyNow(caseId)).toEqual({ urgency: 25, urgencyLevel: 'medium' });
  });

  test('when the waiting is long, then it adds at most 20; while over to the grower it adds nothing', () => {
    const now = new Date('2025-05-01T12:00:00Z');
    const since = new Date('2025-04-29T12:00:00Z');
    // waitingCap 20 and levels (high from 45) from server/shared/urgency.ts.
    expect(urgencyAt(30, since, 'awaiting_mentor', now)).toEqual({ urgency: 50, urgencyLevel: 'high' });
    expect(urgencyAt(30, since, 'over_to_grower', now)).toEqual({ urgency: 30, urgencyLevel: 'medium' });
    expect(urgencyAt(95, since, 'in_conversation', now)).toEqual({ urgency: 100, urgencyLevel: 'high' });
    expect(urgencyAt(10, null, 'awaiting_mentor', now)).toEqual({ urgency: 10, urgencyLevel: 'low' });
  });
});
