// The hand-made English dates against Intl.DateTimeFormat('en-GB') itself, the forms they stand in for.
import { describe, expect, test } from 'vitest';
import { clockTime, dayMonth, dayMonthTime, dayMonthYear, dayMonthYearOf, dayShortMonth, fullDayClock, monthYear, shortDayClock } from '../../client/src/lib/english-dates';
import { grouped } from '../../client/src/lib/english-numbers';
import { formatMadeOn } from '../../client/src/features/batches/lib/batch-format';
import { dayInWords, formatDate, formatDateTime, weekLabel } from '../../client/src/features/steward/lib/dates';

const DAY = 24 * 60 * 60 * 1000;

describe('English dates without Intl', () => {
  test('when every day of a leap year is written long and short, then each reads as Intl en-GB writes it', () => {
    const long = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
    const short = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });
    for (let t = Date.UTC(2028, 0, 1); t < Date.UTC(2029, 0, 1); t += DAY) {
      const d = new Date(t);
      const [y, m, day] = [d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate()];
      expect(dayMonthYear(y, m, day)).toBe(long.format(d));
      expect(dayMonthYear(y, m, day, 'short')).toBe(short.format(d));
    }
  });

  test('when a moment is written with its clock, then it reads as Intl en-GB writes it in the same time zone', () => {
    const intl = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', hour: '2-digit', minute: '2-digit' });
    // Every month, through midnight, the small hours and the last minute of a day.
    for (let t = Date.UTC(2026, 0, 1); t < Date.UTC(2027, 0, 1); t += 7 * DAY + 3_607_000) {
      for (const offset of [0, 5 * 60_000, 11 * 3_600_000, 23 * 3_600_000 + 59 * 60_000]) {
        const at = new Date(t + offset);
        expect(dayMonthTime(at)).toBe(intl.format(at));
      }
    }
  });

  test('when a moment is written as its day and month, then it reads as Intl en-GB writes it in the same time zone', () => {
    const intl = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long' });
    for (let t = Date.UTC(2028, 0, 1); t < Date.UTC(2029, 0, 1); t += DAY + 3_607_000) {
      const at = new Date(t);
      expect(dayMonth(at)).toBe(intl.format(at));
    }
  });

  test('when a moment is written as its short day, its month and year, or its whole day, then each reads as Intl en-GB writes it', () => {
    const short = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short' });
    const month = new Intl.DateTimeFormat('en-GB', { month: 'long', year: 'numeric' });
    const whole = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric' });
    // Every day of a leap year, late in the evening (where a time zone could move the day).
    for (let t = Date.UTC(2028, 0, 1, 22, 30); t < Date.UTC(2029, 0, 1); t += DAY) {
      const at = new Date(t);
      expect(dayShortMonth(at)).toBe(short.format(at));
      expect(monthYear(at)).toBe(month.format(at));
      expect(dayMonthYearOf(at)).toBe(whole.format(at));
    }
  });

  test('when a message time is written as a clock, a short day with its clock, or in full, then each reads as Intl en-GB writes it', () => {
    const clock = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' });
    const short = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });
    const full = new Intl.DateTimeFormat('en-GB', { dateStyle: 'full', timeStyle: 'short' });
    // Every weekday and month of a year, at times through midnight and the last minute of a day.
    for (let t = Date.UTC(2026, 0, 1); t < Date.UTC(2027, 0, 1); t += 3 * DAY + 3_607_000) {
      for (const offset of [0, 5 * 60_000, 13 * 3_600_000, 23 * 3_600_000 + 59 * 60_000]) {
        const at = new Date(t + offset);
        expect(clockTime(at)).toBe(clock.format(at));
        expect(shortDayClock(at)).toBe(short.format(at));
        expect(fullDayClock(at)).toBe(full.format(at));
      }
    }
  });

  test('when a batch day is given as YYYY-MM-DD, then it reads as that calendar day', () => {
    expect(formatMadeOn('2026-03-03')).toBe('3 March 2026');
    expect(formatMadeOn('2026-09-30', 'short')).toBe('30 Sept 2026');
  });

  test('when the steward desk writes a moment, a day, a week or a calendar date, then each reads as Intl en-GB writes it', () => {
    // The forms the steward desk used Intl for.
    const dateTime = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
    const dateOnly = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
    const shortDay = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
    const longDay = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
    // Every day of a leap year, at times through midnight and the last minute of a day.
    for (let t = Date.UTC(2028, 0, 1); t < Date.UTC(2029, 0, 1); t += DAY) {
      for (const offset of [0, 7 * 60_000, 12 * 3_600_000, 23 * 3_600_000 + 59 * 60_000]) {
        const iso = new Date(t + offset).toISOString();
        expect(formatDateTime(iso)).toBe(dateTime.format(new Date(iso)));
        expect(formatDate(iso)).toBe(dateOnly.format(new Date(iso)));
      }
      const day = new Date(t).toISOString().slice(0, 10);
      expect(weekLabel(day)).toBe(shortDay.format(new Date(`${day}T00:00:00Z`)));
      expect(dayInWords(day)).toBe(longDay.format(new Date(`${day}T00:00:00Z`)));
    }
  });

  test('when a count is written with its thousands grouped, then it reads as Intl en-GB writes it', () => {
    const intl = new Intl.NumberFormat('en-GB');
    for (const n of [0, 7, 42, 999, 1000, 1001, 5000, 12_345, 99_999, 100_000, 123_456, 1_000_000, 9_876_543_210]) expect(grouped(n)).toBe(intl.format(n));
    for (let n = 0; n < 2_000_000; n += 7919) expect(grouped(n)).toBe(intl.format(n));
  });
});
