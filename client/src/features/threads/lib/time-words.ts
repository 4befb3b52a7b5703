// Times as a grower reads them: the clock for today, the day for older, and short "ago"s. In the
// app's English forms (lib/english-dates.ts), without Intl: a formatter made when the thread's
// code loads cost the case page ~110 ms of main thread at Lighthouse's 4x CPU slowdown.
import { clockTime, fullDayClock, shortDayClock } from '../../../lib/english-dates';

export function messageTime(iso: string, now = new Date()): string {
  const at = new Date(iso);
  const sameDay = at.toDateString() === now.toDateString();
  return sameDay ? clockTime(at) : shortDayClock(at);
}

/** For the title attribute and screen readers: the whole date. */
export function fullTime(iso: string): string {
  return fullDayClock(new Date(iso));
}

/** "under an hour", "5 h", "2 days" — how long something has been waiting. */
export function hoursWords(hours: number): string {
  if (hours < 1) return 'under 1 h';
  if (hours < 48) return `${Math.floor(hours)} h`;
  const days = Math.floor(hours / 24);
  return `${days} days`;
}

/** "just now", "12 min ago", "3 h ago", "4 days ago". */
export function timeAgo(iso: string, now = Date.now()): string {
  const minutes = Math.max(0, Math.floor((now - new Date(iso).getTime()) / 60_000));
  if (minutes < 1) return 'just now';
  if (minutes < 60) return `${minutes} min ago`;
  const hours = Math.floor(minutes / 60);
  if (hours < 48) return `${hours} h ago`;
  return `${Math.floor(hours / 24)} days ago`;
}
