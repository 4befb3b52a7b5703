import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { urgencyScore } from '../../server/shared/urgency';
import { getSequelize } from '../../server/src/db/sequelize';
import { casesRepository } from '../../server/src/modules/cases/cases.repository';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { JSON_HEADERS, signedIn } from '../factories/sign-in';
import { createBatch, createCase, dayString } from '../factories/cases';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000);

async function caseRow(id: number) {
  const [row] = await getSequelize().query<Record<string, unknown>>(
    `SELECT status, mentor_id, published, urgency, grower_id, search_text, waiting_since FROM cases WHERE id = :id`,
    { replacements: { id }, type: QueryTypes.SELECT },
  );
  return row;
}

describe('POST /api/cases', () => {
  test('when a grower opens a case from scratch, then 201 answers awaiting_mentor with the urgency, the check and a first system line', async () => {
    const { browser, user } = await signedIn(t.app);
    const res = await browser.post('/api/cases').set(JSON_HEADERS).send({
      stage: 'IMO2',
      symptoms: ['smell-putrid', 'free-liquid'],
      description: 'Grey liquid pooling under the rice after the rain week.',
      location: 'under the eaves',
      madeOn: dayString(2),
      numbers: { culture: { value: 900, unit: 'g' }, sugar: { value: 450, unit: 'g' } },
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: 'awaiting_mentor', stage: 'IMO2', location: 'under the eaves', grower: { id: user.id }, mentor: null, photos: [] });
    // Putrid (25) + free liquid (20) + high risk (15) + a 2-day-old batch (10) = 70, waiting under an
    // hour: the table in server/shared/urgency.ts.
    expect(res.body.urgency).toBe(70);
    expect(res.body.urgencyLevel).toBe('high');
    expect(res.body.urgency).toBe(urgencyScore({ symptoms: ['smell-putrid', 'free-liquid'], risk: 'high', batchAgeDays: 2, hoursWaiting: 0, stage: 'IMO2' }).score);
    // A putrid smell is a discard sign: high, whatever the numbers (common practice; cautions.ts).
    expect(res.body.check).toMatchObject({ risk: 'high', ratio: 0.5 });
    expect(res.body.check.verdict).toMatch(/Discard/);
    expect(res.body.title).toBe('IMO2: putrid or rotten smell and 1 more');
    expect(res.body.numbers).toMatchObject({ culture: { value: 900, unit: 'g' }, sugar: { value: 450, unit: 'g' }, sugarType: 'brown' });
    expect(res.body.grower.email).toBeUndefined();

    const messages = await getSequelize().query<{ seq: number; kind: string; body: string; author_id: number }>(
      `SELECT seq, kind, body, author_id FROM messages WHERE case_id = :id ORDER BY seq`,
      { replacements: { id: res.body.id }, type: QueryTypes.SELECT },
    );
    expect(messages).toEqual([{ seq: 1, kind: 'system', body: 'Case opened', author_id: user.id }]);
    const row = await caseRow(res.body.id);
    expect(row.search_text).toMatch(/Grey liquid pooling/);
    expect(row.search_text).toMatch(/Putrid or rotten/);
    expect(row.waiting_since).not.toBeNull();
  });

  test('when the body tries to set status, mentor, published, urgency or the grower, then those fields are ignored', async () => {
    const { browser, user } = await signedIn(t.app);
    const mentor = await signedIn(t.app, 'mentor');
    const other = await signedIn(t.app);
    const res = await browser.post('/api/cases').set(JSON_HEADERS).send({
      stage: 'FPJ',
      symptoms: ['colour-white'],
      title: 'White film on the mugwort juice',
      status: 'recovered',
      mentorId: mentor.user.id,
      published: true,
      urgency: 99,
      urgencyLevel: 'high',
      growerId: other.user.id,
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: 'awaiting_mentor', mentor: null, published: false, urgency: 0, urgencyLevel: 'low' });
    const row = await caseRow(res.body.id);
    expect(row).toMatchObject({ status: 'awaiting_mentor', mentor_id: null, published: false, urgency: 0, grower_id: user.id });
    expect((await other.browser.get(`/api/cases/${res.body.id}`)).status).toBe(404);
  });

  test("when a grower opens a case from their batch without numbers, then the batch's weights and age are used", async () => {
    const { browser, user } = await signedIn(t.app);
    const batch = await createBatch(user.id, { madeOn: dayString(1), sugar: { value: 900, unit: 'g' } });
    const res = await browser.post('/api/cases').set(JSON_HEADERS).send({ batchId: batch.id, stage: 'IMO2', symptoms: ['bubbling'] });
    expect(res.status).toBe(201);
    expect(res.body.batch).toMatchObject({ id: batch.id, label: 'Cedar hollow rice', ageDays: 1 });
    expect(res.body.batchMadeOn).toBe(dayString(1));
    // Equal weights of rice culture and brown sugar: aw ≈ 0.907 (REFERENCES.md worked example, derived) → medium.
    expect(res.body.check).toMatchObject({ ratio: 1, risk: 'medium' });
    // bubbling 20 + medium 7 + 1-day-old batch 10 (server/shared/urgency.ts)
    expect(res.body.urgency).toBe(37);
    const read = await browser.get(`/api/batches/${batch.id}`);
    expect(read.body.cases.map((c: { id: number }) => c.id)).toEqual([res.body.id]);
  });

  test("when the batch is another grower's, then 404 and no case is made", async () => {
    const { browser, user } = await signedIn(t.app);
    const other = await signedIn(t.app);
    const batch = await createBatch(other.user.id);
    const res = await browser.post('/api/cases').set(JSON_HEADERS).send({ batchId: batch.id, stage: 'IMO2', symptoms: [] });
    expect(res.status).toBe(404);
    const [count] = await getSequelize().query<{ n: number }>(`SELECT count(*)::int AS n FROM cases WHERE grower_id = :id`, {
      replacements: { id: user.id },
      type: QueryTypes.SELECT,
    });
    expect(count.n).toBe(0);
  });

  test.each([
    ['a symptom twice', { symptoms: ['bubbling', 'bubbling'] }, 'symptoms'],
    ['an unknown symptom', { symptoms: ['glowing'] }, 'symptoms.0'],
    ['more than 20 symptoms', { symptoms: Array.from({ length: 21 }, () => 'slimy') }, 'symptoms'],
    ['an overlong title', { title: 'x'.repeat(141) }, 'title'],
    ['an overlong description', { description: 'x'.repeat(5001) }, 'description'],
    ['a missing stage', { stage: undefined }, 'stage'],
    ['numbers without a culture weight', { numbers: { sugar: { value: 1, unit: 'g' } } }, 'numbers.culture'],
    ['a negative sugar weight', { numbers: { culture: { value: 1, unit: 'g' }, sugar: { value: -1, unit: 'g' } } }, 'numbers.sugar.value'],
  ])('when the body has %s, then 400 names the field', async (_what, change, field) => {
    const { browser } = await signedIn(t.app);
    const res = await browser.post('/api/cases').set(JSON_HEADERS).send({ stage: 'IMO2', symptoms: ['slimy'], ...change });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  test('when a mentor opens a case for their own batch, then it is theirs as grower', async () => {
    const { browser, user } = await signedIn(t.app, 'mentor');
    const res = await browser.post('/api/cases').set(JSON_HEADERS).send({ stage: 'LAB', symptoms: ['smell-sour'] });
    expect(res.status).toBe(201);
    expect(res.body.grower.id).toBe(user.id);
  });

  test('when a visitor opens a case, then 401', async () => {
    expect((await agent(t.app).post('/api/cases').set(JSON_HEADERS).send({ stage: 'IMO2' })).status).toBe(401);
  });
});

describe('GET /api/cases/:id', () => {
  test('when the grower, a mentor or a steward reads a case, then they get it; only the steward sees the e-mail', async () => {
    const owner = await signedIn(t.app, 'grower', 'Wren of the east terraces');
    const id = await createCase(owner.user.id, { stage: 'FFJ', symptoms: ['smell-alcoholic'] });
    const own = await owner.browser.get(`/api/cases/${id}`);
    expect(own.status).toBe(200);
    expect(own.body).toMatchObject({ id, stage: 'FFJ', grower: { displayName: 'Wren of the east terraces' } });
    const mentor = await signedIn(t.app, 'mentor');
    const byMentor = await mentor.browser.get(`/api/cases/${id}`);
    expect(byMentor.status).toBe(200);
    expect(byMentor.body.grower).toEqual({ id: owner.user.id, displayName: 'Wren of the east terraces' });
    const steward = await signedIn(t.app, 'steward');
    const bySteward = await steward.browser.get(`/api/cases/${id}`);
    expect(bySteward.body.grower.email).toBe(owner.user.email);
  });

  test("when another grower reads someone's case, or the id is unknown, then 404", async () => {
    const owner = await signedIn(t.app);
    const stranger = await signedIn(t.app);
    const id = await createCase(owner.user.id);
    expect((await stranger.browser.get(`/api/cases/${id}`)).status).toBe(404);
    expect((await stranger.browser.get('/api/cases/999999999')).status).toBe(404);
    expect((await stranger.browser.get('/api/cases/not-a-number')).status).toBe(404);
  });

  test('when a case has waited five hours, then its urgency has five more points than when it opened, with the reason', async () => {
    const { browser, user } = await signedIn(t.app);
    const id = await createCase(user.id, { symptoms: ['slimy'], openedAt: hoursAgo(5.2) });
    const res = await browser.get(`/api/cases/${id}`);
    // slimy 20 + 5 hours × 1 point (server/shared/urgency.ts)
    expect(res.body.urgency).toBe(25);
    expect(res.body.waitingHours).toBeCloseTo(5.2, 1);
    expect(res.body.urgencyReasons).toContain('Waiting for a reply for 5 hours (+5)');
  });
});

describe('GET /api/cases (the rounds)', () => {
  test("when a grower lists cases, then only their own come back, whatever mine says, and an aside never shows", async () => {
    const { browser, user } = await signedIn(t.app);
    const other = await signedIn(t.app);
    const mentor = await signedIn(t.app, 'mentor');
    const mineA = await createCase(user.id, { title: 'mine, open' });
    const mineB = await createCase(user.id, { title: 'mine, watching', status: 'watching', mentorId: mentor.user.id });
    await createCase(other.user.id, { title: 'not mine' });
    await getSequelize().transaction(async (transaction) => {
      await casesRepository.appendMessage(mineA, { authorId: mentor.user.id, kind: 'text', body: 'Can you smell it from a step away?' }, transaction);
      await casesRepository.appendMessage(mineA, { authorId: mentor.user.id, kind: 'aside', body: 'Probably lost; ask about the cover.' }, transaction);
    });
    for (const query of ['', '?mine=0', '?mine=1', '?status=all']) {
      const res = await browser.get(`/api/cases${query}`);
      expect(res.status).toBe(200);
      expect(res.body.items.every((c: { grower: { id: number } }) => c.grower.id === user.id)).toBe(true);
    }
    const all = await browser.get('/api/cases');
    expect(all.body.total).toBe(2);
    expect(all.body.items.map((c: { id: number }) => c.id).sort()).toEqual([mineA, mineB].sort());
    const a = all.body.items.find((c: { id: number }) => c.id === mineA);
    expect(a.lastMessagePreview).toBe('Can you smell it from a step away?');
    expect(JSON.stringify(all.body)).not.toContain('Probably lost');
    // The mentor's rounds do show their own aside as the latest line.
    const rounds = await mentor.browser.get('/api/cases?status=awaiting_mentor&sort=newest&pageSize=100');
    expect(rounds.body.items.find((c: { id: number }) => c.id === mineA).lastMessagePreview).toBe('Probably lost; ask about the cover.');
  });

  test('when a mentor lists without a status, then the open cases come back, and status picks others', async () => {
    const grower = await signedIn(t.app);
    const { browser, user } = await signedIn(t.app, 'mentor');
    const open = await createCase(grower.user.id, { status: 'in_conversation', mentorId: user.id });
    const over = await createCase(grower.user.id, { status: 'over_to_grower', mentorId: user.id });
    const watching = await createCase(grower.user.id, { status: 'watching', mentorId: user.id });
    const ids = (res: { body: { items: { id: number }[] } }) => res.body.items.map((c) => c.id).sort((x, y) => x - y);
    expect(ids(await browser.get('/api/cases?mine=1'))).toEqual([open, over]);
    expect(ids(await browser.get('/api/cases?mine=1&status=watching'))).toEqual([watching]);
    expect(ids(await browser.get('/api/cases?mine=1&status=watching,in_conversation'))).toEqual([open, watching]);
    expect(ids(await browser.get('/api/cases?mine=1&status=all'))).toEqual([open, over, watching]);
    const item = (await browser.get('/api/cases?mine=1&status=in_conversation')).body.items[0];
    expect(item.mentor).toEqual({ id: user.id, displayName: 'Test mentor' });
    expect(item.grower).toEqual({ id: grower.user.id, displayName: 'Test grower' });
  });

  test('when a mentor filters by stage, symptom and age, then only matching cases come back', async () => {
    const grower = await signedIn(t.app);
    const { browser, user } = await signedIn(t.app, 'mentor');
    const make = (stage: 'FPJ' | 'LAB', symptoms: ('bubbling' | 'slimy' | 'smell-sour')[], hours: number) =>
      createCase(grower.user.id, { stage, symptoms, status: 'in_conversation', mentorId: user.id, openedAt: hoursAgo(hours) });
    const fpjFresh = await make('FPJ', ['bubbling'], 1);
    const fpjOld = await make('FPJ', ['slimy', 'smell-sour'], 30);
    const labOld = await make('LAB', ['smell-sour'], 50);
    const ids = async (q: string) => (await browser.get(`/api/cases?mine=1&${q}`)).body.items.map((c: { id: number }) => c.id).sort((x: number, y: number) => x - y);
    expect(await ids('stage=FPJ')).toEqual([fpjFresh, fpjOld]);
    expect(await ids('stage=FPJ,LAB')).toEqual([fpjFresh, fpjOld, labOld]);
    expect(await ids('symptom=smell-sour')).toEqual([fpjOld, labOld]);
    expect(await ids('symptom=bubbling,slimy')).toEqual([fpjFresh, fpjOld]);
    expect(await ids('minAgeHours=24')).toEqual([fpjOld, labOld]);
    expect(await ids('maxAgeHours=40')).toEqual([fpjFresh, fpjOld]);
    expect(await ids('minAgeHours=24&maxAgeHours=40&stage=FPJ')).toEqual([fpjOld]);
    const bad = await browser.get('/api/cases?stage=IMO9&sort=loudest');
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['stage.0', 'sort']));
  });

  test('when a mentor sorts, then urgency (with the hours waited) is the default, and oldest and newest go by opening time', async () => {
    const grower = await signedIn(t.app);
    const { browser, user } = await signedIn(t.app, 'mentor');
    const claimed = { status: 'in_conversation' as const, mentorId: user.id };
    // urgency: putrid 25 now; slimy 20 + 10 h waiting = 30; dry crust 2 + 20 h (capped at 20) = 22, and not waiting: 2
    const putrid = await createCase(grower.user.id, { ...claimed, symptoms: ['smell-putrid'], openedAt: hoursAgo(2), waitingSince: null });
    const slimy = await createCase(grower.user.id, { ...claimed, symptoms: ['slimy'], openedAt: hoursAgo(10), waitingSince: hoursAgo(10) });
    const crusty = await createCase(grower.user.id, { ...claimed, symptoms: ['dry-crusty'], openedAt: hoursAgo(40), waitingSince: hoursAgo(40) });
    const quiet = await createCase(grower.user.id, { ...claimed, symptoms: ['dry-crusty'], openedAt: hoursAgo(60), waitingSince: null });
    const list = async (q: string) => (await browser.get(`/api/cases?mine=1${q}`)).body.items as { id: number; urgency: number; urgencyLevel: string; waitingHours: number | null }[];
    const byUrgency = await list('');
    expect(byUrgency.map((c) => c.id)).toEqual([slimy, putrid, crusty, quiet]);
    expect(byUrgency.map((c) => c.urgency)).toEqual([30, 25, 22, 2]);
    expect(byUrgency.map((c) => c.urgencyLevel)).toEqual(['medium', 'medium', 'medium', 'low']);
    expect(byUrgency[3].waitingHours).toBeNull();
    expect(byUrgency[0].waitingHours).toBeCloseTo(10, 1);
    // the list and the case page agree on the effective score
    const page = await browser.get(`/api/cases/${slimy}`);
    expect(page.body.urgency).toBe(30);
    expect((await list('&sort=oldest')).map((c) => c.id)).toEqual([quiet, crusty, slimy, putrid]);
    expect((await list('&sort=newest')).map((c) => c.id)).toEqual([putrid, slimy, crusty, quiet]);
  });

  test('when a mentor pages through the list, then pages do not overlap and total counts all', async () => {
    const grower = await signedIn(t.app);
    const { browser, user } = await signedIn(t.app, 'mentor');
    const made: number[] = [];
    for (let i = 0; i < 7; i++) made.push(await createCase(grower.user.id, { status: 'in_conversation', mentorId: user.id, openedAt: hoursAgo(i + 1), waitingSince: null }));
    const first = await browser.get('/api/cases?mine=1&sort=newest&pageSize=3');
    const second = await browser.get('/api/cases?mine=1&sort=newest&pageSize=3&page=2');
    const third = await browser.get('/api/cases?mine=1&sort=newest&pageSize=3&page=3');
    expect(first.body).toMatchObject({ total: 7, page: 1, pageSize: 3 });
    const ids = [first, second, third].flatMap((r) => r.body.items.map((c: { id: number }) => c.id));
    expect(ids).toEqual(made);
    expect((await browser.get('/api/cases?mine=1&pageSize=3&page=9')).body).toMatchObject({ items: [], total: 7 });
  });

  test('when a visitor asks for the rounds, then 401', async () => {
    expect((await agent(t.app).get('/api/cases')).status).toBe(401);
  });
});
