// GET /api/steward/metrics: the same numbers the steward desk charts show.
import {
  casesPerWeekByStage,
  firstReplyHoursByWeek,
  mentorLoad,
  openByUrgency,
  recoveryRateBy,
  weekStart,
} from '../../../shared/metrics';
import type { CommunityMetrics } from '../../../shared/steward-schemas';
import { AppError } from '../../lib/errors';
import { metricsRepository } from './metrics.repository';

const DAY_MS = 86_400_000;
export const DEFAULT_WEEKS = 12;
const MAX_DAYS = 3 * 366;

/** The range as dates (both inclusive): by default this week and the eleven before it. */
export function resolveRange(from: string | undefined, to: string | undefined, now = new Date()): { from: string; to: string; start: Date; end: Date } {
  const toDate = to ?? now.toISOString().slice(0, 10);
  const fromDate = from ?? weekStart(new Date(Date.parse(`${toDate}T00:00:00Z`) - (DEFAULT_WEEKS - 1) * 7 * DAY_MS));
  const start = new Date(`${fromDate}T00:00:00Z`);
  const end = new Date(Date.parse(`${toDate}T00:00:00Z`) + DAY_MS);
  if (start >= end) throw new AppError(400, 'invalid_input', 'The start must not be after the end.', { from: 'The start must not be after the end.' });
  if (end.getTime() - start.getTime() > MAX_DAYS * DAY_MS) {
    throw new AppError(400, 'invalid_input', 'Ask for three years or less at a time.', { from: 'Ask for three years or less at a time.' });
  }
  return { from: fromDate, to: toDate, start, end };
}

export async function communityMetrics(from: string | undefined, to: string | undefined): Promise<CommunityMetrics> {
  const range = resolveRange(from, to);
  const span = { start: range.start, end: range.end };
  const [opened, ended, openNow, held] = await Promise.all([
    metricsRepository.openedBetween(span),
    metricsRepository.endedBetween(span),
    metricsRepository.openNow(),
    metricsRepository.heldOrEndedBetween(span),
  ]);
  const loads = mentorLoad(held);
  const people = await metricsRepository.people(loads.map((l) => Number(l.mentorId)));
  const names = new Map(people.map((p) => [String(p.id), p.displayName]));
  const loaded = new Set(loads.map((l) => l.mentorId));
  return {
    from: range.from,
    to: range.to,
    casesPerWeek: casesPerWeekByStage(opened),
    firstReply: firstReplyHoursByWeek(opened),
    recoveryByStage: recoveryRateBy(ended, 'stage'),
    recoveryByRemedy: recoveryRateBy(ended, 'remedy'),
    openByUrgency: openByUrgency(openNow),
    mentorLoad: [
      ...loads.map((l) => ({ ...l, displayName: names.get(l.mentorId) ?? `Mentor ${l.mentorId}` })),
      ...people
        .filter((p) => p.role === 'mentor' && !loaded.has(String(p.id)))
        .map((p) => ({ mentorId: String(p.id), open: 0, watching: 0, resolved: 0, displayName: p.displayName })),
    ],
  };
}
