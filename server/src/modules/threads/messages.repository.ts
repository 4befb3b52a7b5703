// The thread's storage: messages with a per-case sequence, the reads that unread counts come
// from, and the case row a post locks. Plain camelCase objects out, raw SQL in.
import { QueryTypes, type Transaction } from 'sequelize';
import type { MessageKind, ThreadMessage, ThreadPhoto } from '../../../shared/socket-events';
import type { Role } from '../../../shared/case-status';
import { getSequelize } from '../../db/sequelize';

export const HIDDEN_BODY = 'Hidden by a steward';

/** Where a thread photo is served; the cases router owns the route (see the issue-4 report). */
export function threadPhotoUrls(caseId: number, photoId: number): Pick<ThreadPhoto, 'url' | 'thumbUrl'> {
  return { url: `/api/cases/${caseId}/photos/${photoId}`, thumbUrl: `/api/cases/${caseId}/photos/${photoId}/thumb` };
}

export interface MessageRow {
  id: string | number;
  caseId: number;
  seq: number;
  clientId: string | null;
  kind: MessageKind;
  body: string;
  hidden: boolean;
  createdAt: Date;
  authorId: number | null;
  authorName: string | null;
  authorRole: Role | null;
  photos: { id: number; width: number; height: number }[] | null;
}

const MESSAGE_SELECT = `
  SELECT m.id, m.case_id AS "caseId", m.seq, m.client_id AS "clientId", m.kind, m.body, m.hidden,
         m.created_at AS "createdAt", u.id AS "authorId", u.display_name AS "authorName", u.role AS "authorRole",
         (SELECT json_agg(json_build_object('id', p.id, 'width', p.width, 'height', p.height) ORDER BY p.id)
            FROM case_photos p WHERE p.message_id = m.id) AS photos
    FROM messages m LEFT JOIN users u ON u.id = m.author_id`;

export function toMessage(row: MessageRow): ThreadMessage {
  return {
    id: Number(row.id),
    caseId: row.caseId,
    seq: row.seq,
    clientId: row.clientId,
    kind: row.kind,
    // The text stays in the database for the steward's record; nobody is sent it again.
    body: row.hidden ? HIDDEN_BODY : row.body,
    hidden: row.hidden,
    author: row.authorId != null ? { id: row.authorId, displayName: row.authorName ?? '', role: row.authorRole ?? 'grower' } : null,
    photos: (row.photos ?? []).map((p) => ({ id: p.id, width: p.width, height: p.height, ...threadPhotoUrls(row.caseId, p.id) })),
    createdAt: new Date(row.createdAt).toISOString(),
  };
}

export interface ThreadCase {
  id: number;
  growerId: number;
  mentorId: number | null;
  status: string;
  title: string;
  firstReplyAt: Date | null;
}

export const messagesRepository = {
  /** Messages after `afterSeq` in seq order, at most `limit` (one more is read to tell `hasMore`). */
  async listAfter(caseId: number, options: { afterSeq: number; includeAsides: boolean; limit: number }, transaction?: Transaction): Promise<{ items: ThreadMessage[]; hasMore: boolean }> {
    const rows = await getSequelize().query<MessageRow>(
      `${MESSAGE_SELECT}
        WHERE m.case_id = :caseId AND m.seq > :afterSeq AND (:includeAsides OR m.kind <> 'aside')
        ORDER BY m.seq LIMIT :limit`,
      { replacements: { caseId, afterSeq: options.afterSeq, includeAsides: options.includeAsides, limit: options.limit + 1 }, type: QueryTypes.SELECT, transaction },
    );
    return { items: rows.slice(0, options.limit).map(toMessage), hasMore: rows.length > options.limit };
  },

  /** The last `limit` messages, in seq order (a first look at a thread). */
  async listLatest(caseId: number, options: { includeAsides: boolean; limit: number }): Promise<{ items: ThreadMessage[]; hasMore: boolean }> {
    const rows = await getSequelize().query<MessageRow>(
      `SELECT * FROM (${MESSAGE_SELECT}
        WHERE m.case_id = :caseId AND (:includeAsides OR m.kind <> 'aside')
        ORDER BY m.seq DESC LIMIT :limit) latest ORDER BY seq`,
      { replacements: { caseId, includeAsides: options.includeAsides, limit: options.limit + 1 }, type: QueryTypes.SELECT },
    );
    // The extra row read to tell `hasMore` is the oldest one.
    const hasMore = rows.length > options.limit;
    return { items: (hasMore ? rows.slice(1) : rows).map(toMessage), hasMore };
  },

  async findById(id: number, transaction?: Transaction): Promise<ThreadMessage | null> {
    const rows = await getSequelize().query<MessageRow>(`${MESSAGE_SELECT} WHERE m.id = :id`, { replacements: { id }, type: QueryTypes.SELECT, transaction });
    return rows[0] ? toMessage(rows[0]) : null;
  },

  async findByClientId(caseId: number, clientId: string, transaction?: Transaction): Promise<(ThreadMessage & { authorId: number | null }) | null> {
    const rows = await getSequelize().query<MessageRow>(`${MESSAGE_SELECT} WHERE m.case_id = :caseId AND m.client_id = :clientId`, {
      replacements: { caseId, clientId },
      type: QueryTypes.SELECT,
      transaction,
    });
    return rows[0] ? { ...toMessage(rows[0]), authorId: rows[0].authorId } : null;
  },

  /** Locks the case row for the rest of the transaction: posts and moves on one case queue up here. */
  async lockCase(caseId: number, transaction: Transaction): Promise<ThreadCase | null> {
    const rows = await getSequelize().query<ThreadCase>(
      `SELECT id, grower_id AS "growerId", mentor_id AS "mentorId", status, title, first_reply_at AS "firstReplyAt"
         FROM cases WHERE id = :caseId FOR UPDATE`,
      { replacements: { caseId }, type: QueryTypes.SELECT, transaction },
    );
    return rows[0] ?? null;
  },

  /** Stores one message under the next sequence number of its case. Call with the case locked. */
  async insert(input: { caseId: number; authorId: number | null; kind: MessageKind; body: string; clientId: string | null }, transaction: Transaction): Promise<number> {
    const sequelize = getSequelize();
    const [seqRow] = await sequelize.query<{ next_seq: number }>(`UPDATE cases SET next_seq = next_seq + 1 WHERE id = :caseId RETURNING next_seq`, {
      replacements: { caseId: input.caseId },
      type: QueryTypes.SELECT,
      transaction,
    });
    const [row] = await sequelize.query<{ id: string }>(
      `INSERT INTO messages (case_id, seq, author_id, kind, body, client_id)
       VALUES (:caseId, :seq, :authorId, :kind, :body, :clientId) RETURNING id`,
      { replacements: { ...input, seq: seqRow.next_seq }, type: QueryTypes.SELECT, transaction },
    );
    return Number(row.id);
  },

  /** Links photos the author uploaded to this case, not yet shown in the thread; returns how many. */
  async attachPhotos(messageId: number, caseId: number, uploaderId: number, photoIds: number[], transaction: Transaction): Promise<number> {
    if (!photoIds.length) return 0;
    const rows = await getSequelize().query(
      `UPDATE case_photos SET message_id = :messageId
        WHERE id IN (:photoIds) AND case_id = :caseId AND uploader_id = :uploaderId AND message_id IS NULL RETURNING id`,
      { replacements: { messageId, caseId, uploaderId, photoIds }, type: QueryTypes.SELECT, transaction },
    );
    return rows.length;
  },

  /** Bumps how far one person has read a case; never moves it back. */
  async markRead(caseId: number, userId: number, seq: number, transaction?: Transaction): Promise<void> {
    await getSequelize().query(
      `INSERT INTO case_reads (case_id, user_id, last_seq) VALUES (:caseId, :userId, :seq)
       ON CONFLICT (user_id, case_id) DO UPDATE SET last_seq = GREATEST(case_reads.last_seq, EXCLUDED.last_seq), updated_at = now()`,
      { replacements: { caseId, userId, seq }, transaction },
    );
  },

  /** Marks everything in the case read, up to its newest message. */
  async markAllRead(caseId: number, userId: number): Promise<void> {
    await getSequelize().query(
      `INSERT INTO case_reads (case_id, user_id, last_seq) SELECT id, :userId, next_seq FROM cases WHERE id = :caseId
       ON CONFLICT (user_id, case_id) DO UPDATE SET last_seq = GREATEST(case_reads.last_seq, EXCLUDED.last_seq), updated_at = now()`,
      { replacements: { caseId, userId } },
    );
  },

  /**
   * Unread messages per case for one person: the cases they grow or hold, counting what others
   * wrote after their last read (text, plus asides for mentors and stewards; never system lines
   * or hidden posts).
   */
  async unreadByCase(userId: number, includeAsides: boolean): Promise<Record<string, number>> {
    const rows = await getSequelize().query<{ caseId: number; n: number }>(
      `SELECT c.id AS "caseId", count(m.id)::int AS n
         FROM cases c
         LEFT JOIN case_reads r ON r.case_id = c.id AND r.user_id = :userId
         JOIN messages m ON m.case_id = c.id AND m.seq > COALESCE(r.last_seq, 0)
        WHERE (c.grower_id = :userId OR c.mentor_id = :userId)
          AND m.author_id IS DISTINCT FROM :userId AND NOT m.hidden
          AND (m.kind = 'text' OR (m.kind = 'aside' AND :includeAsides AND c.grower_id <> :userId))
        GROUP BY c.id`,
      { replacements: { userId, includeAsides }, type: QueryTypes.SELECT },
    );
    return Object.fromEntries(rows.map((r) => [String(r.caseId), r.n]));
  },
};
