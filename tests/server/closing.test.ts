import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { sendDueCheckIns } from '../../server/src/modules/closing/check-ins.worker';
import { agent, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { createCase } from '../factories/cases';
import { caseRow, closeAs, mailTo, systemLines, talkedCase, watchingCase } from '../factories/closing';
import { JSON_HEADERS, signedIn } from '../factories/sign-in';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const DAY = 86_400_000;

async function checkIns(caseId: number) {
  return getSequelize().query<{ day: number; due_at: Date; sent_at: Date | null }>(`SELECT day, due_at, sent_at FROM check_ins WHERE case_id = $1 ORDER BY day`, {
    bind: [caseId],
    type: QueryTypes.SELECT,
  });
}

describe('POST /api/cases/:id/close', () => {
  test('when the mentor holding the case closes it, then it is watching with check-ins after 1, 3 and 7 days, a system line and an e-mail with the report link', async () => {
    const { caseId, grower, mentor } = await talkedCase(t.app, { mentorName: 'Orrin Closer' });
    const before = Date.now();
    const res = await closeAs(mentor.browser, caseId);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ caseId, status: 'watching', cause: 'too-little-sugar', remedy: 'add-sugar', askToPublish: true });
    expect(res.body.closedBy).toEqual({ id: mentor.user.id, displayName: 'Orrin Closer' });
    const row = await caseRow(caseId);
    expect(row.status).toBe('watching');
    expect(row.closed_by).toBe(mentor.user.id);
    expect(row.summary).toMatch(/half the sugar/);

    const due = await checkIns(caseId);
    expect(due.map((c) => c.day)).toEqual([1, 3, 7]);
    for (const c of due) {
      const offset = new Date(c.due_at).getTime() - before;
      expect(Math.abs(offset - c.day * DAY)).toBeLessThan(60_000);
      expect(c.sent_at).toBeNull();
    }

    const lines = await systemLines(caseId);
    expect(lines.at(-1)).toMatch(/^Orrin Closer closed the case\. Likely cause: Too little sugar for the culture\. Remedy: Mix in or top-dress more sugar\./);
    const mails = await mailTo(grower.user.email);
    expect(mails).toHaveLength(1);
    expect(mails[0].body_text).toContain(`${TEST_ORIGIN}/cases/${caseId}/recovery-report`);
    expect(t.mailPokes).toBeGreaterThan(0);
  });

  test('when a steward closes a case that is over to the grower, then it is watching too', async () => {
    const { caseId } = await talkedCase(t.app, { status: 'over_to_grower' });
    const steward = await signedIn(t.app, 'steward');
    const res = await closeAs(steward.browser, caseId);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('watching');
  });

  test('when the check-in days are chosen, then those are scheduled, each once, in order', async () => {
    const { caseId, mentor } = await talkedCase(t.app);
    const res = await closeAs(mentor.browser, caseId, { checkInDays: [5, 2, 5] });
    expect(res.status).toBe(200);
    expect(res.body.checkIns.map((c: { day: number }) => c.day)).toEqual([2, 5]);
  });

  test('when a mentor who does not hold the case tries to close it, then 403 and nothing changes', async () => {
    const { caseId } = await talkedCase(t.app);
    const other = await signedIn(t.app, 'mentor');
    const res = await closeAs(other.browser, caseId);
    expect(res.status).toBe(403);
    expect((await caseRow(caseId)).status).toBe('in_conversation');
    expect(await checkIns(caseId)).toHaveLength(0);
  });

  test('when the case’s grower tries to close it, then 403; when another grower tries, then 404; a visitor gets 401', async () => {
    const { caseId, grower } = await talkedCase(t.app);
    expect((await closeAs(grower.browser, caseId)).status).toBe(403);
    const stranger = await signedIn(t.app, 'grower');
    expect((await closeAs(stranger.browser, caseId)).status).toBe(404);
    expect((await closeAs(agent(t.app), caseId)).status).toBe(401);
    expect((await caseRow(caseId)).status).toBe('in_conversation');
  });

  test('when the case still awaits a mentor, then even a steward gets 409: nobody has advised yet', async () => {
    const grower = await signedIn(t.app, 'grower');
    const caseId = await createCase(grower.user.id);
    const steward = await signedIn(t.app, 'steward');
    const res = await closeAs(steward.browser, caseId);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('case_not_open');
    expect((await caseRow(caseId)).status).toBe('awaiting_mentor');
  });

  test('when a case is closed twice, then the second is 409 and the check-ins are not doubled', async () => {
    const { caseId, mentor } = await watchingCase(t.app);
    const again = await closeAs(mentor.browser, caseId, { summary: 'A second try at closing it.' });
    expect(again.status).toBe(409);
    expect(await checkIns(caseId)).toHaveLength(3);
    expect((await caseRow(caseId)).summary).toMatch(/half the sugar/);
  });

  test('when the cause is not on the list and the summary is empty, then 400 names both fields', async () => {
    const { caseId, mentor } = await talkedCase(t.app);
    const res = await closeAs(mentor.browser, caseId, { cause: 'bad-luck' as never, summary: '' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['cause', 'summary']));
    expect((await caseRow(caseId)).status).toBe('in_conversation');
  });

  test('when the body is a form post instead of JSON, then it is refused and nothing changes', async () => {
    const { caseId, mentor } = await talkedCase(t.app);
    const res = await mentor.browser.post(`/api/cases/${caseId}/close`).set({ Origin: TEST_ORIGIN }).type('form').send('cause=too-wet&remedy=add-sugar&summary=Closed by a form');
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect((await caseRow(caseId)).status).toBe('in_conversation');
  });
});

describe('GET /api/cases/:id/closing', () => {
  test('when each side asks, then each is told what it may do now', async () => {
    const { caseId, grower, mentor } = await watchingCase(t.app, {}, { redactTerms: ['Hollybrook'] });
    const forGrower = await grower.browser.get(`/api/cases/${caseId}/closing`);
    expect(forGrower.status).toBe(200);
    expect(forGrower.body.can).toEqual({ close: false, fileReport: true, changeConsent: false, publish: false, takeDown: false, closeAsLost: false });
    // What the mentor flagged to leave out is not the grower's to read.
    expect(forGrower.body.redactTerms).toBeUndefined();
    const forMentor = await mentor.browser.get(`/api/cases/${caseId}/closing`);
    expect(forMentor.body.can.fileReport).toBe(false);
    expect(forMentor.body.redactTerms).toEqual(['Hollybrook']);
    const stranger = await signedIn(t.app, 'grower');
    expect((await stranger.browser.get(`/api/cases/${caseId}/closing`)).status).toBe(404);
  });
});

describe('check-ins', () => {
  test('when a check-in falls due, then one e-mail with the report link is queued and the check-in is marked sent, once', async () => {
    const { caseId, grower } = await watchingCase(t.app);
    await getSequelize().query(`UPDATE check_ins SET due_at = now() - interval '1 minute' WHERE case_id = $1 AND day = 1`, { bind: [caseId] });
    // Two workers at once (two processes): SKIP LOCKED gives the row to one of them.
    const [a, b] = await Promise.all([sendDueCheckIns(TEST_ORIGIN), sendDueCheckIns(TEST_ORIGIN)]);
    expect(a + b).toBeGreaterThanOrEqual(1);
    await sendDueCheckIns(TEST_ORIGIN);
    const mails = (await mailTo(grower.user.email)).filter((m) => m.kind === 'check_in');
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toMatch(/^Day 1:/);
    expect(mails[0].body_text).toContain(`${TEST_ORIGIN}/cases/${caseId}/recovery-report`);
    const due = await checkIns(caseId);
    expect(due.find((c) => c.day === 1)!.sent_at).not.toBeNull();
    expect(due.filter((c) => c.sent_at === null).map((c) => c.day)).toEqual([3, 7]);
  });

  test('when a check-in falls due on a case that is no longer watching, then no e-mail goes out', async () => {
    const { caseId, grower } = await watchingCase(t.app);
    await getSequelize().query(`UPDATE cases SET status = 'withdrawn' WHERE id = $1`, { bind: [caseId] });
    await getSequelize().query(`UPDATE check_ins SET due_at = now() - interval '1 minute' WHERE case_id = $1`, { bind: [caseId] });
    await sendDueCheckIns(TEST_ORIGIN);
    expect((await mailTo(grower.user.email)).filter((m) => m.kind === 'check_in')).toHaveLength(0);
    expect((await checkIns(caseId)).every((c) => c.sent_at !== null)).toBe(true);
  });

  test('when a steward disabled the grower\'s account, then neither the closing nor its check-ins mail them', async () => {
    const { caseId, grower, mentor } = await talkedCase(t.app);
    await getSequelize().query(`UPDATE users SET disabled = true WHERE id = $1`, { bind: [grower.user.id] });
    await closeAs(mentor.browser, caseId).expect(200);
    expect((await caseRow(caseId)).status).toBe('watching');
    await getSequelize().query(`UPDATE check_ins SET due_at = now() - interval '1 minute' WHERE case_id = $1`, { bind: [caseId] });
    await sendDueCheckIns(TEST_ORIGIN);
    expect(await mailTo(grower.user.email)).toHaveLength(0);
    // Marked all the same, so the worker does not pick them up again.
    expect((await checkIns(caseId)).every((c) => c.sent_at !== null)).toBe(true);
  });
});

describe('POST /api/cases/:id/close-as-lost', () => {
  test('when a steward tries before 14 days have passed, then 409 says until when', async () => {
    const { caseId } = await watchingCase(t.app);
    const steward = await signedIn(t.app, 'steward');
    const res = await steward.browser.post(`/api/cases/${caseId}/close-as-lost`).set(JSON_HEADERS).send({});
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('too_early');
    expect((await caseRow(caseId)).status).toBe('watching');
  });

  test('when 14 days passed with no report, then a steward closes it as lost, with no outcome and a system line', async () => {
    const { caseId, mentor } = await watchingCase(t.app);
    await getSequelize().query(`UPDATE cases SET closed_at = now() - interval '15 days' WHERE id = $1`, { bind: [caseId] });
    expect((await mentor.browser.post(`/api/cases/${caseId}/close-as-lost`).set(JSON_HEADERS).send({})).status).toBe(403);
    const steward = await signedIn(t.app, 'steward', 'Wynn Steward');
    const res = await steward.browser.post(`/api/cases/${caseId}/close-as-lost`).set(JSON_HEADERS).send({});
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('lost');
    const row = await caseRow(caseId);
    expect(row.outcome).toBeNull();
    expect(row.published).toBe(false);
    expect((await systemLines(caseId)).at(-1)).toMatch(/^Wynn Steward closed the case as lost: no recovery report came in 14 days/);
    expect(await checkIns(caseId)).toHaveLength(0);
  });
});
