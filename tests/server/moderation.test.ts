import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { messagesRepository } from '../../server/src/modules/threads/messages.repository';
import { addThreadPublisher } from '../../server/src/modules/threads/thread-events';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { createUser } from '../factories/users';
import { captureLog, insertCase, insertMessage, JSON_HEADERS, personSignedIn, signedInAgent } from '../factories/steward-data';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const RUDE = 'Only a fool would leave rice out like that, you clearly cannot follow simple steps.';

/** A grower's case with a mentor's rude reply in it, and both of them signed in. */
async function threadWithRudeReply() {
  const grower = await createUser();
  const mentor = await createUser({ role: 'mentor', displayName: 'Brusque Mentor' });
  const caseId = await insertCase({ growerId: grower.id, mentorId: mentor.id, status: 'in_conversation', title: 'White fuzz on the rice box' });
  await insertMessage(caseId, grower.id, 'The rice box has white fuzz on top, is that right?');
  const messageId = await insertMessage(caseId, mentor.id, RUDE);
  return { grower, mentor, caseId, messageId, growerBrowser: await signedInAgent(t.app, grower) };
}

async function messageRow(id: number) {
  const [row] = await getSequelize().query<{ body: string; hidden: boolean; hidden_by: number | null; hidden_at: Date | null }>(
    `SELECT body, hidden, hidden_by, hidden_at FROM messages WHERE id = :id`,
    { replacements: { id }, type: QueryTypes.SELECT },
  );
  return row;
}

describe('POST /api/messages/:id/reports', () => {
  test('when the grower of the case reports a message, then 201; reporting it again answers the same open report', async () => {
    const { messageId, growerBrowser } = await threadWithRudeReply();
    const first = await growerBrowser.post(`/api/messages/${messageId}/reports`).set(JSON_HEADERS).send({ reason: 'Insulting, not advice.' });
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ messageId, status: 'open', reason: 'Insulting, not advice.', alreadyReported: false });
    const second = await growerBrowser.post(`/api/messages/${messageId}/reports`).set(JSON_HEADERS).send({ reason: 'Still rude.' });
    expect(second.status).toBe(200);
    expect(second.body).toMatchObject({ id: first.body.id, alreadyReported: true });
  });

  test('when someone outside the thread reports a message, then 404, as if it did not exist', async () => {
    const { messageId } = await threadWithRudeReply();
    const { browser: stranger } = await personSignedIn(t.app, 'grower');
    expect((await stranger.post(`/api/messages/${messageId}/reports`).set(JSON_HEADERS).send({ reason: 'Rude.' })).status).toBe(404);
    expect((await stranger.post('/api/messages/999999999/reports').set(JSON_HEADERS).send({ reason: 'Rude.' })).status).toBe(404);
  });

  test('when signed out, then 401; when the reason is empty, then 400 names it', async () => {
    const { messageId, growerBrowser } = await threadWithRudeReply();
    expect((await agent(t.app).post(`/api/messages/${messageId}/reports`).set(JSON_HEADERS).send({ reason: 'Rude.' })).status).toBe(401);
    const empty = await growerBrowser.post(`/api/messages/${messageId}/reports`).set(JSON_HEADERS).send({ reason: '  ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.reason).toBeTruthy();
  });

  test('when a grower reports a mentor aside they cannot see, then 404; a status line cannot be reported (400)', async () => {
    const { grower, mentor, caseId, growerBrowser } = await threadWithRudeReply();
    const aside = await insertMessage(caseId, mentor.id, 'Between us: this one is probably lost.', 'aside');
    expect((await growerBrowser.post(`/api/messages/${aside}/reports`).set(JSON_HEADERS).send({ reason: 'Rude.' })).status).toBe(404);
    const system = await insertMessage(caseId, grower.id, 'Case opened.', 'system');
    expect((await growerBrowser.post(`/api/messages/${system}/reports`).set(JSON_HEADERS).send({ reason: 'Rude.' })).status).toBe(400);
  });
});

describe('steward moderation', () => {
  test('when a steward lists open reports, then each shows the message text, its author, the case and the reporter', async () => {
    const { grower, mentor, caseId, messageId, growerBrowser } = await threadWithRudeReply();
    const report = await growerBrowser.post(`/api/messages/${messageId}/reports`).set(JSON_HEADERS).send({ reason: 'Insulting.' }).expect(201);
    const { browser } = await personSignedIn(t.app, 'steward');
    const res = await browser.get('/api/steward/reports?pageSize=100').expect(200);
    const found = res.body.items.find((r: { id: number }) => r.id === report.body.id);
    expect(found).toMatchObject({
      status: 'open',
      reason: 'Insulting.',
      reporter: { id: grower.id },
      message: { id: messageId, caseId, caseTitle: 'White fuzz on the rice box', body: RUDE, hidden: false, author: { id: mentor.id, displayName: 'Brusque Mentor', role: 'mentor' }, openReports: 1 },
    });
  });

  test('when a steward hides a reported message, then it is hidden for everyone, its text kept in the audit log, open threads are told, and the report is settled', async () => {
    const { caseId, messageId, growerBrowser } = await threadWithRudeReply();
    const report = await growerBrowser.post(`/api/messages/${messageId}/reports`).set(JSON_HEADERS).send({ reason: 'Insulting.' }).expect(201);
    const hiddenLive: Array<[number, number]> = [];
    const removePublisher = addThreadPublisher({
      publish: async () => undefined,
      isViewing: async () => false,
      messageHidden: (c, m) => void hiddenLive.push([c, m]),
    });
    const { user: steward, browser } = await personSignedIn(t.app, 'steward');
    const log = captureLog();
    try {
      const res = await browser.post(`/api/steward/messages/${messageId}/hide`).set(JSON_HEADERS).send({ note: 'Personal attack.' });
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ id: messageId, caseId, hidden: true, reportsClosed: 1 });
      expect(log.lines()).toContainEqual(expect.objectContaining({ level: 'security', event: 'steward.message_hidden', actorId: steward.id, messageId }));
    } finally {
      log.restore();
      removePublisher();
    }
    expect(hiddenLive).toEqual([[caseId, messageId]]);

    const row = await messageRow(messageId);
    expect(row).toMatchObject({ body: RUDE, hidden: true, hidden_by: steward.id });
    const audit = await browser.get(`/api/steward/audit?targetType=message&targetId=${messageId}`).expect(200);
    expect(audit.body.items[0]).toMatchObject({ action: 'message.hidden', actor: { id: steward.id }, detail: { body: RUDE, note: 'Personal attack.', caseId } });

    const settled = await browser.get('/api/steward/reports?status=hidden&pageSize=100').expect(200);
    expect(settled.body.items.find((r: { id: number }) => r.id === report.body.id)).toMatchObject({ status: 'hidden', decidedBy: { id: steward.id } });

    // The thread's own serializer and its HTTP route never send the text again.
    const latest = await messagesRepository.listLatest(caseId, { includeAsides: true, limit: 50 });
    expect(latest.items.find((m) => m.id === messageId)).toMatchObject({ hidden: true, body: 'Hidden by a steward' });
    const thread = await growerBrowser.get(`/api/cases/${caseId}/messages`);
    expect(thread.status).toBe(200);
    expect(JSON.stringify(thread.body)).not.toContain('Only a fool');
    expect(thread.body.items.find((m: { id: number }) => m.id === messageId)).toMatchObject({ hidden: true, body: 'Hidden by a steward' });
  });

  test('when a message is already hidden, then hiding it again and reporting it are both 409', async () => {
    const { messageId, growerBrowser } = await threadWithRudeReply();
    const { browser } = await personSignedIn(t.app, 'steward');
    await browser.post(`/api/steward/messages/${messageId}/hide`).set(JSON_HEADERS).send({}).expect(200);
    const again = await browser.post(`/api/steward/messages/${messageId}/hide`).set(JSON_HEADERS).send({});
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_hidden');
    expect((await growerBrowser.post(`/api/messages/${messageId}/reports`).set(JSON_HEADERS).send({ reason: 'Rude.' })).status).toBe(409);
  });

  test('when a steward shows a hidden message again, then its text is back in the thread, open threads get it, the audit log has both steps and its reports stay settled', async () => {
    const { caseId, messageId, growerBrowser } = await threadWithRudeReply();
    const report = await growerBrowser.post(`/api/messages/${messageId}/reports`).set(JSON_HEADERS).send({ reason: 'Insulting?' }).expect(201);
    const { user: steward, browser } = await personSignedIn(t.app, 'steward');
    await browser.post(`/api/steward/messages/${messageId}/hide`).set(JSON_HEADERS).send({ note: 'Looked like an attack.' }).expect(200);
    const shownLive: Array<[number, number, string]> = [];
    const removePublisher = addThreadPublisher({
      publish: async () => undefined,
      isViewing: async () => false,
      messageHidden: () => undefined,
      messageShown: (c, m) => void shownLive.push([c, m.id, m.body]),
    });
    const log = captureLog();
    try {
      const res = await browser.post(`/api/steward/messages/${messageId}/show`).set(JSON_HEADERS).send({ note: 'On a second read it is a joke between old friends.' });
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ id: messageId, caseId, hidden: false });
      expect(log.lines()).toContainEqual(expect.objectContaining({ level: 'security', event: 'steward.message_shown_again', actorId: steward.id, messageId }));
    } finally {
      log.restore();
      removePublisher();
    }
    expect(shownLive).toEqual([[caseId, messageId, RUDE]]);
    expect(await messageRow(messageId)).toMatchObject({ body: RUDE, hidden: false, hidden_by: null });
    const thread = await growerBrowser.get(`/api/cases/${caseId}/messages`).expect(200);
    expect(thread.body.items.find((m: { id: number }) => m.id === messageId)).toMatchObject({ hidden: false, body: RUDE });
    const audit = await browser.get(`/api/steward/audit?targetType=message&targetId=${messageId}`).expect(200);
    expect(audit.body.items.map((e: { action: string }) => e.action)).toEqual(['message.shown_again', 'message.hidden', 'message.reported']);
    expect(audit.body.items[0]).toMatchObject({ actor: { id: steward.id }, detail: { note: 'On a second read it is a joke between old friends.', caseId } });
    const settled = await browser.get('/api/steward/reports?status=hidden&pageSize=100').expect(200);
    expect(settled.body.items.find((r: { id: number }) => r.id === report.body.id)).toMatchObject({ status: 'hidden', message: { hidden: false } });

    // Not hidden any more: showing it again is 409; a missing message is 404.
    const again = await browser.post(`/api/steward/messages/${messageId}/show`).set(JSON_HEADERS).send({});
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('not_hidden');
    expect((await browser.post('/api/steward/messages/999999999/show').set(JSON_HEADERS).send({})).status).toBe(404);
  });

  test('when a steward hides a message that does not exist, then 404', async () => {
    const { browser } = await personSignedIn(t.app, 'steward');
    expect((await browser.post('/api/steward/messages/999999999/hide').set(JSON_HEADERS).send({})).status).toBe(404);
  });

  test('when a steward dismisses a report, then the message stays as written and a second dismissal is 409', async () => {
    const { messageId, growerBrowser } = await threadWithRudeReply();
    const report = await growerBrowser.post(`/api/messages/${messageId}/reports`).set(JSON_HEADERS).send({ reason: 'I did not like the tone.' }).expect(201);
    const { user: steward, browser } = await personSignedIn(t.app, 'steward');
    const res = await browser.post(`/api/steward/reports/${report.body.id}/dismiss`).set(JSON_HEADERS).send({ note: 'Blunt, but advice.' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: report.body.id, status: 'dismissed', decidedBy: { id: steward.id } });
    expect((await messageRow(messageId)).hidden).toBe(false);
    const again = await browser.post(`/api/steward/reports/${report.body.id}/dismiss`).set(JSON_HEADERS).send({});
    expect(again.status).toBe(409);
    const audit = await browser.get(`/api/steward/audit?targetType=report&targetId=${report.body.id}`).expect(200);
    expect(audit.body.items[0]).toMatchObject({ action: 'report.dismissed', detail: { note: 'Blunt, but advice.', messageId } });
  });
});
