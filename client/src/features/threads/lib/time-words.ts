// Times as a grower reads them: the clock for today, the day for older, and short "ago"s.

const clock = new Intl.DateTimeFormat(undefined, { hour: '2-digit', minute: '2-digit' });
const dayAndClock = new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });
const full = new Intl.DateTimeFormat(undefined, { dateStyle: 'full', timeStyle: 'short' });

export function messageTime(iso: string, now = new Date()): string {
  const at = new Date(iso);
  const sameDay = at.toDateString() === now.toDateString();
  return sameDay ? clock.format(at) : dayAndClock.format(at);
}

/** For the title attribute and screen readers: the whole date. */
export function fullTime(iso: string): string {
  return full.format(new Date(iso));
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
