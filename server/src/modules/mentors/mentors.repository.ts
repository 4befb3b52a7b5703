// What a mentor profile is made of: the person, their cases' counts and outcomes, how fast they
// first replied on the cases they hold, and the field notes of those cases.
import { QueryTypes } from 'sequelize';
import { OPEN_STATUSES } from '../../../shared/case-status';
import type { Outcome } from '../../../shared/closing-schemas';
import type { MentorChoice } from '../../../shared/library-schemas';
import { NOT_A_RESCUE, type OutcomeCounts } from '../../../shared/remedy-records';
import { getSequelize } from '../../db/sequelize';

export interface MentorRow {
  id: number;
  displayName: string;
  role: 'mentor' | 'steward';
  about: string | null;
  createdAt: Date;
}

export interface MentorStats extends OutcomeCounts {
  casesHelped: number;
  casesOpen: number;
}

export interface RecentNoteRow {
  slug: string;
  title: string;
  stages: string[];
  outcome: Outcome | null;
  remedy: string | null;
  publishedAt: Date;
}

export const mentorsRepository = {
  /**
   * The mentors a case can be handed to: role mentor and not disabled (what the hand-over
   * accepts), with the open cases each holds; the least loaded first, then by name.
   */
  async listActive(): Promise<MentorChoice[]> {
    return getSequelize().query<MentorChoice>(
      `SELECT u.id, u.display_name AS "displayName", count(c.id)::int AS "openCases"
         FROM users u
         LEFT JOIN cases c ON c.mentor_id = u.id AND c.status = ANY($1::text[])
        WHERE u.role = 'mentor' AND NOT u.disabled
        GROUP BY u.id
        ORDER BY "openCases", u.display_name, u.id`,
      { bind: [[...OPEN_STATUSES]], type: QueryTypes.SELECT },
    );
  },

  /** Mentors and stewards (who also hold cases); a grower or a disabled account is not a mentor. */
  async findMentor(id: number): Promise<MentorRow | null> {
    const rows = await getSequelize().query<MentorRow>(
      `SELECT id, display_name AS "displayName", role, about, created_at AS "createdAt"
         FROM users WHERE id = $1 AND role IN ('mentor', 'steward') AND NOT disabled`,
      { bind: [id], type: QueryTypes.SELECT },
    );
    return rows[0] ?? null;
  },

  async stats(mentorId: number): Promise<MentorStats> {
    const [row] = await getSequelize().query<MentorStats>(
      `SELECT count(*) FILTER (WHERE status IN ('watching', 'recovered', 'lost'))::int AS "casesHelped",
              count(*) FILTER (WHERE status IN ('in_conversation', 'over_to_grower'))::int AS "casesOpen",
              -- advice to discard a batch is not a failed rescue: it counts in no recovery rate
              count(*) FILTER (WHERE outcome = 'recovered' AND rescue)::int AS recovered,
              count(*) FILTER (WHERE outcome = 'partly' AND rescue)::int AS partly,
              count(*) FILTER (WHERE outcome = 'lost' AND rescue)::int AS lost,
              COALESCE(sum(stars) FILTER (WHERE outcome IS NOT NULL), 0)::int AS "starsSum",
              count(stars) FILTER (WHERE outcome IS NOT NULL)::int AS "starsCount"
         FROM (SELECT status, outcome, stars, remedy IS NULL OR remedy <> ALL($2::text[]) AS rescue FROM cases WHERE mentor_id = $1) c`,
      { bind: [mentorId, [...NOT_A_RESCUE]], type: QueryTypes.SELECT },
    );
    return row;
  },

  /** Hours from a case's opening to this mentor's first message on it, over the cases they hold. */
  async firstReplyHours(mentorId: number): Promise<{ median: number | null; counted: number }> {
    const [row] = await getSequelize().query<{ median: number | null; counted: number }>(
      `SELECT percentile_cont(0.5) WITHIN GROUP (ORDER BY hours)::float8 AS median, count(*)::int AS counted
         FROM (SELECT EXTRACT(EPOCH FROM min(m.created_at) - c.opened_at) / 3600.0 AS hours
                 FROM cases c
                 JOIN messages m ON m.case_id = c.id AND m.author_id = $1 AND m.kind = 'text'
                WHERE c.mentor_id = $1
                GROUP BY c.id, c.opened_at) firsts`,
      { bind: [mentorId], type: QueryTypes.SELECT },
    );
    return { median: row?.median ?? null, counted: row?.counted ?? 0 };
  },

  async recentNotes(mentorId: number, limit: number): Promise<RecentNoteRow[]> {
    return getSequelize().query<RecentNoteRow>(
      `SELECT e.slug, e.title, e.stages, e.outcome, e.remedy, e.published_at AS "publishedAt"
         FROM library_entries e JOIN cases c ON c.id = e.case_id
        WHERE e.kind = 'note' AND c.mentor_id = $1
        ORDER BY e.published_at DESC, e.id DESC
        LIMIT $2`,
      { bind: [mentorId, limit], type: QueryTypes.SELECT },
    );
  },
};
