import { describe, expect, test } from 'vitest';
import {
  BACTERIA_AW_LIMIT,
  GROWTH_LIMITS,
  MAX_BATCH_GRAMS,
  SATURATED_WATER_ACTIVITY,
  STAGE_SUGAR_RULES,
  SUCROSE_MOLAR_MASS,
  SUCROSE_SOLUBILITY_PER_100G_WATER,
  SUGAR_TYPES,
  WATER_ACTIVITY_SCALE,
  batchCheckInputSchema,
  canGrowAt,
  checkBatch,
  norrishWaterActivity,
  riskOf,
  sucroseMixWaterActivity,
  sugarNeededForWaterActivity,
  type BatchCheckInput,
} from '@shared/batch-check';
import { SAFETY_CAUTIONS } from '@shared/cautions';
import { STAGE_IDS } from '@shared/vocabulary';
import { toGrams } from '@shared/units';

const COOKED_RICE = 0.6844; // published: USDA SR28 NDB 20445, cooked white rice, 68.44 g water / 100 g

/** Water activity of a sucrose solution of the given % w/w, through the model's own path. */
const awAtPercent = (pct: number) => sucroseMixWaterActivity(100 - pct, pct).estimate;
/** …and at a molality (mol sucrose per kg water). */
const awAtMolality = (m: number) => sucroseMixWaterActivity(1000, m * SUCROSE_MOLAR_MASS).estimate;

const rice = (sugarGrams: number, extra: Partial<BatchCheckInput> = {}): BatchCheckInput => ({
  stage: 'IMO2',
  culture: { value: 900, unit: 'g' },
  sugar: { value: sugarGrams, unit: 'g' },
  ...extra,
});

describe('water activity of sucrose solutions', () => {
  test.each([
    // [% w/w sucrose, published aw, source]
    [26, 0.98, 'published: NY State Dept. of Agriculture & Markets water-activity food-group table'],
    [40, 0.95, 'published: Beuchat (1981) table, as republished by Penn State Extension'],
    [50, 0.93, 'published: NY State Dept. of Agriculture & Markets table (~50 %)'],
    [55, 0.91, 'published: Beuchat (1981)'],
    [65, 0.87, 'published: Beuchat (1981)'],
  ])('when the water phase is %s percent sucrose, then the estimate is %s within 0.01 (%s)', (pct, expected) => {
    expect(Math.abs(awAtPercent(pct) - expected)).toBeLessThanOrEqual(0.01);
  });

  test('when the solution is saturated, then the estimate is about 0.85', () => {
    // published: NY State Dept. of Agriculture & Markets table, saturated sucrose (20–25 °C) ~0.85
    expect(Math.abs(SATURATED_WATER_ACTIVITY - 0.85)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(sucroseMixWaterActivity(100, 400).estimate - 0.85)).toBeLessThanOrEqual(0.01);
  });

  test.each([
    // from memory: Robinson & Stokes, Electrolyte Solutions (1959), osmotic coefficients of sucrose
    [1, 0.981],
    [2, 0.958],
    [4, 0.905],
    [6, 0.849],
  ])('when the molality is %d mol/kg, then the estimate is %s within 0.003 (Robinson & Stokes, from memory)', (m, expected) => {
    expect(Math.abs(awAtMolality(m) - expected)).toBeLessThanOrEqual(0.003);
  });

  test('when there is no sucrose, then the water activity is that of pure water', () => {
    expect(norrishWaterActivity(500, 0)).toBe(1);
  });

  test('when sucrose goes past what water can dissolve, then the extra stays undissolved', () => {
    // published: Mohos (2010) Table A2.2, 203.9 g sucrose per 100 g water at 20 °C
    const mix = sucroseMixWaterActivity(100, 300);
    expect(mix.saturated).toBe(true);
    expect(mix.dissolvedSucroseGrams).toBeCloseTo(SUCROSE_SOLUBILITY_PER_100G_WATER, 9);
    expect(mix.undissolvedSucroseGrams).toBeCloseTo(300 - 203.9, 9);
    expect(sucroseMixWaterActivity(100, 150).saturated).toBe(false);
  });
});

describe('worked examples', () => {
  test('when 900 g cooked-rice culture gets 900 g brown sugar, then water 628.0 g, sucrose 851.0 g, aw 0.907', () => {
    // derived in REFERENCES.md "Worked examples" from USDA SR28 (20445, 19334) and Norrish K = 6.47
    const result = checkBatch(rice(900));
    const aw = result.waterActivity!;
    expect(Math.abs(aw.waterGrams - 628.0)).toBeLessThan(0.1);
    expect(Math.abs(aw.sucroseGrams - 851.0)).toBeLessThan(0.1);
    expect(Math.abs(aw.estimate - 0.907)).toBeLessThanOrEqual(0.003);
    expect(aw.saturated).toBe(false);
    // REFERENCES.md: yeasts and moulds can grow, bacteria held at about their limit
    const can = Object.fromEntries(result.growth.map((g) => [g.group, g.canGrow]));
    expect(can).toMatchObject({ 'gram-negative-bacteria': false, bacteria: false, yeasts: true, moulds: true });
  });

  test('when the same culture gets 450 g brown sugar, then water 622.0 g, sucrose 425.5 g, aw 0.958, flagged', () => {
    // derived in REFERENCES.md "Worked examples"
    const result = checkBatch(rice(450));
    const aw = result.waterActivity!;
    expect(Math.abs(aw.waterGrams - 622.0)).toBeLessThan(0.1);
    expect(Math.abs(aw.sucroseGrams - 425.5)).toBeLessThan(0.1);
    expect(Math.abs(aw.estimate - 0.958)).toBeLessThanOrEqual(0.003);
    expect(result.growth.find((g) => g.group === 'bacteria')!.canGrow).toBe(true);
    expect(result.risk).toBe('high');
  });

  test.each([
    // derived in REFERENCES.md "Worked examples": brown sugar per 900 g cooked-rice culture
    [0.91, 875],
    [0.88, 1124],
    [0.86, 1286],
  ])('when the target water activity is %s, then about %s g brown sugar is needed', (targetAw, grams) => {
    const needed = sugarNeededForWaterActivity(targetAw, 900, COOKED_RICE, 'brown')!;
    expect(Math.abs(needed - grams)).toBeLessThan(3);
    const reached = checkBatch(rice(needed)).waterActivity!.estimate;
    expect(Math.abs(reached - targetAw)).toBeLessThanOrEqual(0.003);
  });

  test('when the target is below what saturated sugar reaches, then no amount of sugar is enough', () => {
    expect(sugarNeededForWaterActivity(0.84, 900, COOKED_RICE)).toBeNull();
    expect(sugarNeededForWaterActivity(0.8, 900, COOKED_RICE)).toBeNull();
  });

  test('when the culture without sugar already meets the target, then no sugar is needed', () => {
    expect(sugarNeededForWaterActivity(1, 900, COOKED_RICE)).toBe(0);
  });

  test('when the culture holds no water at all, then the model asks for no sugar', () => {
    expect(sugarNeededForWaterActivity(0.91, 900, 0)).toBe(0);
    expect(norrishWaterActivity(0, 100)).toBe(0);
  });

  test('when white sugar is used, then less of it is needed than brown for the same target', () => {
    // more sucrose and less water per gram: USDA SR28 19335 vs 19334 (from memory)
    const white = sugarNeededForWaterActivity(0.91, 900, COOKED_RICE, 'white')!;
    const brown = sugarNeededForWaterActivity(0.91, 900, COOKED_RICE, 'brown')!;
    expect(white).toBeLessThan(brown);
  });
});

describe('the solubility cap', () => {
  test('when sugar is 2 and 3 times the culture, then both give about the saturated value, not lower', () => {
    const twice = checkBatch(rice(1800)).waterActivity!;
    const thrice = checkBatch(rice(2700)).waterActivity!;
    expect(twice.saturated).toBe(true);
    expect(thrice.saturated).toBe(true);
    expect(Math.abs(twice.estimate - SATURATED_WATER_ACTIVITY)).toBeLessThan(1e-9);
    expect(Math.abs(thrice.estimate - SATURATED_WATER_ACTIVITY)).toBeLessThan(1e-9);
    // published: NY State table, saturated ~0.85
    expect(Math.abs(thrice.estimate - 0.85)).toBeLessThanOrEqual(0.01);
    // Without the cap the equation would claim a batch too dry for moulds, which is false.
    expect(norrishWaterActivity(thrice.waterGrams, thrice.sucroseGrams)).toBeLessThan(0.8);
  });

  test('when the batch is past saturation, then the notes say sugar alone cannot stop moulds', () => {
    const result = checkBatch(rice(2700));
    expect(result.notes.join(' ')).toMatch(/sugar alone cannot stop moulds/);
    expect(result.growth.find((g) => g.group === 'moulds')!.canGrow).toBe(true);
  });

  test('when cooked rice saturates, then it happens at a sugar : culture ratio of about 1.5–1.6', () => {
    // REFERENCES.md: "Past saturation (sugar : culture around 1.5–1.6 for cooked rice)"
    expect(checkBatch(rice(1350)).waterActivity!.saturated).toBe(false);
    expect(checkBatch(rice(1440)).waterActivity!.saturated).toBe(true);
  });
});

describe('sugar against the stage rule', () => {
  test('when IMO2 has half its sugar, then the rest is to add and the scale reading is culture + target', () => {
    const result = checkBatch(rice(450, { containerWeight: { value: 400, unit: 'g' } }));
    expect(result.ratio).toBeCloseTo(0.5, 12);
    expect(result.targetRatio).toBe(1);
    expect(result.sugarToAdd).toEqual({ grams: 450, value: 450, unit: 'g' });
    expect(result.scaleReading.zeroed.grams).toBeCloseTo(1800, 9);
    expect(result.scaleReading.withContainer!.grams).toBeCloseTo(2200, 9);
    expect(result.notes).toContain('Mix in or top-dress about 450 g more brown sugar, then check again tomorrow.');
  });

  test('when weights come in different units, then what to add follows the sugar’s unit', () => {
    const result = checkBatch({
      stage: 'IMO2',
      culture: { value: 2, unit: 'lb' },
      sugar: { value: 16, unit: 'oz' },
      containerWeight: { value: 0.5, unit: 'kg' },
    });
    expect(result.sugarToAdd.unit).toBe('oz');
    expect(result.sugarToAdd.value).toBeCloseTo(16, 9);
    expect(result.sugarToAdd.grams).toBeCloseTo(toGrams(1, 'lb'), 9);
    expect(result.scaleReading.zeroed.value).toBeCloseTo(64, 9);
    expect(result.scaleReading.withContainer!.grams).toBeCloseTo(toGrams(4, 'lb') + 500, 9);
    expect(result.scaleReading.withContainer!.unit).toBe('oz');
  });

  test('when the sugar is within 1 % of the target, then nothing more is asked for', () => {
    const result = checkBatch(rice(895));
    expect(result.sugarToAdd.grams).toBe(0);
    expect(result.scaleReading.zeroed.grams).toBe(1795);
  });

  test('when there is more sugar than the target, then nothing is to add and the scale reading keeps it all', () => {
    const result = checkBatch(rice(1000));
    expect(result.sugarToAdd.grams).toBe(0);
    expect(result.scaleReading.zeroed.grams).toBe(1900);
  });

  test('when no container weight is given, then there is no reading with the container', () => {
    expect(checkBatch(rice(900)).scaleReading.withContainer).toBeNull();
  });

  test('when the stage is a plant or fruit juice, then the target is equal weights', () => {
    // published: Miller et al., CTAHR SA-7 (2013), FPJ sugar equal in weight; FFJ common practice
    expect(STAGE_SUGAR_RULES.FPJ.targetRatio).toBe(1);
    expect(STAGE_SUGAR_RULES.FFJ.targetRatio).toBe(1);
    // common practice; Park & DuPonte CTAHR BIO-9 (2008) (from memory)
    expect(STAGE_SUGAR_RULES.IMO2.targetRatio).toBe(1);
    expect(STAGE_SUGAR_RULES.IMO1.targetRatio).toBe(1);
  });

  test.each(['IMO3', 'IMO4', 'LAB', 'OHN', 'WCA', 'WCS', 'other'] as const)(
    'when the stage is %s, then the sugar rule does not apply and nothing is asked for',
    (stage) => {
      const result = checkBatch({ stage, culture: { value: 1, unit: 'kg' }, sugar: { value: 0, unit: 'g' } });
      expect(result.targetRatio).toBeNull();
      expect(result.sugarToAdd.grams).toBe(0);
      expect(result.risk).toBe('low');
      expect(result.notes.join(' ')).toMatch(/sugar rule does not apply/);
      expect(result.verdict).toMatch(/does not apply/);
    },
  );

  test('when a stage without a rule gets a moisture, then water activity is still estimated', () => {
    const without = checkBatch({ stage: 'WCA', culture: { value: 1, unit: 'kg' }, sugar: { value: 0, unit: 'g' } });
    expect(without.waterActivity).toBeNull();
    expect(without.growth.every((g) => g.canGrow === null)).toBe(true);
    const withMoisture = checkBatch({ stage: 'OHN', culture: { value: 1, unit: 'kg' }, sugar: { value: 1, unit: 'kg' }, moisturePct: 80 });
    expect(withMoisture.waterActivity!.estimate).toBeLessThan(1);
    expect(withMoisture.waterActivity!.moistureSource).toBe('the moisture you entered');
  });

  test('when IMO1 has no sugar yet, then that is normal and the risk is low', () => {
    const result = checkBatch({ stage: 'IMO1', culture: { value: 900, unit: 'g' }, sugar: { value: 0, unit: 'g' } });
    expect(result.risk).toBe('low');
    expect(result.sugarToAdd.grams).toBe(0);
    expect(result.verdict).toMatch(/normal while you gather IMO1/);
  });

  test('when IMO1 is being kept with too little sugar, then it is judged like IMO2', () => {
    const result = checkBatch({ stage: 'IMO1', culture: { value: 900, unit: 'g' }, sugar: { value: 450, unit: 'g' } });
    expect(result.risk).toBe('high');
    expect(result.sugarToAdd.grams).toBe(450);
  });

  test('when the stage moisture is defaulted, then its source is given', () => {
    const result = checkBatch(rice(900));
    expect(result.waterActivity!.moisturePct).toBe(68.44);
    expect(result.waterActivity!.moistureSource).toMatch(/USDA SR28 NDB 20445/);
    for (const stage of STAGE_IDS) expect(STAGE_SUGAR_RULES[stage].moistureSource.length).toBeGreaterThan(10);
  });

  test('when the grower gives the moisture, then it replaces the default', () => {
    const wetter = checkBatch(rice(900, { moisturePct: 75 }));
    expect(wetter.waterActivity!.moisturePct).toBe(75);
    expect(wetter.waterActivity!.estimate).toBeGreaterThan(checkBatch(rice(900)).waterActivity!.estimate);
  });
});

describe('sugar compositions', () => {
  test('when brown sugar is used, then its composition is USDA SR28 NDB 19334', () => {
    // open dataset: USDA SR28 NDB 19334, water 1.34 g/100 g (published); sucrose 94.56 (from memory)
    expect(SUGAR_TYPES.brown).toMatchObject({ waterPct: 1.34, sucrosePct: 94.56 });
    expect(SUGAR_TYPES.brown.source).toMatch(/19334/);
  });

  test('when no sugar type is given, then brown is assumed', () => {
    expect(checkBatch(rice(900)).sugarType).toBe('brown');
  });

  test('when the same weight of white sugar is used, then the mix is a little drier', () => {
    const brown = checkBatch(rice(900)).waterActivity!.estimate;
    const white = checkBatch(rice(900, { sugarType: 'white' })).waterActivity!.estimate;
    expect(white).toBeLessThan(brown);
    for (const sugar of Object.values(SUGAR_TYPES)) expect(sugar.source).toMatch(/memory|published/);
  });
});

describe('growth limits', () => {
  test('when the table is read, then it holds the published minimum water activities', () => {
    // published: Adams & Moss, Food Microbiology, Table 3.10; Beuchat (1981)
    expect(Object.fromEntries(GROWTH_LIMITS.map((l) => [l.group, l.minAw]))).toEqual({
      'gram-negative-bacteria': 0.97,
      bacteria: 0.91,
      'gram-positive-bacteria': 0.9,
      yeasts: 0.88,
      moulds: 0.8,
      'halophilic-bacteria': 0.75,
      'xerophilic-moulds': 0.61,
      'osmophilic-yeasts': 0.6,
    });
    expect(WATER_ACTIVITY_SCALE).toEqual({ min: 0.6, max: 1 });
  });

  test('when the estimate equals a limit, then that group counts as able to grow', () => {
    expect(canGrowAt(0.91, 0.91)).toBe(true);
    expect(canGrowAt(0.9099, 0.91)).toBe(false);
  });
});

describe('risk', () => {
  const dormant = { role: 'keeps-dormant' as const, targetRatio: 1, gathering: false, hasDiscardSign: false };

  test('when a kept culture is at target, then the water activity decides at 0.91 and 0.88', () => {
    expect(riskOf({ ...dormant, ratio: 1, aw: BACTERIA_AW_LIMIT })).toBe('high');
    expect(riskOf({ ...dormant, ratio: 1, aw: 0.9099 })).toBe('medium');
    expect(riskOf({ ...dormant, ratio: 1, aw: 0.88 })).toBe('medium');
    expect(riskOf({ ...dormant, ratio: 1, aw: 0.8799 })).toBe('low');
  });

  test('when the ratio falls below three quarters of the target, then the risk is high whatever the water', () => {
    expect(riskOf({ ...dormant, ratio: 0.75, aw: 0.85 })).toBe('medium');
    expect(riskOf({ ...dormant, ratio: 0.7499, aw: 0.85 })).toBe('high');
  });

  test('when a kept culture is short of target but dry, then the risk is medium', () => {
    expect(riskOf({ ...dormant, ratio: 0.9, aw: 0.85 })).toBe('medium');
    expect(riskOf({ ...dormant, ratio: 0.995, aw: 0.85 })).toBe('low');
  });

  test('when a plant juice is at equal weights, then its wet mix is not counted against it', () => {
    const fpj = checkBatch({ stage: 'FPJ', culture: { value: 2, unit: 'kg' }, sugar: { value: 2, unit: 'kg' } });
    expect(fpj.waterActivity!.estimate).toBeGreaterThan(0.91);
    expect(fpj.risk).toBe('low');
    expect(checkBatch({ stage: 'FPJ', culture: { value: 2, unit: 'kg' }, sugar: { value: 1, unit: 'kg' } }).risk).toBe('high');
    expect(checkBatch({ stage: 'FFJ', culture: { value: 2, unit: 'kg' }, sugar: { value: 1.8, unit: 'kg' } }).risk).toBe('medium');
  });

  test('when a rice culture gets more sugar, then the risk steps down from high to medium to low', () => {
    expect(checkBatch(rice(450)).risk).toBe('high');
    expect(checkBatch(rice(900)).risk).toBe('medium');
    expect(checkBatch(rice(1200)).risk).toBe('low');
  });

  test('when the culture is wetter than rice at equal weights, then it is high and says how much more sugar helps', () => {
    const result = checkBatch(rice(900, { moisturePct: 78 }));
    expect(result.risk).toBe('high');
    expect(result.notes.join(' ')).toMatch(/wetter than cooked rice/);
  });

  test('when a discard sign is among the symptoms, then the risk is high and the verdict says discard', () => {
    const result = checkBatch(rice(1200, { symptoms: ['smell-putrid', 'colour-white'] }));
    expect(result.risk).toBe('high');
    expect(result.discardSigns).toEqual(['smell-putrid']);
    expect(result.verdict).toMatch(/^Discard this batch/);
    expect(result.notes[0]).toMatch(/discard this batch rather than trying to rescue it/);
  });

  test('when a batch with a discard sign is short of sugar, then it is not told to add sugar', () => {
    const result = checkBatch(rice(450, { symptoms: ['slimy'] }));
    expect(result.notes.join(' ')).not.toMatch(/Mix in or top-dress/);
  });
});

describe('plain words', () => {
  test('when any check is made, then the verdict is one sentence and the cautions are attached', () => {
    for (const sugar of [0, 450, 900, 1200, 2700]) {
      const result = checkBatch(rice(sugar));
      expect(result.verdict).toMatch(/^[A-Z][^]*\.$/);
      expect(result.verdict.split(/\.\s/).length).toBe(1);
      expect(result.cautions).toEqual([...SAFETY_CAUTIONS]);
      expect(result.notes.length).toBeGreaterThan(0);
    }
  });

  test('when the water activity is just under the bacteria line, then the notes say bacteria are only just held', () => {
    expect(checkBatch(rice(900)).notes.join(' ')).toMatch(/bacteria are held at about their limit/);
  });
});

describe('input validation', () => {
  const fieldsOf = (input: unknown) => {
    const parsed = batchCheckInputSchema.safeParse(input);
    expect(parsed.success).toBe(false);
    return Object.fromEntries(parsed.error!.issues.map((i) => [i.path.join('.'), i.message]));
  };

  test('when the input is sound, then it parses with brown sugar as the default', () => {
    const parsed = batchCheckInputSchema.parse(rice(900));
    expect(parsed.sugarType).toBe('brown');
  });

  test('when the culture weight is zero or negative, then culture.value is refused with a plain message', () => {
    expect(fieldsOf(rice(900, { culture: { value: 0, unit: 'g' } }))['culture.value']).toBe('Enter a culture weight above zero.');
    expect(fieldsOf(rice(900, { culture: { value: -5, unit: 'g' } }))['culture.value']).toBe('Enter a culture weight above zero.');
  });

  test('when the sugar is negative, then sugar.value is refused; zero sugar is allowed', () => {
    expect(fieldsOf(rice(-1))['sugar.value']).toBe('The sugar weight cannot be below zero.');
    expect(batchCheckInputSchema.safeParse(rice(0)).success).toBe(true);
  });

  test('when a weight is over 1,000 kg in any unit, then it is refused as a slip', () => {
    expect(MAX_BATCH_GRAMS).toBe(1_000_000);
    expect(fieldsOf(rice(900, { culture: { value: 1001, unit: 'kg' } }))['culture.value']).toMatch(/over 1,000 kg/);
    expect(fieldsOf(rice(900, { sugar: { value: 2300, unit: 'lb' } }))['sugar.value']).toMatch(/over 1,000 kg/);
    expect(fieldsOf(rice(900, { containerWeight: { value: 2e6, unit: 'g' } }))['containerWeight.value']).toMatch(/over 1,000 kg/);
    expect(batchCheckInputSchema.safeParse(rice(900, { culture: { value: 1000, unit: 'kg' } })).success).toBe(true);
  });

  test('when a number is NaN or not a number at all, then it is refused', () => {
    expect(fieldsOf(rice(Number.NaN))['sugar.value']).toBe('Enter the sugar weight as a number.');
    expect(fieldsOf({ ...rice(900), culture: { value: '900', unit: 'g' } })['culture.value']).toBe('Enter the culture weight as a number.');
  });

  test('when the unit, stage or sugar type is unknown, then the field is named', () => {
    expect(fieldsOf({ ...rice(900), sugar: { value: 900, unit: 'cups' } })['sugar.unit']).toBe('Choose a unit: g, kg, oz or lb.');
    expect(fieldsOf({ ...rice(900), stage: 'IMO5' }).stage).toBe('Choose the stage of the batch.');
    expect(fieldsOf({ ...rice(900), sugarType: 'honey' }).sugarType).toBe('Choose brown, white or raw sugar.');
  });

  test('when moisture is outside 0–100 %, then it is refused', () => {
    expect(fieldsOf(rice(900, { moisturePct: 101 })).moisturePct).toBe('Moisture is between 0 and 100 %.');
    expect(fieldsOf(rice(900, { moisturePct: -1 })).moisturePct).toBe('Moisture is between 0 and 100 %.');
  });

  test('when the culture is missing, then the message asks for it', () => {
    expect(fieldsOf({ stage: 'IMO2', sugar: { value: 1, unit: 'g' } }).culture).toBe('Enter the culture weight and its unit.');
  });

  test('when checkBatch is given bad input, then it throws rather than answering', () => {
    expect(() => checkBatch(rice(-1))).toThrow();
  });
});
