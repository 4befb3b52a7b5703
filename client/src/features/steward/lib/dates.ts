// Dates as a steward reads them: "3 Mar 2025, 14:05"; weeks by their Monday, "3 Mar".
const dateTime = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
const dateOnly = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
const shortDay = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });
const longDay = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

export const formatDateTime = (iso: string) => dateTime.format(new Date(iso));
export const formatDate = (iso: string) => dateOnly.format(new Date(iso));
/** A week key ("2025-03-03", a Monday in UTC) as a short axis label. */
export const weekLabel = (week: string) => shortDay.format(new Date(`${week}T00:00:00Z`));
/** A calendar date ("2025-03-03") in words, for summaries. */
export const dayInWords = (day: string) => longDay.format(new Date(`${day}T00:00:00Z`));

/** "YYYY-MM-DD" for the UTC day `days` before today. */
export function daysAgo(days: number, now = new Date()): string {
  return new Date(now.getTime() - days * 86_400_000).toISOString().slice(0, 10);
}
