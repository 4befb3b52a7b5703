// Dates as a steward reads them: "3 Mar 2025, 14:05"; weeks by their Monday, "3 Mar". Written by
// hand in Intl en-GB's forms (client/src/lib/english-dates.ts says why).
import { dayMonthYear, dayShortMonthOfDay, dayShortMonthYear, dayShortMonthYearClock } from '../../../lib/english-dates';

/** "2025-03-03" as its year, month (1-12) and day. */
const calendarDay = (day: string) => day.slice(0, 10).split('-').map(Number) as [number, number, number];

export const formatDateTime = (iso: string) => dayShortMonthYearClock(new Date(iso));
export const formatDate = (iso: string) => dayShortMonthYear(new Date(iso));
/** A week key ("2025-03-03", a Monday in UTC) as a short axis label. */
export const weekLabel = (week: string) => {
  const [, month, day] = calendarDay(week);
  return dayShortMonthOfDay(month, day);
};
/** A calendar date ("2025-03-03") in words, for summaries. */
export const dayInWords = (day: string) => dayMonthYear(...calendarDay(day));

/** "YYYY-MM-DD" for the UTC day `days` before today. */
export function daysAgo(days: number, now = new Date()): string {
  return new Date(now.getTime() - days * 86_400_000).toISOString().slice(0, 10);
}
