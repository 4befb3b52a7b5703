// The mail to a mentor when a grower writes on a case they hold and it stays unread
// (grower-wrote-watcher.ts), and the mentor's choice to have it or not.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { getSequelize } from '../../server/src/db/sequelize';
import { runGrowerWroteCheck } from '../../server/src/modules/threads/grower-wrote-watcher';
import { usersRepository } from '../../server/src/modules/users/users.repository';
import { GROWER_WROTE_MAIL_MINUTES } from '../../server/shared/urgency';
import { makeTestApp, type TestApp } from '../setup/test-app';
import { createThreadCase, JSON_HEADERS, newClientId, outboxFor, signedInAs } from '../factories/threads';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

type Person = Awaited<ReturnType<typeof signedInAs>>;

/** A case the mentor took an hour ago, in conversation, with nothing written on it since. */
async function heldCase(options: { title?: string; status?: 'in_conversation' | 'watching' | 'recovered' } = {}) {
  const grower = await signedInAs(t.app, 'grower', 'Rowan Brackenfield');
  const mentor = await signedInAs(t.app, 'mentor', 'Marta Ashgrove');
  const kase = await createThreadCase({ growerId: grower.user.id, mentorId: mentor.user.id, status: options.status ?? 'in_conversation', openedHoursAgo: 2, title: options.title });
  await getSequelize().query(`UPDATE cases SET claimed_at = now() - interval '1 hour' WHERE id = :id`, { replacements: { id: kase.id } });
  return { grower, mentor, kase };
}

async function write(person: Person, caseId: number, body: string, kind: 'text' | 'aside' = 'text') {
  const res = await person.browser.post(`/api/cases/${caseId}/messages`).set(JSON_HEADERS).send({ clientId: newClientId(), body, kind });
  expect(res.status, res.text).toBe(201);
}

/** Moves every post of the case back in time, as if written that many minutes ago. */
async function age(caseId: number, minutes: number) {
  await getSequelize().query(`UPDATE messages SET created_at = created_at - make_interval(mins => :minutes) WHERE case_id = :caseId`, { replacements: { caseId, minutes } });
}

const mailsTo = (mentor: Person) => outboxFor(mentor.user.email, 'grower_wrote');

describe('the mail to a mentor when a grower writes and it stays unread', () => {
  test(`when a grower's post on a held case is unread for over ${GROWER_WROTE_MAIL_MINUTES} minutes, then the mentor gets one mail quoting it with the case link, and only one while it stays unread`, async () => {
    const { grower, mentor, kase } = await heldCase({ title: 'IMO2: crust went grey overnight' });
    await write(grower, kase.id, 'The grey patch doubled since this morning and the jar smells like wet cardboard now.');
    await age(kase.id, GROWER_WROTE_MAIL_MINUTES + 1);
    const pokes = t.mailPokes;
    expect(await runGrowerWroteCheck(t.ctx)).toBeGreaterThanOrEqual(1);
    const mails = await mailsTo(mentor);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Rowan Brackenfield wrote on “IMO2: crust went grey overnight”');
    expect(mails[0].body_text).toContain('Hello Marta Ashgrove,');
    expect(mails[0].body_text).toContain('“The grey patch doubled since this morning and the jar smells like wet cardboard now.”');
    expect(mails[0].body_text).toContain(`${t.config.publicUrl}/cases/${kase.id}#conversation\n`);
    expect(mails[0].body_text).toContain(`${t.config.publicUrl}/rounds#mail-settings`);
    expect(t.mailPokes).toBeGreaterThan(pokes);

    // More from the grower, still unread: no second mail.
    await write(grower, kase.id, 'Should I scrape it off?');
    await age(kase.id, GROWER_WROTE_MAIL_MINUTES + 1);
    await runGrowerWroteCheck(t.ctx);
    expect(await mailsTo(mentor)).toHaveLength(1);
  });

  test('when the mentor has read the case and the grower writes again, then a new unread post brings a second mail', async () => {
    const { grower, mentor, kase } = await heldCase();
    await write(grower, kase.id, 'It is fizzing again after the sugar.');
    await age(kase.id, GROWER_WROTE_MAIL_MINUTES + 1);
    await runGrowerWroteCheck(t.ctx);
    expect(await mailsTo(mentor)).toHaveLength(1);
    // Reading the thread (the case page asks for its messages) moves the mentor's read mark.
    await mentor.browser.get(`/api/cases/${kase.id}/messages`).expect(200);
    await runGrowerWroteCheck(t.ctx);
    expect(await mailsTo(mentor)).toHaveLength(1);
    await write(grower, kase.id, 'Now there is a white film on top as well.');
    await age(kase.id, GROWER_WROTE_MAIL_MINUTES + 1);
    await runGrowerWroteCheck(t.ctx);
    const mails = await mailsTo(mentor);
    expect(mails).toHaveLength(2);
    expect(mails[1].body_text).toContain('Now there is a white film on top as well.');
  });

  test('when the post is younger than the wait, already read, or answered by the mentor, then no mail', async () => {
    const young = await heldCase();
    await write(young.grower, young.kase.id, 'Just checked, a little froth.');
    await runGrowerWroteCheck(t.ctx);
    expect(await mailsTo(young.mentor)).toHaveLength(0);

    const read = await heldCase();
    await write(read.grower, read.kase.id, 'Froth is gone this evening.');
    await read.mentor.browser.get(`/api/cases/${read.kase.id}/messages`).expect(200);
    await age(read.kase.id, GROWER_WROTE_MAIL_MINUTES + 1);
    await runGrowerWroteCheck(t.ctx);
    expect(await mailsTo(read.mentor)).toHaveLength(0);

    const answered = await heldCase();
    await write(answered.grower, answered.kase.id, 'Is brown sugar fine?');
    await write(answered.mentor, answered.kase.id, 'Yes, brown is what I use.');
    await age(answered.kase.id, GROWER_WROTE_MAIL_MINUTES + 1);
    await runGrowerWroteCheck(t.ctx);
    expect(await mailsTo(answered.mentor)).toHaveLength(0);
  });

  test('when the mentor turned the mail off, the account is disabled, the post is hidden, came before the claim, or the case has ended, then no mail', async () => {
    const optedOut = await heldCase();
    await optedOut.mentor.browser.patch('/api/cases/preferences/grower-wrote-mail').set(JSON_HEADERS).send({ on: false }).expect(200);
    await write(optedOut.grower, optedOut.kase.id, 'Any news?');

    const disabled = await heldCase();
    await write(disabled.grower, disabled.kase.id, 'Any news?');
    await usersRepository.update(disabled.mentor.user.id, { disabled: true });

    const hidden = await heldCase();
    await write(hidden.grower, hidden.kase.id, 'Buy my compost at the market!');
    await getSequelize().query(`UPDATE messages SET hidden = true WHERE case_id = :id AND kind = 'text'`, { replacements: { id: hidden.kase.id } });

    const before = await heldCase();
    await write(before.grower, before.kase.id, 'Written before anyone took the case.');
    await getSequelize().query(`UPDATE cases SET claimed_at = now() WHERE id = :id`, { replacements: { id: before.kase.id } });

    const ended = await heldCase({ status: 'watching' });
    await write(ended.grower, ended.kase.id, 'Looks better after the sugar.');
    await getSequelize().query(`UPDATE cases SET status = 'recovered' WHERE id = :id`, { replacements: { id: ended.kase.id } });

    for (const c of [optedOut, disabled, hidden, before, ended]) await age(c.kase.id, GROWER_WROTE_MAIL_MINUTES + 1);
    await runGrowerWroteCheck(t.ctx);
    for (const c of [optedOut, disabled, hidden, before, ended]) expect(await mailsTo(c.mentor)).toHaveLength(0);
  });

  test('when the case is "watching" after the closing and the grower writes, then the mentor is mailed', async () => {
    const { grower, mentor, kase } = await heldCase({ status: 'watching' });
    await write(grower, kase.id, 'Day 3: the smell is back.');
    await age(kase.id, GROWER_WROTE_MAIL_MINUTES + 1);
    await runGrowerWroteCheck(t.ctx);
    expect(await mailsTo(mentor)).toHaveLength(1);
  });
});

describe('GET and PATCH /api/cases/preferences/grower-wrote-mail', () => {
  test('when a new mentor asks, then it is on; when they turn it off and on, then that is what is stored', async () => {
    const mentor = await signedInAs(t.app, 'mentor');
    expect((await mentor.browser.get('/api/cases/preferences/grower-wrote-mail').expect(200)).body).toEqual({ on: true });
    expect((await mentor.browser.patch('/api/cases/preferences/grower-wrote-mail').set(JSON_HEADERS).send({ on: false }).expect(200)).body).toEqual({ on: false });
    expect((await mentor.browser.get('/api/cases/preferences/grower-wrote-mail').expect(200)).body).toEqual({ on: false });
    expect(await usersRepository.mailChoice(mentor.user.id, 'growerWrote')).toBe(false);
    expect((await mentor.browser.patch('/api/cases/preferences/grower-wrote-mail').set(JSON_HEADERS).send({ on: true }).expect(200)).body).toEqual({ on: true });
  });

  test('when the body is not a true or false, then 400; when a grower asks, then 403', async () => {
    const mentor = await signedInAs(t.app, 'mentor');
    const bad = await mentor.browser.patch('/api/cases/preferences/grower-wrote-mail').set(JSON_HEADERS).send({ on: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.on).toBeTruthy();
    const grower = await signedInAs(t.app, 'grower');
    expect((await grower.browser.get('/api/cases/preferences/grower-wrote-mail')).status).toBe(403);
  });
});
