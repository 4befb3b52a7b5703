// Community-health numbers for the steward desk, computed from plain case rows (the repository
// selects the rows and the date range; everything here is arithmetic).
import type { CaseStatus } from './case-status';
import { OPEN_STATUSES } from './case-status';
import type { StageId } from './vocabulary';
import { STAGE_IDS } from './vocabulary';
import { wilsonInterval, Z_95 } from './track-record';
import type { UrgencyLevel } from './urgency';

export interface CaseMetricsRow {
  id: string | number;
  stage: StageId;
  openedAt: Date | string;
  /** the first reply by a mentor, if there has been one */
  firstReplyAt?: Date | string | null;
  status: CaseStatus;
  remedy?: string | null;
  mentorId?: string | number | null;
  urgencyLevel?: UrgencyLevel | null;
}

const HOUR_MS = 3_600_000;
const DAY_MS = 86_400_000;

function toDate(value: Date | string): Date {
  const date = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(date.getTime())) throw new RangeError(`Not a date: ${String(value)}`);
  return date;
}

// ---------------------------------------------------------------------------------------------
// Percentiles

/** The p-th percentile (p from 0 to 100) by linear interpolation between closest ranks: with the
 * values sorted, h = (n − 1)·p/100, and the result lies between the values at positions ⌊h⌋ and
 * ⌈h⌉ (counting from 0). This is definition 7 of Hyndman & Fan (1996), the default of R's
 * `quantile` and of spreadsheet PERCENTILE.INC; it never leaves the range of the data. NaN
 * values are ignored; null for no values. */
export function percentile(values: readonly number[], p: number): number | null {
  if (!(p >= 0 && p <= 100)) throw new RangeError(`percentile needs p from 0 to 100, got ${p}`);
  const sorted = values.filter((v) => !Number.isNaN(v)).sort((a, b) => a - b);
  if (sorted.length === 0) return null;
  const h = ((sorted.length - 1) * p) / 100;
  const below = Math.floor(h);
  const above = Math.ceil(h);
  return sorted[below] + (h - below) * (sorted[above] - sorted[below]);
}

export function median(values: readonly number[]): number | null {
  return percentile(values, 50);
}

// ---------------------------------------------------------------------------------------------
// Weeks

/** The Monday (UTC) that starts the ISO week holding this moment, as "YYYY-MM-DD". */
export function weekStart(date: Date | string): string {
  const d = toDate(date);
  const midnight = Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate());
  const daysSinceMonday = (d.getUTCDay() + 6) % 7;
  return new Date(midnight - daysSinceMonday * DAY_MS).toISOString().slice(0, 10);
}

/** Every week from the first to the last, so that a chart shows quiet weeks as zero, not as gaps. */
function weeksBetween(first: string, last: string): string[] {
  const weeks: string[] = [];
  for (let t = Date.parse(`${first}T00:00:00Z`); t <= Date.parse(`${last}T00:00:00Z`); t += 7 * DAY_MS) {
    weeks.push(new Date(t).toISOString().slice(0, 10));
  }
  return weeks;
}

function byWeek<T extends { openedAt: Date | string }>(rows: readonly T[]): Map<string, T[]> {
  const groups = new Map<string, T[]>();
  for (const row of rows) {
    const week = weekStart(row.openedAt);
    const group = groups.get(week);
    if (group) group.push(row);
    else groups.set(week, [row]);
  }
  if (groups.size === 0) return groups;
  const keys = [...groups.keys()].sort();
  const filled = new Map<string, T[]>();
  for (const week of weeksBetween(keys[0], keys[keys.length - 1])) filled.set(week, groups.get(week) ?? []);
  return filled;
}

export interface WeekStageCounts {
  week: string;
  total: number;
  byStage: Record<StageId, number>;
}

/** Cases opened per ISO week, split by stage, with empty weeks in between filled with zeros. */
export function casesPerWeekByStage(cases: readonly CaseMetricsRow[]): WeekStageCounts[] {
  return [...byWeek(cases)].map(([week, rows]) => {
    const byStage = Object.fromEntries(STAGE_IDS.map((s) => [s, 0])) as Record<StageId, number>;
    for (const row of rows) byStage[row.stage] += 1;
    return { week, total: rows.length, byStage };
  });
}

export interface WeekReplyTimes {
  week: string;
  opened: number;
  replied: number;
  medianHours: number | null;
  p90Hours: number | null;
}

/** Hours from opening to the first mentor reply, by the week the case was opened. Cases with no
 * reply yet count in `opened` but not in the times; a reply stamped before its case opened is a
 * clock error and is left out. */
export function firstReplyHoursByWeek(cases: readonly CaseMetricsRow[]): WeekReplyTimes[] {
  return [...byWeek(cases)].map(([week, rows]) => {
    const hours: number[] = [];
    for (const row of rows) {
      if (row.firstReplyAt == null) continue;
      const waited = (toDate(row.firstReplyAt).getTime() - toDate(row.openedAt).getTime()) / HOUR_MS;
      if (waited >= 0) hours.push(waited);
    }
    return { week, opened: rows.length, replied: hours.length, medianHours: median(hours), p90Hours: percentile(hours, 90) };
  });
}

// ---------------------------------------------------------------------------------------------
// Recovery

export type RecoveryKey = 'stage' | 'remedy' | 'mentorId';

export interface RecoveryRate {
  key: string;
  recovered: number;
  lost: number;
  trials: number;
  rate: number | null;
  lower: number;
  upper: number;
}

/** Recovered against lost, per stage, remedy or mentor, with a 95 % Wilson interval. Only cases
 * that ended (recovered or lost) count; cases without the key are left out. Best first by the
 * interval's lower bound, so that a long steady record outranks a short lucky one. */
export function recoveryRateBy(cases: readonly CaseMetricsRow[], key: RecoveryKey, z: number = Z_95): RecoveryRate[] {
  const tally = new Map<string, { recovered: number; lost: number }>();
  for (const row of cases) {
    if (row.status !== 'recovered' && row.status !== 'lost') continue;
    const value = row[key];
    if (value == null || value === '') continue;
    const name = String(value);
    const counts = tally.get(name) ?? { recovered: 0, lost: 0 };
    counts[row.status] += 1;
    tally.set(name, counts);
  }
  return [...tally]
    .map(([name, { recovered, lost }]) => ({ key: name, recovered, lost, trials: recovered + lost, ...wilsonInterval(recovered, recovered + lost, z) }))
    .sort((a, b) => b.lower - a.lower || b.trials - a.trials || a.key.localeCompare(b.key));
}

// ---------------------------------------------------------------------------------------------
// Open work

export interface OpenByUrgency {
  high: number;
  medium: number;
  low: number;
  /** open cases with no urgency worked out yet */
  unknown: number;
  total: number;
}

/** Open cases (awaiting a mentor, in conversation, over to the grower) by urgency level. */
export function openByUrgency(cases: readonly CaseMetricsRow[]): OpenByUrgency {
  const counts: OpenByUrgency = { high: 0, medium: 0, low: 0, unknown: 0, total: 0 };
  for (const row of cases) {
    if (!OPEN_STATUSES.includes(row.status)) continue;
    counts[row.urgencyLevel ?? 'unknown'] += 1;
    counts.total += 1;
  }
  return counts;
}

export interface MentorLoad {
  mentorId: string;
  /** in conversation or over to the grower */
  open: number;
  watching: number;
  /** recovered or lost */
  resolved: number;
}

/** What each mentor holds, busiest first by open cases, then by watching. */
export function mentorLoad(cases: readonly CaseMetricsRow[]): MentorLoad[] {
  const loads = new Map<string, MentorLoad>();
  for (const row of cases) {
    if (row.mentorId == null || row.mentorId === '') continue;
    const mentorId = String(row.mentorId);
    const load = loads.get(mentorId) ?? { mentorId, open: 0, watching: 0, resolved: 0 };
    if (OPEN_STATUSES.includes(row.status)) load.open += 1;
    else if (row.status === 'watching') load.watching += 1;
    else if (row.status === 'recovered' || row.status === 'lost') load.resolved += 1;
    loads.set(mentorId, load);
  }
  return [...loads.values()].sort(
    (a, b) => b.open - a.open || b.watching - a.watching || a.mentorId.localeCompare(b.mentorId),
  );
}
