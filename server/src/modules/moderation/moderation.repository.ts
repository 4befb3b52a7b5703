// Reports of messages and the messages they point at, as plain objects.
import { QueryTypes, type Transaction } from 'sequelize';
import type { Role } from '../../../shared/case-status';
import type { MessageReport, ReportStatus } from '../../../shared/steward-schemas';
import { getSequelize } from '../../db/sequelize';

export interface ReportedMessage {
  id: number;
  caseId: number;
  kind: 'text' | 'aside' | 'system';
  body: string;
  hidden: boolean;
  authorId: number | null;
}

interface ReportRow {
  id: number;
  reason: string;
  status: ReportStatus;
  reporterId: number | null;
  reporterName: string | null;
  decidedById: number | null;
  decidedByName: string | null;
  decidedAt: Date | null;
  createdAt: Date;
  messageId: string;
  caseId: number;
  caseTitle: string;
  kind: 'text' | 'aside' | 'system';
  body: string;
  hidden: boolean;
  authorId: number | null;
  authorName: string | null;
  authorRole: Role | null;
  messageCreatedAt: Date;
  openReports: number;
}

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

function toReport(row: ReportRow): MessageReport {
  return {
    id: row.id,
    reason: row.reason,
    status: row.status,
    reporter: row.reporterId != null ? { id: row.reporterId, displayName: row.reporterName ?? '' } : null,
    decidedBy: row.decidedById != null ? { id: row.decidedById, displayName: row.decidedByName ?? '' } : null,
    decidedAt: iso(row.decidedAt),
    createdAt: iso(row.createdAt)!,
    message: {
      id: Number(row.messageId),
      caseId: row.caseId,
      caseTitle: row.caseTitle,
      kind: row.kind,
      body: row.body,
      hidden: row.hidden,
      author: row.authorId != null ? { id: row.authorId, displayName: row.authorName ?? '', role: row.authorRole ?? 'grower' } : null,
      createdAt: iso(row.messageCreatedAt)!,
      openReports: row.openReports,
    },
  };
}

const REPORT_SELECT = `
  SELECT r.id, r.reason, r.status, r.reporter_id AS "reporterId", rep.display_name AS "reporterName",
         r.decided_by AS "decidedById", dec.display_name AS "decidedByName", r.decided_at AS "decidedAt", r.created_at AS "createdAt",
         m.id AS "messageId", m.case_id AS "caseId", c.title AS "caseTitle", m.kind, m.body, m.hidden,
         m.author_id AS "authorId", au.display_name AS "authorName", au.role AS "authorRole", m.created_at AS "messageCreatedAt",
         (SELECT count(*)::int FROM message_reports o WHERE o.message_id = m.id AND o.status = 'open') AS "openReports"
    FROM message_reports r
    JOIN messages m ON m.id = r.message_id
    JOIN cases c ON c.id = m.case_id
    LEFT JOIN users rep ON rep.id = r.reporter_id
    LEFT JOIN users dec ON dec.id = r.decided_by
    LEFT JOIN users au ON au.id = m.author_id`;

export const moderationRepository = {
  async findMessage(id: number, options: { lock?: boolean; transaction?: Transaction } = {}): Promise<ReportedMessage | null> {
    const rows = await getSequelize().query<ReportedMessage & { id: string }>(
      `SELECT id, case_id AS "caseId", kind, body, hidden, author_id AS "authorId" FROM messages WHERE id = :id ${options.lock ? 'FOR UPDATE' : ''}`,
      { replacements: { id }, type: QueryTypes.SELECT, transaction: options.transaction },
    );
    return rows[0] ? { ...rows[0], id: Number(rows[0].id) } : null;
  },

  async findOpenReportBy(messageId: number, reporterId: number): Promise<number | null> {
    const rows = await getSequelize().query<{ id: number }>(
      `SELECT id FROM message_reports WHERE message_id = :messageId AND reporter_id = :reporterId AND status = 'open' ORDER BY id LIMIT 1`,
      { replacements: { messageId, reporterId }, type: QueryTypes.SELECT },
    );
    return rows[0]?.id ?? null;
  },

  async insertReport(input: { messageId: number; reporterId: number; reason: string }, transaction?: Transaction): Promise<number> {
    const [row] = await getSequelize().query<{ id: number }>(
      `INSERT INTO message_reports (message_id, reporter_id, reason) VALUES (:messageId, :reporterId, :reason) RETURNING id`,
      { replacements: input, type: QueryTypes.SELECT, transaction },
    );
    return row.id;
  },

  async findReport(id: number, options: { lock?: boolean; transaction?: Transaction } = {}): Promise<MessageReport | null> {
    const rows = await getSequelize().query<ReportRow>(`${REPORT_SELECT} WHERE r.id = :id ${options.lock ? 'FOR UPDATE OF r' : ''}`, {
      replacements: { id },
      type: QueryTypes.SELECT,
      transaction: options.transaction,
    });
    return rows[0] ? toReport(rows[0]) : null;
  },

  async listReports(filter: { status: ReportStatus; page: number; pageSize: number }): Promise<{ items: MessageReport[]; total: number }> {
    const sequelize = getSequelize();
    const replacements = { status: filter.status, limit: filter.pageSize, offset: (filter.page - 1) * filter.pageSize };
    // Open reports oldest first, so the longest-waiting is seen first; decided ones newest first.
    const order = filter.status === 'open' ? 'r.created_at ASC, r.id ASC' : 'r.decided_at DESC NULLS LAST, r.id DESC';
    const rows = await sequelize.query<ReportRow>(`${REPORT_SELECT} WHERE r.status = :status ORDER BY ${order} LIMIT :limit OFFSET :offset`, {
      replacements,
      type: QueryTypes.SELECT,
    });
    const [{ n }] = await sequelize.query<{ n: string }>(`SELECT count(*) AS n FROM message_reports WHERE status = :status`, { replacements, type: QueryTypes.SELECT });
    return { items: rows.map(toReport), total: Number(n) };
  },

  async hideMessage(id: number, stewardId: number, transaction: Transaction): Promise<Date> {
    const [row] = await getSequelize().query<{ hiddenAt: Date }>(
      `UPDATE messages SET hidden = true, hidden_by = :stewardId, hidden_at = now() WHERE id = :id RETURNING hidden_at AS "hiddenAt"`,
      { replacements: { id, stewardId }, type: QueryTypes.SELECT, transaction },
    );
    return row.hiddenAt;
  },

  /** Puts a hidden message back: its text shows in the thread again. */
  async showMessage(id: number, transaction: Transaction): Promise<void> {
    await getSequelize().query(`UPDATE messages SET hidden = false, hidden_by = NULL, hidden_at = NULL WHERE id = :id`, { replacements: { id }, transaction });
  },

  /** Closes the open reports of a message as settled by the hide; returns their ids. */
  async closeOpenReports(messageId: number, status: 'hidden' | 'dismissed', stewardId: number, transaction: Transaction): Promise<number[]> {
    const rows = await getSequelize().query<{ id: number }>(
      `UPDATE message_reports SET status = :status, decided_by = :stewardId, decided_at = now()
        WHERE message_id = :messageId AND status = 'open' RETURNING id`,
      { replacements: { messageId, status, stewardId }, type: QueryTypes.SELECT, transaction },
    );
    return rows.map((r) => r.id);
  },

  async dismissReport(id: number, stewardId: number, transaction: Transaction): Promise<void> {
    await getSequelize().query(`UPDATE message_reports SET status = 'dismissed', decided_by = :stewardId, decided_at = now() WHERE id = :id`, {
      replacements: { id, stewardId },
      transaction,
    });
  },
};
