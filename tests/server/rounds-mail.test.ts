import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Role } from '../../server/shared/case-status';
import { getSequelize } from '../../server/src/db/sequelize';
import { startMailCatcher, type MailCatcher } from '../../server/src/lib/mail-catcher';
import { createTransport } from '../../server/src/modules/mail/mailer';
import { sendDueMail } from '../../server/src/modules/mail/outbox';
import { runUrgentCaseCheck } from '../../server/src/modules/threads/urgent-watcher';
import { usersRepository } from '../../server/src/modules/users/users.repository';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { createUser } from '../factories/users';
import { createThreadCase, JSON_HEADERS, newClientId, outboxFor, signedInAs } from '../factories/threads';

let t: TestApp;
let catcher: MailCatcher;
beforeAll(async () => {
  t = makeTestApp();
  catcher = await startMailCatcher(0);
});
afterAll(async () => {
  await catcher.close();
  await t.close();
});

const signedIn = (role: Role, displayName?: string) => signedInAs(t.app, role, displayName);

function post(browser: Awaited<ReturnType<typeof signedIn>>['browser'], caseId: number, body: string, kind: 'text' | 'aside' = 'text') {
  return browser.post(`/api/cases/${caseId}/messages`).set(JSON_HEADERS).send({ clientId: newClientId(), body, kind });
}

describe('the mail to a grower when a mentor replies', () => {
  test('when a mentor replies and the grower is not in the thread, then one mail with the case link is queued and the worker is woken', async () => {
    const grower = await signedIn('grower', 'Ada Fernhill');
    const mentor = await signedIn('mentor', 'Bea Hollow');
    const kase = await createThreadCase({ growerId: grower.user.id, title: 'IMO2: putrid smell' });
    const pokes = t.mailPokes;
    await post(mentor.browser, kase.id, 'Please take the lid off and smell it again.').expect(201);
    const mails = await outboxFor(grower.user.email, 'mentor_reply');
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Bea Hollow replied about “IMO2: putrid smell”');
    // The link opens the case at its conversation, below the case and the batches like it.
    expect(mails[0].body_text).toContain(`${t.config.publicUrl}/cases/${kase.id}#conversation\n`);
    expect(mails[0].dedupe_key).toMatch(new RegExp(`^reply:${kase.id}:\\d+$`));
    expect(t.mailPokes).toBe(pokes + 1);
    // and where to turn them off
    expect(mails[0].body_text).toContain(`${t.config.publicUrl}/account`);
  });

  test('when the grower turned the reply mail off on their account page, then a reply queues none; turned on again, the next does', async () => {
    const grower = await signedIn('grower');
    const mentor = await signedIn('mentor');
    expect((await grower.browser.get('/api/cases/preferences/reply-mail').expect(200)).body).toEqual({ on: true });
    await grower.browser.patch('/api/cases/preferences/reply-mail').set(JSON_HEADERS).send({ on: false }).expect(200);
    const kase = await createThreadCase({ growerId: grower.user.id });
    await post(mentor.browser, kase.id, 'Stir it once and leave it be.').expect(201);
    expect(await outboxFor(grower.user.email, 'mentor_reply')).toHaveLength(0);
    expect((await grower.browser.patch('/api/cases/preferences/reply-mail').set(JSON_HEADERS).send({ on: true }).expect(200)).body).toEqual({ on: true });
    const other = await createThreadCase({ growerId: grower.user.id });
    await post(mentor.browser, other.id, 'Add a handful of sugar on top.').expect(201);
    expect(await outboxFor(grower.user.email, 'mentor_reply')).toHaveLength(1);
    expect((await agent(t.app).get('/api/cases/preferences/reply-mail')).status).toBe(401);
  });

  test('when a mentor replies again within 10 minutes, then no second mail is queued for that case', async () => {
    // At most one per case per 10 minutes: the limit set in issue 4.
    const grower = await signedIn('grower');
    const mentor = await signedIn('mentor');
    const kase = await createThreadCase({ growerId: grower.user.id });
    await post(mentor.browser, kase.id, 'First thought.').expect(201);
    await post(mentor.browser, kase.id, 'Second thought.').expect(201);
    await post(mentor.browser, kase.id, 'Third thought.').expect(201);
    expect(await outboxFor(grower.user.email, 'mentor_reply')).toHaveLength(1);
  });

  test('when the last reply mail for the case is older than 10 minutes, then a new reply queues another', async () => {
    const grower = await signedIn('grower');
    const mentor = await signedIn('mentor');
    const kase = await createThreadCase({ growerId: grower.user.id });
    await post(mentor.browser, kase.id, 'Morning reply.').expect(201);
    // Move the first mail 11 minutes into the past, slot and all, as if time had passed.
    await getSequelize().query(
      `UPDATE outbox_mail SET created_at = now() - interval '11 minutes', dedupe_key = dedupe_key || '-earlier' WHERE to_address = :to`,
      { replacements: { to: grower.user.email } },
    );
    await post(mentor.browser, kase.id, 'Afternoon reply.').expect(201);
    expect(await outboxFor(grower.user.email, 'mentor_reply')).toHaveLength(2);
  });

  test('when the mentor writes an aside, or the grower writes, then no mail goes to the grower', async () => {
    const grower = await signedIn('grower');
    const mentor = await signedIn('mentor');
    const kase = await createThreadCase({ growerId: grower.user.id });
    await post(mentor.browser, kase.id, 'Only for mentors.', 'aside').expect(201);
    await post(grower.browser, kase.id, 'Here is more detail.').expect(201);
    expect(await outboxFor(grower.user.email)).toHaveLength(0);
  });

  test('when the queued mail is sent, then the local mail catcher receives it for the grower', async () => {
    const grower = await signedIn('grower', 'Ada Fernhill');
    const mentor = await signedIn('mentor', 'Bea Hollow');
    const kase = await createThreadCase({ growerId: grower.user.id, title: 'FPJ: slimy top' });
    await post(mentor.browser, kase.id, 'Skim the slime off and tell me what is under it.').expect(201);
    const transport = createTransport(`smtp://127.0.0.1:${catcher.port}`);
    try {
      // Other test files leave mail in the shared outbox: send until nothing is due.
      let sent = 0;
      for (let n = await sendDueMail(transport, t.config.MAIL_FROM); n > 0; n = await sendDueMail(transport, t.config.MAIL_FROM)) sent += n;
      expect(sent).toBeGreaterThanOrEqual(1);
    } finally {
      transport.close();
    }
    const caught = await getSequelize().query<{ envelope_to: string; subject: string; body_text: string }>(
      `SELECT envelope_to, subject, body_text FROM caught_mail WHERE envelope_to = :to`,
      { replacements: { to: grower.user.email }, type: QueryTypes.SELECT },
    );
    expect(caught).toHaveLength(1);
    expect(caught[0].subject).toBe('Bea Hollow replied about “FPJ: slimy top”');
    expect(caught[0].body_text).toContain(`${t.config.publicUrl}/cases/${kase.id}`);
    const [sent] = await getSequelize().query<{ status: string }>(`SELECT status FROM outbox_mail WHERE to_address = :to`, {
      replacements: { to: grower.user.email },
      type: QueryTypes.SELECT,
    });
    expect(sent.status).toBe('sent');
  });
});

describe('the mail to mentors about an urgent case nobody took', () => {
  async function optedInMentor(on = true) {
    const mentor = await createUser({ role: 'mentor' });
    if (on) await usersRepository.update(mentor.id, { notifyUrgent: true });
    return mentor;
  }
  const urgentMails = async (to: string, caseId: number) => (await outboxFor(to, 'urgent_case')).filter((m) => m.dedupe_key?.startsWith(`urgent:${caseId}:`));

  test('when a high-urgency case has waited over an hour unclaimed, then each opted-in mentor gets one mail, once', async () => {
    const keen = await optedInMentor();
    const quiet = await optedInMentor(false);
    const grower = await createUser();
    // 25 putrid + 20 bubbling stored, + 2 hours waiting = 47: high from 45 (server/shared/urgency.ts).
    const kase = await createThreadCase({ growerId: grower.id, symptoms: ['smell-putrid', 'bubbling'], urgency: 45, openedHoursAgo: 2, title: 'IMO1: putrid and bubbling' });
    const pokes = t.mailPokes;
    expect(await runUrgentCaseCheck(t.ctx)).toBeGreaterThanOrEqual(1);
    const mails = await urgentMails(keen.email, kase.id);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toContain('IMO1: putrid and bubbling');
    expect(mails[0].body_text).toContain(`${t.config.publicUrl}/cases/${kase.id}`);
    // and where to turn them off: the setting at the foot of the rounds
    expect(mails[0].body_text).toContain(`${t.config.publicUrl}/rounds#mail-settings`);
    expect(await urgentMails(quiet.email, kase.id)).toHaveLength(0);
    expect(t.mailPokes).toBeGreaterThan(pokes);
    await runUrgentCaseCheck(t.ctx);
    expect(await urgentMails(keen.email, kase.id)).toHaveLength(1);
  });

  test('when the case is claimed, younger than an hour, or not high, then no urgent mail is sent for it', async () => {
    const keen = await optedInMentor();
    const holder = await createUser({ role: 'mentor' });
    const grower = await createUser();
    const claimed = await createThreadCase({ growerId: grower.id, status: 'in_conversation', mentorId: holder.id, urgency: 50, openedHoursAgo: 3 });
    const young = await createThreadCase({ growerId: grower.id, urgency: 50, openedHoursAgo: 0.5 });
    // 20 stored + 3 hours = 23: medium.
    const mild = await createThreadCase({ growerId: grower.id, urgency: 20, openedHoursAgo: 3 });
    await runUrgentCaseCheck(t.ctx);
    for (const kase of [claimed, young, mild]) expect(await urgentMails(keen.email, kase.id)).toHaveLength(0);
  });
});
