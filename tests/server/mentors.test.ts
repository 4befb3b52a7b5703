import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { bayesianAverage, DEFAULT_RATING_PRIOR, wilsonInterval } from '../../server/shared/track-record';
import { getSequelize } from '../../server/src/db/sequelize';
import { publishFieldNote } from '../../server/src/modules/library/field-notes';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { createCase, createResolvedCase, daysAgo } from '../factories/cases';
import { JSON_HEADERS, signedIn } from '../factories/sign-in';
import { createUser } from '../factories/users';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const HOUR = 3_600_000;

/** A message on the case at a chosen time, with the case's next sequence number. */
async function messageAt(caseId: number, authorId: number, at: Date, kind: 'text' | 'aside' = 'text'): Promise<void> {
  await getSequelize().transaction(async (transaction) => {
    const [[{ next_seq: seq }]] = (await getSequelize().query(`UPDATE cases SET next_seq = next_seq + 1 WHERE id = $1 RETURNING next_seq`, {
      bind: [caseId],
      transaction,
    })) as unknown as [[{ next_seq: number }]];
    await getSequelize().query(`INSERT INTO messages (case_id, seq, author_id, kind, body, created_at) VALUES ($1, $2, $3, $4, 'A reply.', $5)`, {
      bind: [caseId, seq, authorId, kind, at],
      transaction,
    });
  });
}

describe('GET /api/mentors/:id', () => {
  test('when a mentor has a record, then the profile shows cases helped, the median first reply, the Wilson interval, Bayesian stars and recent notes', async () => {
    const mentor = await signedIn(t.app, 'mentor', 'Hale Mentor');
    const grower = await signedIn(t.app, 'grower');
    const outcomes = [
      ['recovered', 5],
      ['recovered', 5],
      ['partly', 4],
      ['lost', 2],
    ] as const;
    const resolved: number[] = [];
    for (const [outcome] of outcomes) {
      resolved.push(await createResolvedCase(grower.user.id, { mentorId: mentor.user.id, outcome, openedAt: daysAgo(10), published: outcome === 'recovered' }));
    }
    for (const [index, [, stars]] of outcomes.entries()) {
      await getSequelize().query(`UPDATE cases SET stars = $2 WHERE id = $1`, { bind: [resolved[index], stars] });
    }
    const note = await publishFieldNote(resolved[0]);
    // Advice to discard an unsafe batch is no failed rescue: it counts as a case helped, in no rate.
    await createResolvedCase(grower.user.id, { mentorId: mentor.user.id, outcome: 'lost', remedy: 'discard-restart', openedAt: daysAgo(10) });
    await createCase(grower.user.id, { status: 'watching', mentorId: mentor.user.id });
    await createCase(grower.user.id, { status: 'in_conversation', mentorId: mentor.user.id });
    // First replies 2, 4 and 9 hours after opening; an aside and a later reply do not count.
    for (const [index, hours] of [2, 4, 9].entries()) {
      const opened = daysAgo(10);
      await getSequelize().query(`UPDATE cases SET opened_at = $2 WHERE id = $1`, { bind: [resolved[index], opened] });
      await messageAt(resolved[index], mentor.user.id, new Date(opened.getTime() + (hours - 1) * HOUR), 'aside');
      await messageAt(resolved[index], mentor.user.id, new Date(opened.getTime() + hours * HOUR));
      await messageAt(resolved[index], mentor.user.id, new Date(opened.getTime() + (hours + 20) * HOUR));
    }

    const res = await grower.browser.get(`/api/mentors/${mentor.user.id}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: mentor.user.id, displayName: 'Hale Mentor', role: 'mentor', casesHelped: 6, casesOpen: 1, repliesCounted: 3 });
    // from the data above: the median of 2, 4 and 9 hours
    expect(res.body.medianHoursToFirstReply).toBeCloseTo(4, 6);
    const expected = wilsonInterval(3, 4);
    expect(res.body.record).toMatchObject({ trials: 4, saved: 3, recovered: 2, partly: 1, lost: 1 });
    expect(res.body.record.lower).toBeCloseTo(expected.lower, 12);
    expect(res.body.record.upper).toBeCloseTo(expected.upper, 12);
    // common practice: Bayesian average with the prior stated in track-record.ts (5 ratings of 3.5)
    expect(res.body.record.stars.average).toBeCloseTo(bayesianAverage(16, 4, DEFAULT_RATING_PRIOR), 12);
    expect(res.body.record.stars.average).toBeCloseTo((3.5 * 5 + 16) / 9, 12);
    expect(res.body.record.text).toBe(`saved 3 of 4 batches, 1 of them partly (lower bound ${Math.round(expected.lower * 100)} %)`);
    expect(res.body.recentNotes.map((n: { slug: string }) => n.slug)).toContain(note.slug);
    expect(JSON.stringify(res.body)).not.toContain(grower.user.email);
  });

  test('when the mentor has no cases yet, then the record is empty, not zero', async () => {
    const mentor = await signedIn(t.app, 'mentor');
    const res = await mentor.browser.get(`/api/mentors/${mentor.user.id}`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ casesHelped: 0, medianHoursToFirstReply: null, repliesCounted: 0, recentNotes: [] });
    expect(res.body.record).toMatchObject({ trials: 0, rate: null, lower: 0, upper: 1, text: 'no recovery reports yet' });
    expect(res.body.record.stars).toMatchObject({ average: DEFAULT_RATING_PRIOR.priorMean, mean: null, ratings: 0 });
  });

  test('when a visitor asks, then 401; when the id is a grower or not a number, then 404', async () => {
    const mentor = await signedIn(t.app, 'mentor');
    expect((await agent(t.app).get(`/api/mentors/${mentor.user.id}`)).status).toBe(401);
    const grower = await signedIn(t.app, 'grower');
    expect((await grower.browser.get(`/api/mentors/${grower.user.id}`)).status).toBe(404);
    expect((await grower.browser.get('/api/mentors/abc')).status).toBe(404);
    expect((await grower.browser.get('/api/mentors/99999999')).status).toBe(404);
  });
});

describe('PATCH /api/mentors/me', () => {
  test('when a mentor writes about themselves, then it is stored trimmed and every signed-in person reads it on the profile; empty takes it away', async () => {
    const mentor = await signedIn(t.app, 'mentor');
    const about = 'Eight winters of IMO from the hazel coppice.\nAsk me about <b>bran piles</b> that run hot.';
    const saved = await mentor.browser.patch('/api/mentors/me').set(JSON_HEADERS).send({ about: `  ${about}  ` });
    expect(saved.status).toBe(200);
    expect(saved.body).toEqual({ about });
    const grower = await signedIn(t.app, 'grower');
    expect((await grower.browser.get(`/api/mentors/${mentor.user.id}`).expect(200)).body.about).toBe(about);
    expect((await mentor.browser.patch('/api/mentors/me').set(JSON_HEADERS).send({ about: '   ' }).expect(200)).body).toEqual({ about: null });
    expect((await grower.browser.get(`/api/mentors/${mentor.user.id}`).expect(200)).body.about).toBeNull();
  });

  test('when it is too long or not text, then 400 names the field and nothing changes; a grower gets 403 and a visitor 401', async () => {
    const mentor = await signedIn(t.app, 'mentor');
    await mentor.browser.patch('/api/mentors/me').set(JSON_HEADERS).send({ about: 'LAB from rice wash.' }).expect(200);
    const long = await mentor.browser.patch('/api/mentors/me').set(JSON_HEADERS).send({ about: 'x'.repeat(601) });
    expect(long.status).toBe(400);
    expect(long.body.error.fields.about).toBe('Keep it under 600 characters.');
    expect((await mentor.browser.patch('/api/mentors/me').set(JSON_HEADERS).send({ about: 42 })).status).toBe(400);
    expect((await mentor.browser.get(`/api/mentors/${mentor.user.id}`).expect(200)).body.about).toBe('LAB from rice wash.');
    const grower = await signedIn(t.app, 'grower');
    expect((await grower.browser.patch('/api/mentors/me').set(JSON_HEADERS).send({ about: 'I mentor now' })).status).toBe(403);
    expect((await agent(t.app).patch('/api/mentors/me').set(JSON_HEADERS).send({ about: 'hi' })).status).toBe(401);
  });
});

describe('GET /api/mentors', () => {
  test('when a mentor asks, then the active mentors are listed with the open cases each holds; disabled ones, growers and stewards are not', async () => {
    const asking = await signedIn(t.app, 'mentor');
    const grower = await signedIn(t.app, 'grower');
    const busy = await createUser({ role: 'mentor', displayName: 'Busy Mentor' });
    const idle = await createUser({ role: 'mentor', displayName: 'Idle Mentor' });
    const disabled = await createUser({ role: 'mentor', disabled: true });
    const steward = await createUser({ role: 'steward' });
    await createCase(grower.user.id, { status: 'in_conversation', mentorId: busy.id });
    await createCase(grower.user.id, { status: 'over_to_grower', mentorId: busy.id });
    // Over: not counted as open.
    await createResolvedCase(grower.user.id, { mentorId: busy.id });

    const res = await asking.browser.get('/api/mentors');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ page: 1, total: res.body.items.length, pageSize: res.body.items.length });
    const byId = new Map(res.body.items.map((m: { id: number }) => [m.id, m]));
    expect(byId.get(busy.id)).toEqual({ id: busy.id, displayName: 'Busy Mentor', openCases: 2 });
    expect(byId.get(idle.id)).toEqual({ id: idle.id, displayName: 'Idle Mentor', openCases: 0 });
    expect(byId.has(asking.user.id)).toBe(true);
    for (const absent of [disabled.id, steward.id, grower.user.id]) expect(byId.has(absent)).toBe(false);
    // The least loaded first, so the list itself suggests who has room.
    const loads = res.body.items.map((m: { openCases: number }) => m.openCases);
    expect(loads).toEqual([...loads].sort((a, b) => a - b));
    // Nothing beyond the three fields: no e-mail addresses.
    expect(JSON.stringify(res.body)).not.toContain('@');
  });

  test('when a visitor or a grower asks, then 401 and 403; a steward gets the list', async () => {
    expect((await agent(t.app).get('/api/mentors')).status).toBe(401);
    const grower = await signedIn(t.app, 'grower');
    expect((await grower.browser.get('/api/mentors')).status).toBe(403);
    const steward = await signedIn(t.app, 'steward');
    expect((await steward.browser.get('/api/mentors')).status).toBe(200);
  });
});
