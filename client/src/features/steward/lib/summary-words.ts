// The steward desk's one-line readings of its charts, where several may share the top: the
// busiest mentor (most open cases, then most watching: the order of `mentorLoad` in
// server/shared/metrics.ts) and the strongest recovery record. A tie names everyone in it (or
// counts them past three) instead of crowning whichever sorted first.
import type { MentorLoad } from '@shared/metrics';

type Load = Pick<MentorLoad, 'open' | 'watching'> & { displayName: string };

/** The names as a list in words: "A", "A and B", "A, B and C". */
export function inWords(names: readonly string[]): string {
  return names.length <= 1 ? (names[0] ?? '') : `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
}

/** "the busiest is …" / "the busiest are …" / "4 share the most …", or '' when nobody holds an open case. */
export function busiestText(loads: readonly Load[]): string {
  const top = loads.reduce<Load | undefined>((best, l) => (!best || l.open > best.open || (l.open === best.open && l.watching > best.watching) ? l : best), undefined);
  if (!top || top.open === 0) return '';
  const counts = `${top.open} open and ${top.watching} watching`;
  const tied = loads.filter((l) => l.open === top.open && l.watching === top.watching);
  if (tied.length === 1) return `the busiest is ${top.displayName} with ${counts}`;
  if (tied.length <= 3) return `the busiest are ${inWords(tied.map((l) => l.displayName))}, with ${counts} each`;
  return `${tied.length} of them share the most, ${counts} each`;
}

/** How the recovery summary starts: "The strongest record is FFJ: " / "The strongest records are
 * FFJ and LAB: " / "5 stages share the strongest record: ". `names` are those with the top counts. */
export function strongestLead(names: readonly string[], plural: string): string {
  if (names.length <= 1) return `The strongest record is ${names[0] ?? ''}: `;
  if (names.length <= 3) return `The strongest records are ${inWords(names)}: `;
  return `${names.length} ${plural} share the strongest record: `;
}
