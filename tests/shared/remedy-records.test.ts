import { describe, expect, test } from 'vitest';
import jStat from 'jstat';
import { describeRecord, EMPTY_COUNTS, percentText, remedyRecords, trackRecord } from '@shared/remedy-records';
import { DEFAULT_RATING_PRIOR } from '@shared/track-record';

/** The Wilson bounds solved straight from the score test, (p̂ − p)² = z²·p(1 − p)/n, as a
 * quadratic in p — a different road to the same numbers than the closed form in track-record.ts. */
function wilsonByQuadratic(successes: number, n: number, z: number): [number, number] {
  const p = successes / n;
  const a = 1 + (z * z) / n;
  const b = -(2 * p + (z * z) / n);
  const c = p * p;
  const root = Math.sqrt(b * b - 4 * a * c);
  return [(-b - root) / (2 * a), (-b + root) / (2 * a)];
}

const counts = (recovered: number, partly: number, lost: number, starsSum = 0, starsCount = 0) => ({ recovered, partly, lost, starsSum, starsCount });

describe('a remedy’s track record', () => {
  test('when 60 recovered and 21 partly of 263, then partly counts as saved and the interval is Newcombe’s 81 of 263 (from memory)', () => {
    // from memory: Newcombe, Statistics in Medicine 17:857 (1998), Table II, 81/263 → 0.2553–0.3662
    const record = trackRecord(counts(60, 21, 182));
    expect(record).toMatchObject({ trials: 263, saved: 81, recovered: 60, partly: 21, lost: 182 });
    expect(Math.abs(record.lower - 0.2553)).toBeLessThan(5e-5);
    expect(Math.abs(record.upper - 0.3662)).toBeLessThan(5e-5);
  });

  test('when 11 of 12 were saved, then the bounds match the score test solved with jstat’s z, and the card reads “lower bound 65 %”', () => {
    // Wilson, J. Am. Stat. Assoc. 22:209 (1927); NIST/SEMATECH e-Handbook §7.2.4.1; z from jstat (reference library)
    const z = jStat.normal.inv(0.975, 0, 1);
    const [lower, upper] = wilsonByQuadratic(11, 12, z);
    const record = trackRecord(counts(11, 0, 1));
    expect(record.lower).toBeCloseTo(lower, 12);
    expect(record.upper).toBeCloseTo(upper, 12);
    expect(describeRecord(record)).toBe('saved 11 of 12 batches (lower bound 65 %)');
  });

  test('when some were saved only partly, then the card says how many', () => {
    expect(describeRecord(trackRecord(counts(7, 2, 3)))).toMatch(/^saved 9 of 12 batches, 2 of them partly \(lower bound \d+ %\)$/);
    expect(describeRecord(trackRecord(counts(1, 0, 0)))).toMatch(/^saved 1 of 1 batch \(/);
  });

  test('when there are no reports, then the rate is unknown, the interval is the whole range and the stars are the prior', () => {
    const record = trackRecord(EMPTY_COUNTS);
    expect(record).toMatchObject({ trials: 0, rate: null, lower: 0, upper: 1 });
    expect(record.stars).toEqual({ average: DEFAULT_RATING_PRIOR.priorMean, mean: null, ratings: 0 });
    expect(describeRecord(record)).toBe('no recovery reports yet');
  });

  test('when the stars are three fives against three hundred at 4.6, then the steady record rates higher (common practice prior: 5 ratings of 3.5)', () => {
    const lucky = trackRecord(counts(3, 0, 0, 15, 3));
    const steady = trackRecord(counts(290, 0, 10, 1380, 300));
    // common practice: (3.5·5 + Σ) / (5 + n), prior stated in server/shared/track-record.ts
    expect(lucky.stars.average).toBeCloseTo((17.5 + 15) / 8, 12);
    expect(steady.stars.average).toBeCloseTo((17.5 + 1380) / 305, 12);
    expect(lucky.stars.mean).toBe(5);
    expect(steady.stars.average).toBeGreaterThan(lucky.stars.average);
  });
});

describe('remedyRecords', () => {
  test('when a remedy saved 3 of 3 and another 290 of 300, then the steady one ranks first although its raw rate is lower', () => {
    const ranked = remedyRecords([
      { remedy: 'wait-and-watch', ...counts(3, 0, 0) },
      { remedy: 'add-sugar', ...counts(250, 40, 10) },
      { remedy: 'discard-restart', ...counts(0, 0, 12) },
    ]);
    expect(ranked.map((r) => r.remedy)).toEqual(['add-sugar', 'wait-and-watch', 'discard-restart']);
    expect(ranked[1].rate).toBe(1);
    expect(ranked[0].rate).toBeLessThan(1);
    expect(ranked[0].label).toBe('Mix in or top-dress more sugar');
    expect(ranked[0]).not.toHaveProperty('successes');
  });

  test('when the advice was to discard the batch, then it is listed after every rescue and its text does not call it a failure', () => {
    const ranked = remedyRecords([
      { remedy: 'discard-restart', ...counts(0, 0, 40) },
      { remedy: 'wait-and-watch', ...counts(0, 0, 2) },
    ]);
    expect(ranked.map((r) => [r.remedy, r.rescue])).toEqual([
      ['wait-and-watch', true],
      ['discard-restart', false],
    ]);
    expect(describeRecord(ranked[1])).toBe('the advice for 40 batches not safe to keep or past saving');
    expect(describeRecord(ranked[0])).toMatch(/^saved 0 of 2 batches/);
  });

  test('when the shares are rounded for people, then halves round up', () => {
    expect(percentText(0.6463)).toBe('65 %');
    expect(percentText(0.125)).toBe('13 %');
    expect(percentText(0)).toBe('0 %');
  });
});
