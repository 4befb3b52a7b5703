import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { makeTestApp, type TestApp } from '../setup/test-app';
import { createUser } from '../factories/users';
import { insertCase, personSignedIn } from '../factories/steward-data';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

// A hand-worked community in January 2001 (no other test writes cases that long ago).
// 2001-01-01 was a Monday (published: any perpetual calendar), so it starts an ISO week.
async function januaryCommunity() {
  const grower = await createUser();
  const mentor = await createUser({ role: 'mentor', displayName: 'Hand-worked Mentor' });
  const base = { growerId: grower.id, mentorId: mentor.id };
  await insertCase({ ...base, stage: 'IMO1', openedAt: '2001-01-01T08:00Z', firstReplyAt: '2001-01-01T09:00Z', status: 'recovered', resolvedAt: '2001-01-10T12:00Z', remedy: 'add-sugar' });
  await insertCase({ ...base, stage: 'IMO1', openedAt: '2001-01-02T10:00Z', firstReplyAt: '2001-01-02T12:00Z', status: 'recovered', resolvedAt: '2001-01-11T12:00Z', remedy: 'add-sugar' });
  await insertCase({ ...base, stage: 'FPJ', openedAt: '2001-01-03T00:00Z', firstReplyAt: '2001-01-03T04:00Z', status: 'lost', resolvedAt: '2001-01-12T12:00Z', remedy: 'drain-liquid' });
  // Sunday night: still the week of 1 January; never answered.
  await insertCase({ growerId: grower.id, stage: 'IMO1', openedAt: '2001-01-07T23:00Z', status: 'withdrawn' });
  await insertCase({ ...base, stage: 'LAB', openedAt: '2001-01-15T06:00Z', firstReplyAt: '2001-01-15T16:00Z', status: 'recovered', resolvedAt: '2001-01-20T12:00Z', remedy: 'add-sugar' });
  await insertCase({ ...base, stage: 'IMO1', openedAt: '2001-01-16T00:00Z', firstReplyAt: '2001-01-16T03:00Z', status: 'lost', resolvedAt: '2001-01-19T12:00Z', remedy: 'add-sugar' });
  return { grower, mentor };
}

describe('GET /api/steward/metrics', () => {
  test('when a steward asks for a hand-worked January, then the weekly counts, reply times and recovery rates match the hand calculation', async () => {
    await januaryCommunity();
    const { browser } = await personSignedIn(t.app, 'steward');
    const res = await browser.get('/api/steward/metrics?from=2001-01-01&to=2001-01-21').expect(200);
    const m = res.body;
    expect(m).toMatchObject({ from: '2001-01-01', to: '2001-01-21' });

    expect(m.casesPerWeek.map((w: { week: string; total: number }) => [w.week, w.total])).toEqual([
      ['2001-01-01', 4],
      ['2001-01-08', 0],
      ['2001-01-15', 2],
    ]);
    expect(m.casesPerWeek[0].byStage).toMatchObject({ IMO1: 3, FPJ: 1, LAB: 0 });
    expect(m.casesPerWeek[2].byStage).toMatchObject({ IMO1: 1, LAB: 1 });

    // Hours to first reply, week 1: [1, 2, 4] → median 2; 90th percentile by linear interpolation
    // (Hyndman & Fan type 7): h = (3 − 1)·0.9 = 1.8 → 2 + 0.8·(4 − 2) = 3.6 (hand-worked).
    expect(m.firstReply[0]).toMatchObject({ week: '2001-01-01', opened: 4, replied: 3, medianHours: 2 });
    expect(m.firstReply[0].p90Hours).toBeCloseTo(3.6, 9);
    expect(m.firstReply[1]).toMatchObject({ week: '2001-01-08', opened: 0, replied: 0, medianHours: null, p90Hours: null });
    // Week 3: [3, 10] → median 6.5; p90: h = 0.9 → 3 + 0.9·7 = 9.3 (hand-worked).
    expect(m.firstReply[2].medianHours).toBeCloseTo(6.5, 9);
    expect(m.firstReply[2].p90Hours).toBeCloseTo(9.3, 9);

    // Wilson score intervals at 95 %, hand-worked from Wilson (1927) with z = 1.95996:
    // 2 of 3 → [0.2077, 0.9385]; 1 of 1 → [0.2065, 1]; 0 of 1 → [0, 0.7935]; 3 of 4 → [0.3006, 0.9544].
    const byStage = Object.fromEntries(m.recoveryByStage.map((r: { key: string }) => [r.key, r]));
    expect(m.recoveryByStage.map((r: { key: string }) => r.key)).toEqual(['IMO1', 'LAB', 'FPJ']);
    expect(byStage.IMO1).toMatchObject({ recovered: 2, lost: 1, trials: 3 });
    expect(byStage.IMO1.lower).toBeCloseTo(0.2077, 3);
    expect(byStage.IMO1.upper).toBeCloseTo(0.9385, 3);
    expect(byStage.LAB.lower).toBeCloseTo(0.2065, 3);
    expect(byStage.LAB.upper).toBe(1);
    expect(byStage.FPJ).toMatchObject({ recovered: 0, lost: 1, rate: 0, lower: 0 });
    expect(byStage.FPJ.upper).toBeCloseTo(0.7935, 3);
    const byRemedy = Object.fromEntries(m.recoveryByRemedy.map((r: { key: string }) => [r.key, r]));
    expect(byRemedy['add-sugar']).toMatchObject({ recovered: 3, lost: 1, rate: 0.75 });
    expect(byRemedy['add-sugar'].lower).toBeCloseTo(0.3006, 3);
    expect(byRemedy['add-sugar'].upper).toBeCloseTo(0.9544, 3);
    expect(byRemedy['drain-liquid']).toMatchObject({ recovered: 0, lost: 1 });
  });

  test('when cases are open now, then open-by-urgency counts them whatever the range, and each mentor shows what they hold and saw through', async () => {
    const { grower, mentor } = await januaryCommunity();
    const { browser } = await personSignedIn(t.app, 'steward');
    const before = (await browser.get('/api/steward/metrics?from=2001-01-01&to=2001-01-21').expect(200)).body;
    await insertCase({ growerId: grower.id, mentorId: mentor.id, status: 'in_conversation', urgencyLevel: 'high' });
    await insertCase({ growerId: grower.id, status: 'awaiting_mentor', urgencyLevel: 'medium' });
    await insertCase({ growerId: grower.id, mentorId: mentor.id, status: 'watching', urgencyLevel: 'high' });
    const after = (await browser.get('/api/steward/metrics?from=2001-01-01&to=2001-01-21').expect(200)).body;
    expect(after.openByUrgency.high - before.openByUrgency.high).toBe(1);
    expect(after.openByUrgency.medium - before.openByUrgency.medium).toBe(1);
    expect(after.openByUrgency.low - before.openByUrgency.low).toBe(0);
    expect(after.openByUrgency.total - before.openByUrgency.total).toBe(2);
    const load = after.mentorLoad.find((l: { mentorId: string }) => l.mentorId === String(mentor.id));
    expect(load).toEqual({ mentorId: String(mentor.id), displayName: 'Hand-worked Mentor', open: 1, watching: 1, resolved: 5 });
  });

  test('when a mentor holds nothing, then they are listed with zeros rather than left out', async () => {
    const idle = await createUser({ role: 'mentor', displayName: 'Idle Mentor' });
    const { browser } = await personSignedIn(t.app, 'steward');
    const res = await browser.get('/api/steward/metrics?from=2001-01-01&to=2001-01-21').expect(200);
    expect(res.body.mentorLoad).toContainEqual({ mentorId: String(idle.id), displayName: 'Idle Mentor', open: 0, watching: 0, resolved: 0 });
  });

  test('when no range is given, then it is this week and the eleven before it, up to today', async () => {
    const { browser } = await personSignedIn(t.app, 'steward');
    const res = await browser.get('/api/steward/metrics').expect(200);
    const now = new Date();
    const today = now.toISOString().slice(0, 10);
    const monday = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate()) - ((now.getUTCDay() + 6) % 7) * 86_400_000;
    const expectedFrom = new Date(monday - 11 * 7 * 86_400_000).toISOString().slice(0, 10);
    expect(res.body).toMatchObject({ from: expectedFrom, to: today });
    expect(new Date(`${res.body.from}T00:00:00Z`).getUTCDay()).toBe(1);
  });

  test('when the dates are not dates, the start is after the end, or the span is over three years, then 400', async () => {
    const { browser } = await personSignedIn(t.app, 'steward');
    const bad = await browser.get('/api/steward/metrics?from=2001-13-01');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.from).toBeTruthy();
    expect((await browser.get('/api/steward/metrics?from=2001-02-01&to=2001-01-01')).status).toBe(400);
    expect((await browser.get('/api/steward/metrics?from=2001-01-01&to=2005-01-01')).status).toBe(400);
  });
});
