// A mentor's profile and track record (PRODUCT.md screen 9): cases helped, median hours to their
// first reply, recovery rate with its 95 % Wilson interval and stars as a Bayesian average
// (server/shared/remedy-records.ts), and the latest field notes of their cases.
import type { MentorProfile } from '../../../shared/library-schemas';
import { describeRecord, trackRecord } from '../../../shared/remedy-records';
import { notFound } from '../../lib/errors';
import { mentorsRepository as repo } from './mentors.repository';

const RECENT_NOTES = 5;

export async function getMentorProfile(mentorId: number): Promise<MentorProfile> {
  const mentor = await repo.findMentor(mentorId);
  if (!mentor) throw notFound('That mentor');
  const [stats, replies, notes] = await Promise.all([repo.stats(mentorId), repo.firstReplyHours(mentorId), repo.recentNotes(mentorId, RECENT_NOTES)]);
  const record = trackRecord(stats);
  return {
    id: mentor.id,
    displayName: mentor.displayName,
    role: mentor.role,
    about: mentor.about,
    memberSince: new Date(mentor.createdAt).toISOString(),
    casesHelped: stats.casesHelped,
    casesOpen: stats.casesOpen,
    medianHoursToFirstReply: replies.median,
    repliesCounted: replies.counted,
    record: { ...record, text: describeRecord(record) },
    recentNotes: notes.map((n) => ({ slug: n.slug, title: n.title, stages: n.stages, outcome: n.outcome, remedy: n.remedy, publishedAt: new Date(n.publishedAt).toISOString() })),
  };
}
