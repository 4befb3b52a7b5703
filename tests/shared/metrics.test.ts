import { describe, expect, test } from 'vitest';
import * as math from 'mathjs';
import {
  casesPerWeekByStage,
  firstReplyHoursByWeek,
  median,
  mentorLoad,
  openByUrgency,
  percentile,
  recoveryRateBy,
  weekStart,
  type CaseMetricsRow,
} from '@shared/metrics';
import { wilsonInterval } from '@shared/track-record';

describe('percentiles', () => {
  test('when worked by hand on 15, 20, 35, 40, 50, then the 40th is 29 and the 90th is 46', () => {
    // hand-worked, linear interpolation between closest ranks (Hyndman & Fan 1996, definition 7):
    // p = 40: h = (5 − 1)·0.4 = 1.6 → 20 + 0.6·(35 − 20) = 29
    // p = 90: h = 3.6 → 40 + 0.6·(50 − 40) = 46
    expect(percentile([50, 15, 40, 20, 35], 40)).toBeCloseTo(29, 12);
    expect(percentile([50, 15, 40, 20, 35], 90)).toBeCloseTo(46, 12);
  });

  test('when the ends and the middle are asked for, then they are the minimum, the maximum and the median', () => {
    expect(percentile([3, 1, 2], 0)).toBe(1);
    expect(percentile([3, 1, 2], 100)).toBe(3);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([7])).toBe(7);
  });

  test('when compared with mathjs quantileSeq, then they agree', () => {
    // reference library: mathjs quantileSeq interpolates the same way (definition 7)
    const values = [2.5, 9, 0.5, 14, 3, 3, 7.25, 30, 1];
    for (const p of [5, 25, 50, 75, 90, 99]) {
      expect(percentile(values, p)).toBeCloseTo(Number(math.quantileSeq(values, p / 100)), 12);
    }
  });

  test('when there are no values, then there is no percentile; a p outside 0–100 is refused', () => {
    expect(percentile([], 50)).toBeNull();
    expect(median([Number.NaN])).toBeNull();
    expect(() => percentile([1], 101)).toThrow(RangeError);
  });
});

describe('weeks', () => {
  test('when a date falls midweek, then its week starts on the Monday before, in UTC', () => {
    expect(weekStart('2025-03-13T15:00:00Z')).toBe('2025-03-10'); // a Thursday
    expect(weekStart(new Date('2025-03-10T00:00:00Z'))).toBe('2025-03-10'); // the Monday itself
    expect(weekStart('2025-03-16T23:59:59Z')).toBe('2025-03-10'); // the Sunday ends the week
    expect(weekStart('2025-03-17T00:00:00Z')).toBe('2025-03-17');
  });

  test('when a week spans a new year, then it still starts on its Monday', () => {
    // ISO 8601: 2026-01-01 is a Thursday in the week that begins Monday 2025-12-29
    expect(weekStart('2026-01-01T08:00:00Z')).toBe('2025-12-29');
  });

  test('when a time carries an offset, then the week is judged in UTC', () => {
    expect(weekStart('2025-03-17T01:00:00+02:00')).toBe('2025-03-10');
  });

  test('when the date is not a date, then it is refused', () => {
    expect(() => weekStart('soon')).toThrow(RangeError);
  });
});

const row = (over: Partial<CaseMetricsRow> & Pick<CaseMetricsRow, 'id'>): CaseMetricsRow => ({
  stage: 'IMO2',
  openedAt: '2025-03-11T09:00:00Z',
  status: 'awaiting_mentor',
  ...over,
});

describe('cases per week by stage', () => {
  test('when cases fall in two weeks with a quiet week between, then the quiet week shows zero', () => {
    const weeks = casesPerWeekByStage([
      row({ id: 1, stage: 'IMO2', openedAt: '2025-03-11T09:00:00Z' }),
      row({ id: 2, stage: 'FPJ', openedAt: '2025-03-12T09:00:00Z' }),
      row({ id: 3, stage: 'IMO2', openedAt: '2025-03-13T09:00:00Z' }),
      row({ id: 4, stage: 'LAB', openedAt: '2025-03-25T09:00:00Z' }),
    ]);
    expect(weeks.map((w) => [w.week, w.total])).toEqual([
      ['2025-03-10', 3],
      ['2025-03-17', 0],
      ['2025-03-24', 1],
    ]);
    expect(weeks[0].byStage).toMatchObject({ IMO2: 2, FPJ: 1, LAB: 0 });
    expect(weeks[2].byStage.LAB).toBe(1);
  });

  test('when there are no cases, then there are no weeks', () => {
    expect(casesPerWeekByStage([])).toEqual([]);
  });
});

describe('first reply times', () => {
  test('when replies came after 1, 2, 3, 4 and 10 hours, then the median is 3 and the 90th percentile 7.6', () => {
    // hand-worked, definition 7: h = 4·0.9 = 3.6 → 4 + 0.6·(10 − 4) = 7.6
    const opened = Date.parse('2025-03-11T08:00:00Z');
    const cases = [1, 2, 3, 4, 10].map((h, i) =>
      row({ id: i, openedAt: new Date(opened), firstReplyAt: new Date(opened + h * 3_600_000) }),
    );
    cases.push(row({ id: 99, openedAt: new Date(opened) })); // no reply yet
    const [week] = firstReplyHoursByWeek(cases);
    expect(week).toMatchObject({ week: '2025-03-10', opened: 6, replied: 5, medianHours: 3 });
    expect(week.p90Hours).toBeCloseTo(7.6, 9);
  });

  test('when a reply is stamped before its case opened, then it is left out', () => {
    const [week] = firstReplyHoursByWeek([row({ id: 1, openedAt: '2025-03-11T09:00:00Z', firstReplyAt: '2025-03-11T08:00:00Z' })]);
    expect(week.replied).toBe(0);
    expect(week.medianHours).toBeNull();
  });
});

describe('recovery rates', () => {
  const cases: CaseMetricsRow[] = [
    ...Array.from({ length: 3 }, (_, i) => row({ id: `a${i}`, status: 'recovered', remedy: 'add-sugar', mentorId: 7 })),
    row({ id: 'a3', status: 'lost', remedy: 'add-sugar', mentorId: 7 }),
    row({ id: 'b0', status: 'recovered', remedy: 'drain-liquid', mentorId: 8 }),
    row({ id: 'c0', status: 'watching', remedy: 'drain-liquid', mentorId: 8 }),
    row({ id: 'd0', status: 'lost', remedy: null, stage: 'FPJ' }),
  ];

  test('when grouped by remedy, then only ended cases count and each carries its Wilson interval', () => {
    const rates = recoveryRateBy(cases, 'remedy');
    expect(rates.map((r) => r.key)).toEqual(['add-sugar', 'drain-liquid']);
    expect(rates[0]).toEqual({ key: 'add-sugar', recovered: 3, lost: 1, trials: 4, ...wilsonInterval(3, 4) });
    expect(rates[1]).toMatchObject({ recovered: 1, lost: 0, trials: 1 });
  });

  test('when grouped by stage or mentor, then the key is read from that column', () => {
    expect(recoveryRateBy(cases, 'stage').map((r) => [r.key, r.trials])).toEqual([
      ['IMO2', 5],
      ['FPJ', 1],
    ]);
    expect(recoveryRateBy(cases, 'mentorId').map((r) => r.key)).toEqual(['7', '8']);
  });
});

describe('open work', () => {
  const cases: CaseMetricsRow[] = [
    row({ id: 1, status: 'awaiting_mentor', urgencyLevel: 'high' }),
    row({ id: 2, status: 'in_conversation', urgencyLevel: 'high', mentorId: 'm1' }),
    row({ id: 3, status: 'over_to_grower', urgencyLevel: 'low', mentorId: 'm2' }),
    row({ id: 4, status: 'awaiting_mentor' }),
    row({ id: 5, status: 'watching', urgencyLevel: 'high', mentorId: 'm1' }),
    row({ id: 6, status: 'recovered', mentorId: 'm2' }),
    row({ id: 7, status: 'withdrawn', urgencyLevel: 'medium' }),
    row({ id: 8, status: 'in_conversation', urgencyLevel: 'medium', mentorId: 'm2' }),
  ];

  test('when open cases are counted by urgency, then watching, ended and withdrawn cases are left out', () => {
    expect(openByUrgency(cases)).toEqual({ high: 2, medium: 1, low: 1, unknown: 1, total: 5 });
  });

  test('when mentor load is counted, then the busiest mentor comes first', () => {
    expect(mentorLoad(cases)).toEqual([
      { mentorId: 'm2', open: 2, watching: 0, resolved: 1 },
      { mentorId: 'm1', open: 1, watching: 1, resolved: 0 },
    ]);
  });
});
