// Storage for closing a case, its check-ins and the recovery report. Raw SQL, plain objects out.
import { QueryTypes, type Transaction } from 'sequelize';
import type { CaseStatus } from '../../../shared/case-status';
import type { CheckInView, CloseCaseValues, Outcome, RecoveryReportValues } from '../../../shared/closing-schemas';
import type { LibraryHoldItem } from '../../../shared/steward-schemas';
import type { CauseId, RemedyId } from '../../../shared/vocabulary';
import { getSequelize } from '../../db/sequelize';

export interface ClosingRow {
  id: number;
  growerId: number;
  mentorId: number | null;
  status: CaseStatus;
  title: string;
  stage: string;
  closedAt: Date | null;
  closedBy: number | null;
  cause: CauseId | null;
  causeNotes: string | null;
  remedy: RemedyId | null;
  remedyNotes: string | null;
  summary: string | null;
  askToPublish: boolean;
  outcome: Outcome | null;
  stars: number | null;
  recoveryComment: string | null;
  resolvedAt: Date | null;
  consentToPublish: boolean;
  consentPhotos: boolean;
  published: boolean;
  redactTerms: string[];
  growerName: string;
  growerEmail: string;
  /** A steward disabled the grower's account: nothing is mailed to it. */
  growerDisabled: boolean;
  mentorName: string | null;
  closedByName: string | null;
  noteSlug: string | null;
  libraryHoldReason: string | null;
  libraryHoldBy: number | null;
  libraryHoldByName: string | null;
  libraryHoldAt: Date | null;
}

const CLOSING_SELECT = `
  SELECT c.id, c.grower_id AS "growerId", c.mentor_id AS "mentorId", c.status, c.title, c.stage,
         c.closed_at AS "closedAt", c.closed_by AS "closedBy", c.cause, c.cause_notes AS "causeNotes",
         c.remedy, c.remedy_notes AS "remedyNotes", c.summary, c.ask_to_publish AS "askToPublish",
         c.outcome, c.stars, c.recovery_comment AS "recoveryComment", c.resolved_at AS "resolvedAt",
         c.consent_to_publish AS "consentToPublish", c.consent_photos AS "consentPhotos", c.published,
         c.redact_terms AS "redactTerms",
         g.display_name AS "growerName", g.email AS "growerEmail", g.disabled AS "growerDisabled", m.display_name AS "mentorName",
         cb.display_name AS "closedByName", e.slug AS "noteSlug",
         c.library_hold_reason AS "libraryHoldReason", c.library_hold_by AS "libraryHoldBy",
         hb.display_name AS "libraryHoldByName", c.library_hold_at AS "libraryHoldAt"
    FROM cases c
    JOIN users g ON g.id = c.grower_id
    LEFT JOIN users m ON m.id = c.mentor_id
    LEFT JOIN users cb ON cb.id = c.closed_by
    LEFT JOIN users hb ON hb.id = c.library_hold_by
    LEFT JOIN library_entries e ON e.case_id = c.id AND e.kind = 'note'`;

export const closingRepository = {
  /** With `lock`, the case row stays locked for the rest of the transaction. */
  async find(caseId: number, transaction?: Transaction, lock = false): Promise<ClosingRow | null> {
    const rows = await getSequelize().query<ClosingRow>(`${CLOSING_SELECT} WHERE c.id = $1 ${lock ? 'FOR UPDATE OF c' : ''}`, {
      bind: [caseId],
      type: QueryTypes.SELECT,
      transaction,
    });
    return rows[0] ?? null;
  },

  async close(caseId: number, closedBy: number, values: CloseCaseValues, transaction: Transaction): Promise<void> {
    await getSequelize().query(
      `UPDATE cases SET status = 'watching', closed_at = now(), closed_by = $2, cause = $3, cause_notes = $4, remedy = $5,
              remedy_notes = $6, summary = $7, ask_to_publish = $8, redact_terms = $9::text[], updated_at = now()
        WHERE id = $1`,
      {
        bind: [caseId, closedBy, values.cause, values.causeNotes || null, values.remedy, values.remedyNotes || null, values.summary, values.askToPublish, values.redactTerms],
        transaction,
      },
    );
  },

  async scheduleCheckIns(caseId: number, days: readonly number[], transaction: Transaction): Promise<void> {
    await getSequelize().query(
      `INSERT INTO check_ins (case_id, day, due_at)
       SELECT $1, d, now() + make_interval(days => d) FROM unnest($2::int[]) AS d
       ON CONFLICT (case_id, day) DO NOTHING`,
      { bind: [caseId, [...days]], transaction },
    );
  },

  async checkIns(caseId: number, transaction?: Transaction): Promise<CheckInView[]> {
    const rows = await getSequelize().query<{ day: number; dueAt: Date; sentAt: Date | null }>(
      `SELECT day, due_at AS "dueAt", sent_at AS "sentAt" FROM check_ins WHERE case_id = $1 ORDER BY day`,
      { bind: [caseId], type: QueryTypes.SELECT, transaction },
    );
    return rows.map((r) => ({ day: r.day, dueAt: new Date(r.dueAt).toISOString(), sentAt: r.sentAt ? new Date(r.sentAt).toISOString() : null }));
  },

  /** Check-ins not sent yet are dropped once the grower answered or the case ended. */
  async dropUnsentCheckIns(caseId: number, transaction: Transaction): Promise<void> {
    await getSequelize().query(`DELETE FROM check_ins WHERE case_id = $1 AND sent_at IS NULL`, { bind: [caseId], transaction });
  },

  async fileReport(caseId: number, report: RecoveryReportValues, status: 'recovered' | 'lost', transaction: Transaction): Promise<void> {
    await getSequelize().query(
      `UPDATE cases SET outcome = $2, stars = $3, recovery_comment = $4, consent_to_publish = $5, consent_photos = $6,
              status = $7, resolved_at = now(), updated_at = now()
        WHERE id = $1`,
      { bind: [caseId, report.outcome, report.stars, report.comment || null, report.consentToPublish, report.consentPhotos, status], transaction },
    );
  },

  async setConsent(caseId: number, consentToPublish: boolean, consentPhotos: boolean, transaction: Transaction): Promise<void> {
    await getSequelize().query(`UPDATE cases SET consent_to_publish = $2, consent_photos = $3, updated_at = now() WHERE id = $1`, {
      bind: [caseId, consentToPublish, consentPhotos],
      transaction,
    });
  },

  async setRedactTerms(caseId: number, terms: readonly string[], transaction: Transaction): Promise<void> {
    await getSequelize().query(`UPDATE cases SET redact_terms = $2::text[], updated_at = now() WHERE id = $1`, { bind: [caseId, [...terms]], transaction });
  },

  /** Field notes held out of the Field Library, latest first (the steward desk's list). */
  async listLibraryHolds(page: number, pageSize: number): Promise<{ items: LibraryHoldItem[]; total: number }> {
    const sequelize = getSequelize();
    const rows = await sequelize.query<Omit<LibraryHoldItem, 'heldBy' | 'heldAt'> & { heldById: number | null; heldByName: string | null; heldAt: Date }>(
      `SELECT c.id AS "caseId", c.title, c.stage, c.library_hold_reason AS reason, c.library_hold_at AS "heldAt",
              c.consent_to_publish AS "consentToPublish", u.id AS "heldById", u.display_name AS "heldByName"
         FROM cases c LEFT JOIN users u ON u.id = c.library_hold_by
        WHERE c.library_hold_reason IS NOT NULL
        ORDER BY c.library_hold_at DESC, c.id DESC
        LIMIT $1 OFFSET $2`,
      { bind: [pageSize, (page - 1) * pageSize], type: QueryTypes.SELECT },
    );
    const [{ n }] = await sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM cases WHERE library_hold_reason IS NOT NULL`, { type: QueryTypes.SELECT });
    return {
      items: rows.map(({ heldById, heldByName, heldAt, ...row }) => ({
        ...row,
        heldBy: heldById != null ? { id: heldById, displayName: heldByName ?? '' } : null,
        heldAt: new Date(heldAt).toISOString(),
      })),
      total: Number(n),
    };
  },

  /** A steward's hold on the field note (null clears it). */
  async setLibraryHold(caseId: number, hold: { stewardId: number; reason: string } | null, transaction: Transaction): Promise<void> {
    await getSequelize().query(
      `UPDATE cases SET library_hold_reason = $2, library_hold_by = $3, library_hold_at = CASE WHEN $2::text IS NULL THEN NULL ELSE now() END, updated_at = now() WHERE id = $1`,
      { bind: [caseId, hold?.reason ?? null, hold?.stewardId ?? null], transaction },
    );
  },

  async markLost(caseId: number, transaction: Transaction): Promise<void> {
    await getSequelize().query(`UPDATE cases SET status = 'lost', resolved_at = now(), updated_at = now() WHERE id = $1`, { bind: [caseId], transaction });
  },

  /** Photos the grower uploaded to this case that are not shown anywhere yet. */
  async unattachedPhotoIds(caseId: number, uploaderId: number, photoIds: readonly number[], transaction: Transaction): Promise<number[]> {
    if (!photoIds.length) return [];
    const rows = await getSequelize().query<{ id: number }>(
      `SELECT id FROM case_photos WHERE id = ANY($1::int[]) AND case_id = $2 AND uploader_id = $3 AND message_id IS NULL`,
      { bind: [[...photoIds], caseId, uploaderId], type: QueryTypes.SELECT, transaction },
    );
    return rows.map((r) => r.id);
  },
};
