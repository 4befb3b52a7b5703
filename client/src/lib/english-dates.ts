// Dates in the app's English forms, as Intl.DateTimeFormat('en-GB') writes them, put together by
// hand. The first Intl.DateTimeFormat a page makes loads the browser's date data: 70-170 ms at
// Lighthouse's 4x CPU slowdown in CPU profiles of the case page and "open a case", on the main
// thread before either page's text could show. tests/unit/english-dates.test.ts holds these to
// Intl's own output.
const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
// en-GB's abbreviations (four letters for September).
const SHORT_MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sept', 'Oct', 'Nov', 'Dec'];
const WEEKDAYS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'];
const twoDigits = (n: number) => String(n).padStart(2, '0');

/** "3 March 2026", or "3 Mar 2026" short, for a calendar day (month 1-12). */
export function dayMonthYear(year: number, month: number, day: number, style: 'long' | 'short' = 'long'): string {
  return `${day} ${(style === 'long' ? MONTHS : SHORT_MONTHS)[month - 1]} ${year}`;
}

/** "3 Mar" for a calendar day (month 1-12). */
export function dayShortMonthOfDay(month: number, day: number): string {
  return `${day} ${SHORT_MONTHS[month - 1]}`;
}

/** "3 Mar 2026", in the reader's time zone. */
export function dayShortMonthYear(at: Date): string {
  return dayMonthYear(at.getFullYear(), at.getMonth() + 1, at.getDate(), 'short');
}

/** "3 Mar 2026, 14:05", in the reader's time zone. */
export function dayShortMonthYearClock(at: Date): string {
  return `${dayShortMonthYear(at)}, ${clockTime(at)}`;
}

/** "3 Mar", in the reader's time zone. */
export function dayShortMonth(at: Date): string {
  return dayShortMonthOfDay(at.getMonth() + 1, at.getDate());
}

/** "March 2026", in the reader's time zone. */
export function monthYear(at: Date): string {
  return `${MONTHS[at.getMonth()]} ${at.getFullYear()}`;
}

/** "3 March 2026", in the reader's time zone. */
export function dayMonthYearOf(at: Date): string {
  return dayMonthYear(at.getFullYear(), at.getMonth() + 1, at.getDate());
}

/** "3 March", in the reader's time zone. */
export function dayMonth(at: Date): string {
  return `${at.getDate()} ${MONTHS[at.getMonth()]}`;
}

/** "3 March at 14:05", in the reader's time zone. */
export function dayMonthTime(at: Date): string {
  return `${dayMonth(at)} at ${clockTime(at)}`;
}

/** "14:05", in the reader's time zone. */
export function clockTime(at: Date): string {
  return `${twoDigits(at.getHours())}:${twoDigits(at.getMinutes())}`;
}

/** "3 Mar, 14:05", in the reader's time zone. */
export function shortDayClock(at: Date): string {
  return `${dayShortMonth(at)}, ${clockTime(at)}`;
}

/** "Tuesday, 3 March 2026 at 14:05", in the reader's time zone (Intl's dateStyle full, timeStyle short). */
export function fullDayClock(at: Date): string {
  return `${WEEKDAYS[at.getDay()]}, ${dayMonthYearOf(at)} at ${clockTime(at)}`;
}
