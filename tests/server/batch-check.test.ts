import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { unit } from 'mathjs';
import { SAFETY_CAUTIONS } from '../../server/shared/cautions';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { JSON_HEADERS } from '../factories/sign-in';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const check = (body: unknown) => agent(t.app).post('/api/batch-check').set(JSON_HEADERS).send(body as object);

describe('POST /api/batch-check', () => {
  test('when a visitor checks 900 g of rice culture with 900 g brown sugar, then the worked example of REFERENCES.md comes back', async () => {
    const res = await check({ stage: 'IMO2', culture: { value: 900, unit: 'g' }, sugar: { value: 900, unit: 'g' }, sugarType: 'brown' });
    expect(res.status).toBe(200);
    // Derived in REFERENCES.md "Worked examples" from USDA SR28 (cooked white rice 68.44 g water /
    // 100 g, NDB 20445, published; brown sugar 1.34 g water and 94.56 g sucrose, NDB 19334, from memory)
    // and Norrish K = 6.47 (Norrish 1966; Chirife et al. 1980, from memory): water 628.0 g,
    // sucrose 851.0 g, aw 0.907 ± 0.003.
    expect(res.body.waterActivity.waterGrams).toBeCloseTo(628.0, 1);
    expect(res.body.waterActivity.sucroseGrams).toBeCloseTo(851.0, 1);
    expect(Math.abs(res.body.waterActivity.estimate - 0.907)).toBeLessThanOrEqual(0.003);
    expect(res.body.ratio).toBeCloseTo(1, 12);
    // Equal weights for IMO2: common practice (Park & DuPonte, CTAHR BIO-9, 2008, from memory).
    expect(res.body.targetRatio).toBe(1);
    expect(res.body.sugarToAdd.grams).toBe(0);
    expect(res.body.scaleReading.zeroed).toMatchObject({ grams: 1800, value: 1800, unit: 'g' });
    // REFERENCES.md: "yeasts, moulds (bacteria held at about their limit)"; minimum aw for most
    // bacteria 0.91 (Beuchat 1981, published), yeasts 0.88 and moulds 0.80 (Adams & Moss, published).
    const growth = Object.fromEntries(res.body.growth.map((g: { group: string; canGrow: boolean }) => [g.group, g.canGrow]));
    expect(growth).toMatchObject({ bacteria: false, yeasts: true, moulds: true });
    expect(res.body.risk).toBe('medium');
    expect(res.body.cautions).toEqual([...SAFETY_CAUTIONS]);
    expect(res.body.notes.length).toBeGreaterThan(0);
  });

  test('when the same culture has only 450 g brown sugar, then aw is about 0.958, bacteria can grow, the risk is high and 450 g more is asked for', async () => {
    const res = await check({ stage: 'IMO2', culture: { value: 900, unit: 'g' }, sugar: { value: 450, unit: 'g' } });
    expect(res.status).toBe(200);
    // REFERENCES.md worked example (derived, see above): water 622.0 g, sucrose 425.5 g, aw 0.958.
    expect(res.body.waterActivity.waterGrams).toBeCloseTo(622.0, 1);
    expect(res.body.waterActivity.sucroseGrams).toBeCloseTo(425.5, 1);
    expect(Math.abs(res.body.waterActivity.estimate - 0.958)).toBeLessThanOrEqual(0.003);
    expect(res.body.risk).toBe('high');
    expect(res.body.sugarToAdd).toMatchObject({ grams: 450, value: 450, unit: 'g' });
    expect(res.body.growth.find((g: { group: string }) => g.group === 'bacteria').canGrow).toBe(true);
    expect(res.body.notes.join(' ')).toMatch(/450 g more brown sugar/);
  });

  test('when the culture is weighed in pounds, then the ratio uses the exact avoirdupois factor', async () => {
    // published: mathjs exact factors; 1 lb = 0.45359237 kg exactly (1959 agreement, NIST SP 811, from memory).
    const pounds = unit(900, 'g').toNumber('lb');
    const res = await check({ stage: 'IMO2', culture: { value: pounds, unit: 'lb' }, sugar: { value: 900, unit: 'g' } });
    expect(res.status).toBe(200);
    expect(Math.abs(res.body.ratio - 1)).toBeLessThan(1e-12);
  });

  test('when a container weight is given, then the scale reading with the container adds it', async () => {
    const res = await check({ stage: 'IMO2', culture: { value: 900, unit: 'g' }, sugar: { value: 450, unit: 'g' }, containerWeight: { value: 350, unit: 'g' } });
    expect(res.body.scaleReading.zeroed.grams).toBe(1800);
    expect(res.body.scaleReading.withContainer.grams).toBe(2150);
  });

  test.each([
    ['a negative culture weight', { culture: { value: -5, unit: 'g' } }, 'culture.value'],
    ['an absurd culture weight', { culture: { value: 2000, unit: 'kg' } }, 'culture.value'],
    ['an unknown unit', { sugar: { value: 1, unit: 'stone' } }, 'sugar.unit'],
    ['an unknown stage', { stage: 'IMO9' }, 'stage'],
    ['moisture over 100 %', { moisturePct: 120 }, 'moisturePct'],
    ['a weight sent as text', { culture: { value: '900', unit: 'g' } }, 'culture.value'],
  ])('when the body has %s, then 400 names the field', async (_what, change, field) => {
    const res = await check({ stage: 'IMO2', culture: { value: 900, unit: 'g' }, sugar: { value: 900, unit: 'g' }, ...change });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  test('when the body is missing altogether, then 400 names the required fields', async () => {
    const res = await check({});
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['stage', 'culture', 'sugar']));
  });
});
