import { describe, expect, test } from 'vitest';
import jStat from 'jstat';
import {
  DEFAULT_RATING_PRIOR,
  Z_95,
  bayesianAverage,
  rankByLowerBound,
  wilsonInterval,
} from '@shared/track-record';

describe('the 95 % normal quantile', () => {
  test('when Z_95 is compared with jstat, then they agree to 1e-12', () => {
    // reference library: jstat, jStat.normal.inv(0.975, 0, 1)
    expect(Math.abs(Z_95 - jStat.normal.inv(0.975, 0, 1))).toBeLessThan(1e-12);
  });
});

describe('Wilson score interval', () => {
  test.each([
    // from memory: Newcombe, "Two-sided confidence intervals for the single proportion",
    // Statistics in Medicine 17:857 (1998), Table II, score method without continuity correction
    [81, 263, 0.2553, 0.3662],
    [15, 148, 0.0624, 0.1605],
    [0, 20, 0, 0.1611],
    [1, 29, 0.0061, 0.1718],
  ])('when %d of %d recovered, then the 95 percent interval is %s to %s (Newcombe 1998, from memory)', (s, n, lower, upper) => {
    const interval = wilsonInterval(s, n);
    expect(interval.rate).toBeCloseTo(s / n, 12);
    expect(Math.abs(interval.lower - lower)).toBeLessThan(5e-5);
    expect(Math.abs(interval.upper - upper)).toBeLessThan(5e-5);
  });

  test.each([
    [7, 12],
    [290, 300],
    [1, 1000],
  ])('when %d of %d is checked, then each bound is where the score test reaches z (Wilson 1927)', (s, n) => {
    // Wilson, J. Am. Stat. Assoc. 22:209 (1927): the bounds are the p with |p̂ − p| = z·√(p(1 − p)/n),
    // with z from jstat (reference library). This checks the closed form against its definition.
    const z = jStat.normal.inv(0.975, 0, 1);
    const { lower, upper } = wilsonInterval(s, n, z);
    const p = s / n;
    for (const bound of [lower, upper]) {
      expect(Math.abs(Math.abs(p - bound) / Math.sqrt((bound * (1 - bound)) / n) - z)).toBeLessThan(1e-9);
    }
  });

  test('when all trials succeed, then the upper bound is 1 and the lower bound is n / (n + z²)', () => {
    // from the formula with p̂ = 1: lower = n / (n + z²)
    const interval = wilsonInterval(3, 3);
    expect(interval.upper).toBe(1);
    expect(interval.lower).toBeCloseTo(3 / (3 + Z_95 * Z_95), 12);
  });

  test('when there are no trials, then the rate is unknown and the interval is the whole range', () => {
    expect(wilsonInterval(0, 0)).toEqual({ rate: null, lower: 0, upper: 1 });
  });

  test('when a wider z is asked for, then the interval widens', () => {
    // reference library: jstat, Φ⁻¹(0.995) for 99 %
    const z99 = jStat.normal.inv(0.995, 0, 1);
    const at95 = wilsonInterval(20, 40);
    const at99 = wilsonInterval(20, 40, z99);
    expect(at99.lower).toBeLessThan(at95.lower);
    expect(at99.upper).toBeGreaterThan(at95.upper);
  });

  test('when the counts are impossible, then it refuses them', () => {
    expect(() => wilsonInterval(4, 3)).toThrow(RangeError);
    expect(() => wilsonInterval(-1, 3)).toThrow(RangeError);
    expect(() => wilsonInterval(1.5, 3)).toThrow(RangeError);
    expect(() => wilsonInterval(1, 3, 0)).toThrow(RangeError);
  });
});

describe('ranking by the lower bound', () => {
  test('when 3 of 3 is set beside 290 of 300, then the three lucky cases rank below', () => {
    const ranked = rankByLowerBound([
      { remedy: 'lucky', successes: 3, trials: 3 },
      { remedy: 'steady', successes: 290, trials: 300 },
    ]);
    expect(ranked.map((r) => r.item.remedy)).toEqual(['steady', 'lucky']);
    expect(ranked[1].interval.rate).toBe(1);
    expect(ranked[0].interval.lower).toBeGreaterThan(ranked[1].interval.lower);
  });

  test('when records tie on the lower bound, then the longer record goes first', () => {
    const ranked = rankByLowerBound([
      { id: 'a', successes: 0, trials: 2 },
      { id: 'b', successes: 0, trials: 9 },
      { id: 'c', successes: 0, trials: 0 },
    ]);
    expect(ranked.map((r) => r.item.id)).toEqual(['b', 'a', 'c']);
  });

  test('when a list is ranked, then the list given is left as it was', () => {
    const items = [
      { successes: 1, trials: 2 },
      { successes: 9, trials: 10 },
    ];
    rankByLowerBound(items);
    expect(items[0].trials).toBe(2);
  });
});

describe('Bayesian average of stars', () => {
  test('when there are no ratings, then the average is the prior mean', () => {
    // common practice: prior of 3.5 stars weighing as 5 ratings (stated in track-record.ts)
    expect(DEFAULT_RATING_PRIOR).toEqual({ priorMean: 3.5, priorWeight: 5 });
    expect(bayesianAverage(0, 0)).toBe(3.5);
  });

  test('when the sum is worked by hand, then the average matches', () => {
    // (3.5·5 + 3·5) / (5 + 3) = 32.5 / 8 = 4.0625
    expect(bayesianAverage(15, 3)).toBeCloseTo(4.0625, 12);
    // (3.5·5 + 4.6·300) / 305
    expect(bayesianAverage(4.6 * 300, 300)).toBeCloseTo((17.5 + 1380) / 305, 12);
  });

  test('when three five-star ratings meet three hundred of 4.6, then the long record ranks higher', () => {
    expect(bayesianAverage(4.6 * 300, 300)).toBeGreaterThan(bayesianAverage(15, 3));
  });

  test('when a different prior is given, then it is used', () => {
    expect(bayesianAverage(10, 2, { priorMean: 3, priorWeight: 2 })).toBe(4);
    expect(bayesianAverage(10, 2, { priorMean: 3, priorWeight: 0 })).toBe(5);
    expect(bayesianAverage(0, 0, { priorMean: 3, priorWeight: 0 })).toBe(3);
  });

  test('when the count is negative, then it refuses it', () => {
    expect(() => bayesianAverage(5, -1)).toThrow(RangeError);
  });
});
