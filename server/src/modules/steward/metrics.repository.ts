// Plain case rows for the community-health numbers; the arithmetic is in shared/metrics.ts.
import { QueryTypes } from 'sequelize';
import type { CaseMetricsRow } from '../../../shared/metrics';
import { getSequelize } from '../../db/sequelize';

export interface MetricsRange {
  /** inclusive */
  start: Date;
  /** exclusive */
  end: Date;
}

const ROW_COLUMNS = `id, stage, opened_at AS "openedAt", first_reply_at AS "firstReplyAt", status, remedy,
                     mentor_id AS "mentorId", urgency_level AS "urgencyLevel"`;
// When a case ended: the recovery report's time, else when it was closed.
const ENDED_AT = `COALESCE(resolved_at, closed_at, updated_at)`;

export const metricsRepository = {
  async openedBetween(range: MetricsRange): Promise<CaseMetricsRow[]> {
    return getSequelize().query<CaseMetricsRow>(
      `SELECT ${ROW_COLUMNS} FROM cases WHERE opened_at >= :start AND opened_at < :end ORDER BY opened_at`,
      { replacements: { start: range.start, end: range.end }, type: QueryTypes.SELECT },
    );
  },

  async endedBetween(range: MetricsRange): Promise<CaseMetricsRow[]> {
    return getSequelize().query<CaseMetricsRow>(
      `SELECT ${ROW_COLUMNS} FROM cases WHERE status IN ('recovered', 'lost') AND ${ENDED_AT} >= :start AND ${ENDED_AT} < :end`,
      { replacements: { start: range.start, end: range.end }, type: QueryTypes.SELECT },
    );
  },

  async openNow(): Promise<CaseMetricsRow[]> {
    return getSequelize().query<CaseMetricsRow>(
      `SELECT ${ROW_COLUMNS} FROM cases WHERE status IN ('awaiting_mentor', 'in_conversation', 'over_to_grower')`,
      { type: QueryTypes.SELECT },
    );
  },

  /** What mentors hold now (open or watching) and what they saw to an end within the range. */
  async heldOrEndedBetween(range: MetricsRange): Promise<CaseMetricsRow[]> {
    return getSequelize().query<CaseMetricsRow>(
      `SELECT ${ROW_COLUMNS} FROM cases
        WHERE mentor_id IS NOT NULL
          AND (status IN ('in_conversation', 'over_to_grower', 'awaiting_mentor', 'watching')
               OR (status IN ('recovered', 'lost') AND ${ENDED_AT} >= :start AND ${ENDED_AT} < :end))`,
      { replacements: { start: range.start, end: range.end }, type: QueryTypes.SELECT },
    );
  },

  /** Every active mentor, so that one holding nothing shows as zero rather than missing. */
  async people(ids: number[]): Promise<{ id: number; displayName: string; role: string }[]> {
    return getSequelize().query<{ id: number; displayName: string; role: string }>(
      `SELECT id, display_name AS "displayName", role FROM users
        WHERE (role = 'mentor' AND NOT disabled) OR id IN (:ids) ORDER BY display_name`,
      { replacements: { ids: ids.length ? ids : [-1] }, type: QueryTypes.SELECT },
    );
  },
};
