import { describe, expect, test } from 'vitest';
import * as math from 'mathjs';
import {
  GRAMS_PER_UNIT,
  MASS_UNITS,
  formatMass,
  fromGrams,
  toGrams,
  type MassUnit,
} from '@shared/units';
import { massSchema, nonNegativeMassSchema } from '@shared/units-schemas';

const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected);

describe('exact avoirdupois factors', () => {
  test('when a pound is turned into grams, then it is 453.59237 g exactly', () => {
    // published: international yard and pound agreement (1959), 1 lb = 0.45359237 kg exactly;
    // NIST SP 811 App. B.8 and NIST Handbook 44 App. C (from memory)
    expect(relative(toGrams(1, 'lb'), 0.45359237 * 1000)).toBeLessThan(1e-12);
    expect(relative(toGrams(1, 'lb'), toGrams(0.45359237, 'kg'))).toBeLessThan(1e-12);
  });

  test('when an ounce is turned into grams, then it is 1/16 lb = 28.349523125 g exactly', () => {
    // by definition, 1 oz = 1/16 lb; NIST Handbook 44 App. C (from memory)
    expect(relative(toGrams(1, 'oz'), 28.349523125)).toBeLessThan(1e-12);
    expect(relative(toGrams(16, 'oz'), toGrams(1, 'lb'))).toBeLessThan(1e-12);
  });

  test('when 900 g is read in pounds, then it matches mathjs to 1e-12', () => {
    // reference library: mathjs, math.unit(900, 'g').toNumber('lb') = 1.9841603596638981
    expect(Math.abs(fromGrams(900, 'lb') - 1.9841603596638981)).toBeLessThan(1e-12);
    expect(Math.abs(fromGrams(900, 'lb') - math.unit(900, 'g').toNumber('lb'))).toBeLessThan(1e-12);
  });

  test.each(MASS_UNITS.flatMap((from) => MASS_UNITS.map((to) => [from, to] as [MassUnit, MassUnit])))(
    'when 2.5 %s is converted to %s, then it agrees with mathjs at relative 1e-12',
    (from, to) => {
      // reference library: mathjs uses the exact international factors for g, kg, oz and lb
      const expected = math.unit(2.5, from).toNumber(to);
      expect(relative(fromGrams(toGrams(2.5, from), to), expected)).toBeLessThan(1e-12);
    },
  );

  test('when the rounded pound of convert-units 2.x is compared, then ours differs only beyond 1e-6', () => {
    // published library: convert-units 2.x defines the pound as 453.592 g (rounded)
    expect(relative(GRAMS_PER_UNIT.lb, 453.592)).toBeLessThan(1e-6);
    expect(GRAMS_PER_UNIT.lb).not.toBe(453.592);
  });

  test('when a weight goes to grams and back, then it comes back unchanged', () => {
    for (const unit of MASS_UNITS) {
      expect(fromGrams(toGrams(123.456, unit), unit)).toBeCloseTo(123.456, 10);
    }
  });
});

describe('formatting a weight for a grower', () => {
  test('when 900 g is shown in pounds, then it reads 1.98 lb', () => {
    expect(formatMass(900, 'lb')).toBe('1.98 lb');
  });

  test('when whole grams are shown, then there are no decimals and thousands are grouped', () => {
    expect(formatMass(875.04, 'g')).toBe('875 g');
    expect(formatMass(1123.99, 'g')).toBe('1,124 g');
    expect(formatMass(2.46, 'g')).toBe('2.5 g');
  });

  test('when a round number is shown, then trailing zeros are dropped', () => {
    expect(formatMass(2000, 'kg')).toBe('2 kg');
    expect(formatMass(toGrams(4, 'lb'), 'lb')).toBe('4 lb');
    expect(formatMass(1800, 'kg')).toBe('1.8 kg');
  });

  test('when larger weights are shown, then fewer decimals are kept', () => {
    expect(formatMass(toGrams(12.345, 'kg'), 'kg')).toBe('12.3 kg');
    expect(formatMass(toGrams(123.45, 'lb'), 'lb')).toBe('123 lb');
    expect(formatMass(toGrams(3.26, 'oz'), 'oz')).toBe('3.3 oz');
    expect(formatMass(toGrams(31.6, 'oz'), 'oz')).toBe('32 oz');
  });

  test('when a rounding error leaves a tiny negative, then it reads as zero', () => {
    expect(formatMass(-1e-9, 'g')).toBe('0 g');
  });
});

describe('mass schemas', () => {
  test('when the value is zero, then only the non-negative schema accepts it', () => {
    expect(massSchema.safeParse({ value: 0, unit: 'g' }).success).toBe(false);
    expect(nonNegativeMassSchema.safeParse({ value: 0, unit: 'g' }).success).toBe(true);
  });

  test('when the value is not a finite number or the unit is unknown, then both schemas refuse it', () => {
    for (const schema of [massSchema, nonNegativeMassSchema]) {
      expect(schema.safeParse({ value: Number.NaN, unit: 'g' }).success).toBe(false);
      expect(schema.safeParse({ value: Number.POSITIVE_INFINITY, unit: 'g' }).success).toBe(false);
      expect(schema.safeParse({ value: '900', unit: 'g' }).success).toBe(false);
      expect(schema.safeParse({ value: 900, unit: 'stone' }).success).toBe(false);
      expect(schema.safeParse({ value: -1, unit: 'kg' }).success).toBe(false);
    }
  });
});
