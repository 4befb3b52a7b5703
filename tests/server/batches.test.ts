import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { JSON_HEADERS, signedIn } from '../factories/sign-in';
import { createBatch, createCase, createResolvedCase, dayString, daysAgo } from '../factories/cases';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const shelfBatch = {
  stage: 'IMO2',
  label: 'Beech hollow rice, jar 3',
  madeOn: dayString(4),
  ingredients: 'cooked rice from the beech hollow box',
  culture: { value: 900, unit: 'g' },
  sugar: { value: 450, unit: 'g' },
  sugarType: 'brown',
  container: 'clay crock',
  cover: 'paper and string',
  location: 'north shed, shade',
};

describe('the batch shelf', () => {
  test('when a grower records a batch, then 201 answers it with its age in days and the check in brief', async () => {
    const { browser } = await signedIn(t.app);
    const res = await browser.post('/api/batches').set(JSON_HEADERS).send(shelfBatch);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      stage: 'IMO2',
      label: 'Beech hollow rice, jar 3',
      madeOn: shelfBatch.madeOn,
      ageDays: 4,
      culture: { value: 900, unit: 'g' },
      sugar: { value: 450, unit: 'g' },
      location: 'north shed, shade',
    });
    // Half the equal-weight rule (common practice): high risk, 450 g to add; aw 0.958 from the
    // REFERENCES.md worked example (derived).
    expect(res.body.check).toMatchObject({ ratio: 0.5, targetRatio: 1, risk: 'high', sugarToAdd: { grams: 450 } });
    expect(res.body.check.waterActivity).toBeCloseTo(0.958, 2);

    const read = await browser.get(`/api/batches/${res.body.id}`);
    expect(read.status).toBe(200);
    expect(read.body).toMatchObject({ id: res.body.id, ageDays: 4, cases: [] });
  });

  test('when a batch has no weights, then check is null', async () => {
    const { browser } = await signedIn(t.app);
    const res = await browser.post('/api/batches').set(JSON_HEADERS).send({ stage: 'FPJ', label: 'Mugwort tips', madeOn: dayString(0) });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ check: null, culture: null, sugar: null, ingredients: '', ageDays: 0 });
  });

  test('when a grower lists the shelf, then only their own batches come back, newest made first', async () => {
    const { browser, user } = await signedIn(t.app);
    const other = await signedIn(t.app);
    await createBatch(user.id, { label: 'older', madeOn: dayString(30) });
    await createBatch(user.id, { label: 'newer', madeOn: dayString(2) });
    await createBatch(other.user.id, { label: 'not mine' });
    const res = await browser.get('/api/batches');
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(2);
    expect(res.body.items.map((b: { label: string }) => b.label)).toEqual(['newer', 'older']);
    expect(res.body.items[1].ageDays).toBe(30);
  });

  test('when a batch has a case still open, then the shelf names its newest open case; closed cases are not named', async () => {
    const { browser, user } = await signedIn(t.app);
    const worked = await createBatch(user.id, { label: 'worked on', madeOn: dayString(3) });
    const settled = await createBatch(user.id, { label: 'settled', madeOn: dayString(6) });
    const quiet = await createBatch(user.id, { label: 'quiet', madeOn: dayString(9) });
    await createCase(user.id, { batchId: worked.id, title: 'First worry about it', openedAt: daysAgo(2) });
    const newest = await createCase(user.id, { batchId: worked.id, title: 'Second worry about it', openedAt: daysAgo(1), status: 'in_conversation' });
    await createResolvedCase(user.id, { batchId: worked.id, title: 'Sorted out today', openedAt: daysAgo(0.5) });
    await createResolvedCase(user.id, { batchId: settled.id, title: 'All well again' });
    const res = await browser.get('/api/batches');
    expect(res.status).toBe(200);
    const byLabel = Object.fromEntries(res.body.items.map((b: { label: string; openCase: unknown }) => [b.label, b.openCase]));
    expect(byLabel).toEqual({
      'worked on': { id: newest, title: 'Second worry about it', status: 'in_conversation' },
      settled: null,
      quiet: null,
    });
  });

  test("when another grower asks for, or changes, someone's batch, then 404 and nothing changes", async () => {
    const owner = await signedIn(t.app);
    const stranger = await signedIn(t.app);
    const batch = await createBatch(owner.user.id);
    expect((await stranger.browser.get(`/api/batches/${batch.id}`)).status).toBe(404);
    const patch = await stranger.browser.patch(`/api/batches/${batch.id}`).set(JSON_HEADERS).send({ label: 'mine now' });
    expect(patch.status).toBe(404);
    // Even a mentor does not read a grower's shelf: batches are the owner's alone.
    const mentor = await signedIn(t.app, 'mentor');
    expect((await mentor.browser.get(`/api/batches/${batch.id}`)).status).toBe(404);
    const read = await owner.browser.get(`/api/batches/${batch.id}`);
    expect(read.body.label).toBe('Cedar hollow rice');
  });

  test('when a grower takes a batch off the shelf, then it leaves the shelf list, is listed with finished=true, the counts say so, and null puts it back', async () => {
    const { browser, user } = await signedIn(t.app);
    const kept = await createBatch(user.id, { label: 'still fizzing', madeOn: dayString(3) });
    const done = await createBatch(user.id, { label: 'used on the leeks', madeOn: dayString(40) });
    const off = await browser.patch(`/api/batches/${done.id}`).set(JSON_HEADERS).send({ finishedOn: dayString(1) });
    expect(off.status).toBe(200);
    expect(off.body.finishedOn).toBe(dayString(1));

    const shelf = await browser.get('/api/batches').expect(200);
    expect(shelf.body.items.map((b: { label: string }) => b.label)).toEqual(['still fizzing']);
    expect(shelf.body).toMatchObject({ total: 1, counts: { onShelf: 1, finished: 1 } });
    expect(shelf.body.items[0].finishedOn).toBeNull();
    const gone = await browser.get('/api/batches?finished=true').expect(200);
    expect(gone.body.items.map((b: { id: number }) => b.id)).toEqual([done.id]);
    expect(gone.body).toMatchObject({ total: 1, counts: { onShelf: 1, finished: 1 } });
    // The batch itself is still there, as it was.
    expect((await browser.get(`/api/batches/${done.id}`).expect(200)).body).toMatchObject({ label: 'used on the leeks', finishedOn: dayString(1) });

    await browser.patch(`/api/batches/${done.id}`).set(JSON_HEADERS).send({ finishedOn: null }).expect(200);
    const back = await browser.get('/api/batches').expect(200);
    expect(back.body.items.map((b: { id: number }) => b.id).sort()).toEqual([kept.id, done.id].sort());
    expect(back.body.counts).toEqual({ onShelf: 2, finished: 0 });
  });

  test('when the day it was finished comes before the day it was made, or is in the future, then 400 names the field and nothing changes', async () => {
    const { browser, user } = await signedIn(t.app);
    const batch = await createBatch(user.id, { madeOn: dayString(10) });
    const early = await browser.patch(`/api/batches/${batch.id}`).set(JSON_HEADERS).send({ finishedOn: dayString(12) });
    expect(early.status).toBe(400);
    expect(early.body.error.fields.finishedOn).toBe(`The batch was made on ${dayString(10)}: it cannot be finished before that.`);
    const future = await browser.patch(`/api/batches/${batch.id}`).set(JSON_HEADERS).send({ finishedOn: dayString(-3) });
    expect(future.status).toBe(400);
    expect(future.body.error.fields.finishedOn).toBe('The date cannot be in the future.');
    await browser.patch(`/api/batches/${batch.id}`).set(JSON_HEADERS).send({ finishedOn: dayString(2) }).expect(200);
    // Moving the day it was made past the day it was finished is refused on madeOn.
    const late = await browser.patch(`/api/batches/${batch.id}`).set(JSON_HEADERS).send({ madeOn: dayString(1) });
    expect(late.status).toBe(400);
    expect(late.body.error.fields.madeOn).toBe(`The batch was finished on ${dayString(2)}: it was made before that.`);
    expect((await browser.get(`/api/batches/${batch.id}`).expect(200)).body).toMatchObject({ madeOn: dayString(10), finishedOn: dayString(2) });
    const created = await browser.post('/api/batches').set(JSON_HEADERS).send({ ...shelfBatch, madeOn: dayString(4), finishedOn: dayString(6) });
    expect(created.status).toBe(400);
    expect(created.body.error.fields.finishedOn).toBeTruthy();
    expect((await browser.get('/api/batches?finished=maybe')).status).toBe(400);
  });

  test('when a visitor asks for the shelf, then 401', async () => {
    expect((await agent(t.app).get('/api/batches')).status).toBe(401);
    expect((await agent(t.app).post('/api/batches').set(JSON_HEADERS).send(shelfBatch)).status).toBe(401);
  });

  test('when the owner patches some fields, then only those change, null clears a weight, and the check follows', async () => {
    const { browser, user } = await signedIn(t.app);
    const batch = await createBatch(user.id, { sugar: { value: 450, unit: 'g' } });
    const res = await browser.patch(`/api/batches/${batch.id}`).set(JSON_HEADERS).send({ sugar: { value: 900, unit: 'g' }, notes: 'topped up' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ label: 'Cedar hollow rice', notes: 'topped up', sugar: { value: 900, unit: 'g' } });
    expect(res.body.check).toMatchObject({ ratio: 1, risk: 'medium' });
    const cleared = await browser.patch(`/api/batches/${batch.id}`).set(JSON_HEADERS).send({ sugar: null });
    expect(cleared.body).toMatchObject({ sugar: null, check: null, notes: 'topped up' });
  });

  test.each([
    ['an empty body', {}, '_'],
    ['an empty label', { label: '  ' }, 'label'],
    ['an unknown stage', { stage: 'IMO7' }, 'stage'],
    ['a date in the future', { madeOn: dayString(-5) }, 'madeOn'],
    ['a malformed date', { madeOn: '12/03/2025' }, 'madeOn'],
    ['a negative weight', { culture: { value: -1, unit: 'g' } }, 'culture.value'],
    ['an unknown unit', { sugar: { value: 5, unit: 'cup' } }, 'sugar.unit'],
    ['moisture over 100 %', { moisturePct: 101 }, 'moisturePct'],
    ['an overlong label', { label: 'x'.repeat(121) }, 'label'],
  ])('when a PATCH has %s, then 400 names the field and the batch is unchanged', async (_what, body, field) => {
    const { browser, user } = await signedIn(t.app);
    const batch = await createBatch(user.id);
    const res = await browser.patch(`/api/batches/${batch.id}`).set(JSON_HEADERS).send(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
    const read = await browser.get(`/api/batches/${batch.id}`);
    expect(read.body).toMatchObject({ label: 'Cedar hollow rice', stage: 'IMO2', culture: { value: 900, unit: 'g' } });
  });

  test('when a PATCH tries to move the batch to another owner, then the field is ignored', async () => {
    const { browser, user } = await signedIn(t.app);
    const other = await signedIn(t.app);
    const batch = await createBatch(user.id);
    const res = await browser.patch(`/api/batches/${batch.id}`).set(JSON_HEADERS).send({ ownerId: other.user.id, label: 'still mine' });
    expect(res.status).toBe(200);
    expect((await other.browser.get(`/api/batches/${batch.id}`)).status).toBe(404);
    expect((await browser.get(`/api/batches/${batch.id}`)).body.label).toBe('still mine');
  });

  test('when the id is not a number, then 404', async () => {
    const { browser } = await signedIn(t.app);
    expect((await browser.get('/api/batches/abc')).status).toBe(404);
  });
});
