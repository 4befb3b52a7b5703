// Cases in SQL: insert, read one, the rounds list, and a case's photos.
//
// Urgency in the rounds list. `cases.urgency` stores the part of the score that does not grow
// with time (symptoms, the check's risk, the batch's age when the case was opened; see
// case-assessment.ts). The waiting part is added in SQL when the list is read:
//
//   effective = LEAST(100, urgency + ROUND(LEAST(waitingCap, hours waiting × pointsPerHour)))
//
// with waitingCap and pointsPerHour from URGENCY_WEIGHTS, and hours waiting counted from
// `waiting_since` while the case waits for a mentor (awaiting_mentor, in_conversation), else 0.
// Because the stored part is a whole number, this is exactly `urgencyScore()` with the same
// hours (its Math.round of the whole sum), so the list stays current without rewriting rows
// every hour, and sorting by it needs no background job. EXPLAIN on a few thousand open cases
// among 100,000 resolved ones: the open-status indexes narrow first, then a top-N sort of the
// open cases; see cases.test.ts for the plan check.
import { QueryTypes, type Transaction } from 'sequelize';
import { getSequelize } from '../../db/sequelize';
import type { BatchCheckResult, BatchRisk, SugarTypeId } from '../../../shared/batch-check';
import type { CaseDetail, CaseListItem, CaseListQuery, PhotoPurpose } from '../../../shared/case-schemas';
import type { WeightColumns } from '../batches/batches.repository';
import { preparedQuery } from './prepared-query';
import { symptomMask } from './similar.service';
import { OPEN_STATUSES, type CaseStatus } from '../../../shared/case-status';
import { URGENCY_WEIGHTS, type UrgencyLevel } from '../../../shared/urgency';
import type { MassUnit } from '../../../shared/units';
import type { CauseId, RemedyId, StageId, SymptomId } from '../../../shared/vocabulary';

const W = URGENCY_WEIGHTS;
const WAITING_STATUSES = `('awaiting_mentor', 'in_conversation')`;

/** Hours the case has waited for a mentor, or NULL while it waits on no one. */
export const WAITING_HOURS_SQL = `(CASE WHEN c.waiting_since IS NOT NULL AND c.status IN ${WAITING_STATUSES}
  THEN GREATEST(0, EXTRACT(EPOCH FROM (now() - c.waiting_since)) / 3600) END)`;

/** The effective urgency (see the top of this file). numeric arithmetic, so ROUND is half-up like Math.round. */
export const EFFECTIVE_URGENCY_SQL = `LEAST(100, c.urgency + ROUND(LEAST(${W.waitingCap}, coalesce(${WAITING_HOURS_SQL}, 0) * ${W.waitingPointsPerHour})))::int`;

export const urgencyLevelSql = (score: string) =>
  `(CASE WHEN ${score} >= ${W.levels.high} THEN 'high' WHEN ${score} >= ${W.levels.medium} THEN 'medium' ELSE 'low' END)`;

export interface NewCaseRow {
  growerId: number;
  batchId: number | null;
  stage: StageId;
  symptoms: readonly SymptomId[];
  title: string;
  description: string;
  location: string;
  culture: { value: number; unit: MassUnit } | null;
  sugar: { value: number; unit: MassUnit } | null;
  sugarType: SugarTypeId | null;
  moisturePct: number | null;
  ratio: number | null;
  check: BatchCheckResult | null;
  risk: BatchRisk | null;
  batchMadeOn: string | null;
  urgency: number;
  urgencyLevel: UrgencyLevel;
  searchText: string;
  openedAt: Date;
  /** the rest are for the demo seed; a live case starts awaiting a mentor, unclaimed */
  status?: CaseStatus;
  mentorId?: number | null;
  waitingSince?: Date | null;
  claimedAt?: Date | null;
  firstReplyAt?: Date | null;
  closedAt?: Date | null;
  resolvedAt?: Date | null;
  cause?: CauseId | null;
  causeNotes?: string | null;
  remedy?: RemedyId | null;
  remedyNotes?: string | null;
  summary?: string | null;
  askToPublish?: boolean;
  outcome?: 'recovered' | 'partly' | 'lost' | null;
  stars?: number | null;
  recoveryComment?: string | null;
  consentToPublish?: boolean;
  published?: boolean;
}

type CaseDetailColumns = Pick<
  CaseDetail,
  | 'id' | 'stage' | 'symptoms' | 'title' | 'description' | 'location' | 'status' | 'risk' | 'batchMadeOn' | 'cause' | 'causeNotes'
  | 'remedy' | 'remedyNotes' | 'summary' | 'outcome' | 'stars' | 'recoveryComment' | 'askToPublish' | 'consentToPublish' | 'published'
>;

export interface CaseRow extends CaseDetailColumns, WeightColumns {
  growerId: number;
  growerName: string;
  growerEmail: string;
  mentorId: number | null;
  mentorName: string | null;
  mentorEmail: string | null;
  batchId: number | null;
  batchLabel: string | null;
  batchStage: StageId | null;
  batchDay: string | null;
  batchAgeNow: number | null;
  sugarRatio: number | null;
  checkResult: BatchCheckResult | null;
  urgency: number;
  effectiveUrgency: number;
  waitingHours: number | null;
  openedAt: Date;
  claimedAt: Date | null;
  closedAt: Date | null;
  resolvedAt: Date | null;
  lastMessageAt: Date | null;
}

export interface CaseListRow
  extends Pick<CaseListItem, 'id' | 'title' | 'stage' | 'symptoms' | 'status' | 'risk' | 'urgency' | 'urgencyLevel' | 'waitingHours'> {
  openedAt: Date;
  mentorId: number | null;
  mentorName: string | null;
  growerId: number;
  growerName: string;
  lastMessageAt: Date | null;
  lastMessageBody: string | null;
}

export interface PhotoRow {
  id: number;
  caseId: number;
  storageKey: string;
  thumbKey: string;
  width: number;
  height: number;
  purpose: PhotoPurpose;
  messageId: number | null;
  createdAt: Date;
}

/** Which thread messages a reader may see: growers never see asides, only stewards see hidden ones. */
export interface Visibility {
  asides: boolean;
  hidden: boolean;
}

const messageKinds = (v: Visibility) => (v.asides ? `('text', 'aside', 'system')` : `('text', 'system')`);

const DETAIL_COLUMNS = `
  c.id, c.grower_id AS "growerId", g.display_name AS "growerName", g.email::text AS "growerEmail",
  c.mentor_id AS "mentorId", m.display_name AS "mentorName", m.email::text AS "mentorEmail",
  c.batch_id AS "batchId", b.label AS "batchLabel", b.stage AS "batchStage", to_char(b.made_on, 'YYYY-MM-DD') AS "batchDay",
  GREATEST(0, (now() AT TIME ZONE 'UTC')::date - b.made_on) AS "batchAgeNow",
  c.stage, c.symptoms, c.title, c.description, c.location,
  c.culture_value::float8 AS "cultureValue", c.culture_unit AS "cultureUnit",
  c.sugar_value::float8 AS "sugarValue", c.sugar_unit AS "sugarUnit", c.sugar_type AS "sugarType",
  c.moisture_pct::float8 AS "moisturePct", c.sugar_ratio AS "sugarRatio", c.check_result AS "checkResult", c.risk,
  to_char(c.batch_made_on, 'YYYY-MM-DD') AS "batchMadeOn",
  c.urgency, ${EFFECTIVE_URGENCY_SQL} AS "effectiveUrgency", ${WAITING_HOURS_SQL}::float8 AS "waitingHours",
  c.status, c.opened_at AS "openedAt", c.claimed_at AS "claimedAt", c.closed_at AS "closedAt", c.resolved_at AS "resolvedAt",
  c.cause, c.cause_notes AS "causeNotes", c.remedy, c.remedy_notes AS "remedyNotes", c.summary, c.outcome, c.stars,
  c.recovery_comment AS "recoveryComment", c.ask_to_publish AS "askToPublish", c.consent_to_publish AS "consentToPublish", c.published`;

export const casesRepository = {
  async insert(row: NewCaseRow, transaction: Transaction): Promise<number> {
    const rows = await getSequelize().query<{ id: number }>(
      `INSERT INTO cases (
         grower_id, batch_id, mentor_id, stage, symptoms, title, description, location,
         culture_value, culture_unit, sugar_value, sugar_unit, sugar_type, moisture_pct, sugar_ratio, check_result, risk,
         batch_made_on, urgency, urgency_level, status, opened_at, waiting_since, claimed_at, first_reply_at, closed_at, resolved_at,
         cause, cause_notes, remedy, remedy_notes, summary, ask_to_publish, outcome, stars, recovery_comment,
         consent_to_publish, published, search_text, created_at, updated_at)
       VALUES (
         $growerId, $batchId, $mentorId, $stage, $symptoms::text[], $title, $description, $location,
         $cultureValue, $cultureUnit, $sugarValue, $sugarUnit, $sugarType, $moisturePct, $ratio, $check::jsonb, $risk,
         $batchMadeOn::date, $urgency, $urgencyLevel, $status, $openedAt, $waitingSince, $claimedAt, $firstReplyAt, $closedAt, $resolvedAt,
         $cause, $causeNotes, $remedy, $remedyNotes, $summary, $askToPublish, $outcome, $stars, $recoveryComment,
         $consentToPublish, $published, $searchText, $openedAt, now())
       RETURNING id`,
      {
        bind: {
          growerId: row.growerId,
          batchId: row.batchId,
          mentorId: row.mentorId ?? null,
          stage: row.stage,
          symptoms: [...row.symptoms],
          title: row.title,
          description: row.description,
          location: row.location,
          cultureValue: row.culture?.value ?? null,
          cultureUnit: row.culture?.unit ?? null,
          sugarValue: row.sugar?.value ?? null,
          sugarUnit: row.sugar?.unit ?? null,
          sugarType: row.sugarType,
          moisturePct: row.moisturePct,
          ratio: row.ratio,
          check: row.check === null ? null : JSON.stringify(row.check),
          risk: row.risk,
          batchMadeOn: row.batchMadeOn,
          urgency: row.urgency,
          urgencyLevel: row.urgencyLevel,
          status: row.status ?? 'awaiting_mentor',
          openedAt: row.openedAt,
          waitingSince: row.waitingSince === undefined ? row.openedAt : row.waitingSince,
          claimedAt: row.claimedAt ?? null,
          firstReplyAt: row.firstReplyAt ?? null,
          closedAt: row.closedAt ?? null,
          resolvedAt: row.resolvedAt ?? null,
          cause: row.cause ?? null,
          causeNotes: row.causeNotes ?? null,
          remedy: row.remedy ?? null,
          remedyNotes: row.remedyNotes ?? null,
          summary: row.summary ?? null,
          askToPublish: row.askToPublish ?? false,
          outcome: row.outcome ?? null,
          stars: row.stars ?? null,
          recoveryComment: row.recoveryComment ?? null,
          consentToPublish: row.consentToPublish ?? false,
          published: row.published ?? false,
          searchText: row.searchText,
        },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    return rows[0].id;
  },

  /** Appends a thread message with the next per-case sequence number (same transaction). */
  async appendMessage(
    caseId: number,
    message: { authorId: number | null; kind: 'text' | 'aside' | 'system'; body: string; at?: Date },
    transaction: Transaction,
  ): Promise<{ id: number; seq: number }> {
    const sequelize = getSequelize();
    const [next] = await sequelize.query<{ seq: number }>(`UPDATE cases SET next_seq = next_seq + 1 WHERE id = :caseId RETURNING next_seq AS seq`, {
      replacements: { caseId },
      type: QueryTypes.SELECT,
      transaction,
    });
    const at = message.at ?? new Date();
    const [inserted] = await sequelize.query<{ id: string }>(
      `INSERT INTO messages (case_id, seq, author_id, kind, body, created_at) VALUES (:caseId, :seq, :authorId, :kind, :body, :at) RETURNING id`,
      { replacements: { caseId, seq: next.seq, authorId: message.authorId, kind: message.kind, body: message.body, at }, type: QueryTypes.SELECT, transaction },
    );
    if (message.kind !== 'aside') {
      await sequelize.query(
        `UPDATE cases SET last_message_at = :at, last_message_preview = left(:body, 140) WHERE id = :caseId AND (last_message_at IS NULL OR last_message_at <= :at)`,
        { replacements: { caseId, at, body: message.body }, transaction },
      );
    }
    return { id: Number(inserted.id), seq: next.seq };
  },

  async findDetail(id: number): Promise<CaseRow | null> {
    const rows = await getSequelize().query<CaseRow>(
      `SELECT ${DETAIL_COLUMNS}
         FROM cases c
         JOIN users g ON g.id = c.grower_id
         LEFT JOIN users m ON m.id = c.mentor_id
         LEFT JOIN batches b ON b.id = c.batch_id
        WHERE c.id = :id`,
      { replacements: { id }, type: QueryTypes.SELECT },
    );
    return rows[0] ?? null;
  },

  /** The urgency inputs of one case, to store its base urgency again after it changed. */
  async urgencyInputs(id: number, transaction?: Transaction) {
    const rows = await getSequelize().query<{ stage: StageId; symptoms: SymptomId[]; risk: BatchRisk | null; batchMadeOn: string | null; openedAt: Date }>(
      `SELECT stage, symptoms, risk, to_char(batch_made_on, 'YYYY-MM-DD') AS "batchMadeOn", opened_at AS "openedAt" FROM cases WHERE id = :id`,
      { replacements: { id }, type: QueryTypes.SELECT, transaction },
    );
    return rows[0] ?? null;
  },

  async setUrgency(id: number, urgency: number, level: UrgencyLevel, transaction?: Transaction): Promise<void> {
    await getSequelize().query(`UPDATE cases SET urgency = :urgency, urgency_level = :level, updated_at = now() WHERE id = :id`, {
      replacements: { id, urgency, level },
      transaction,
    });
  },

  /**
   * The rounds list (and a grower's own list). `growerId` limits to one grower's cases,
   * `mentorId` to the cases a mentor claimed. Both statements are prepared (prepared-query.ts):
   * planning the page statement cost more than running it on 500 open cases.
   */
  async list(filter: {
    growerId?: number;
    mentorId?: number;
    statuses: readonly CaseStatus[] | null;
    query: CaseListQuery;
    visibility: Visibility;
  }): Promise<{ rows: CaseListRow[]; total: number }> {
    const { query } = filter;
    const where: string[] = [];
    const values: Record<string, unknown> = {};
    if (filter.growerId !== undefined) {
      where.push('c.grower_id = $growerId');
      values.growerId = filter.growerId;
    }
    if (filter.mentorId !== undefined) {
      where.push('c.mentor_id = $mentorId');
      values.mentorId = filter.mentorId;
    }
    if (filter.statuses) {
      // Spelled out when it is exactly the open set, so the partial indexes on open cases apply.
      const open = filter.statuses.length === OPEN_STATUSES.length && OPEN_STATUSES.every((s) => filter.statuses!.includes(s));
      if (open) where.push(`c.status IN ('awaiting_mentor', 'in_conversation', 'over_to_grower')`);
      else {
        where.push('c.status = ANY($statuses::text[])');
        values.statuses = [...filter.statuses];
      }
    }
    if (query.stage?.length) {
      where.push('c.stage = ANY($stages::text[])');
      values.stages = [...query.stage];
    }
    if (query.symptom?.length) {
      // "has any of these", on the symptom mask (migration 0101), which the rounds index holds
      where.push('(c.symptom_bits & $symptomMask::int) <> 0');
      values.symptomMask = symptomMask(query.symptom);
    }
    if (query.minAgeHours !== undefined) {
      where.push(`c.opened_at <= now() - make_interval(secs => $minAge::float8)`);
      values.minAge = query.minAgeHours * 3600;
    }
    if (query.maxAgeHours !== undefined) {
      where.push(`c.opened_at >= now() - make_interval(secs => $maxAge::float8)`);
      values.maxAge = query.maxAgeHours * 3600;
    }
    const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
    const order =
      query.sort === 'oldest' ? 'c.opened_at ASC, c.id ASC' : query.sort === 'newest' ? 'c.opened_at DESC, c.id DESC' : `${EFFECTIVE_URGENCY_SQL} DESC, c.opened_at ASC, c.id ASC`;
    const hidden = filter.visibility.hidden ? '' : 'AND NOT lm.hidden';
    const [rows, count] = await Promise.all([
      preparedQuery<CaseListRow>(
        // The page is chosen first, so the last message is looked up for its rows only.
        `WITH page AS (
           SELECT c.id, row_number() OVER (ORDER BY ${order}) AS ord
             FROM cases c ${whereSql}
            ORDER BY ${order}
            LIMIT $limit::int OFFSET $offset::int
         )
         SELECT c.id, c.title, c.stage, c.symptoms, c.status, c.risk,
                ${EFFECTIVE_URGENCY_SQL} AS urgency, ${urgencyLevelSql(EFFECTIVE_URGENCY_SQL)} AS "urgencyLevel",
                c.opened_at AS "openedAt", ${WAITING_HOURS_SQL}::float8 AS "waitingHours",
                c.mentor_id AS "mentorId", m.display_name AS "mentorName", c.grower_id AS "growerId", g.display_name AS "growerName",
                last.created_at AS "lastMessageAt", last.body AS "lastMessageBody"
           FROM page p
           JOIN cases c ON c.id = p.id
           JOIN users g ON g.id = c.grower_id
           LEFT JOIN users m ON m.id = c.mentor_id
           LEFT JOIN LATERAL (
             SELECT lm.body, lm.created_at FROM messages lm
              WHERE lm.case_id = c.id AND lm.kind IN ${messageKinds(filter.visibility)} ${hidden}
              ORDER BY lm.seq DESC LIMIT 1
           ) last ON true
          ORDER BY p.ord`,
        { ...values, limit: query.pageSize, offset: (query.page - 1) * query.pageSize },
      ),
      preparedQuery<{ total: number }>(`SELECT count(*)::int AS total FROM cases c ${whereSql}`, values),
    ]);
    return { rows, total: count[0].total };
  },

  /** Starts (or keeps) the waiting clock while the case waits for a mentor; stops it otherwise. */
  async setWaiting(id: number, waiting: boolean, transaction?: Transaction): Promise<void> {
    await getSequelize().query(
      `UPDATE cases SET waiting_since = CASE WHEN :waiting THEN coalesce(waiting_since, now()) ELSE NULL END WHERE id = :id`,
      { replacements: { id, waiting }, transaction },
    );
  },

  async insertPhotos(
    caseId: number,
    uploaderId: number,
    meta: { purpose: PhotoPurpose; messageId: number | null },
    photos: { storageKey: string; thumbKey: string; width: number; height: number; bytes: number }[],
    transaction: Transaction,
  ): Promise<PhotoRow[]> {
    const rows: PhotoRow[] = [];
    for (const photo of photos) {
      const [row] = await getSequelize().query<PhotoRow>(
        `INSERT INTO case_photos (case_id, uploader_id, message_id, storage_key, thumb_key, width, height, bytes, purpose)
         VALUES (:caseId, :uploaderId, :messageId, :storageKey, :thumbKey, :width, :height, :bytes, :purpose)
         RETURNING id, case_id AS "caseId", storage_key AS "storageKey", thumb_key AS "thumbKey", width, height, purpose,
                   message_id AS "messageId", created_at AS "createdAt"`,
        { replacements: { caseId, uploaderId, ...meta, ...photo }, type: QueryTypes.SELECT, transaction },
      );
      rows.push({ ...row, messageId: row.messageId === null ? null : Number(row.messageId) });
    }
    return rows;
  },

  /** A case's photos the reader may see: none tied to an aside for growers, none tied to a hidden message but for stewards. */
  async photos(caseId: number, visibility: Visibility, photoId?: number): Promise<PhotoRow[]> {
    const rows = await getSequelize().query<PhotoRow>(
      `SELECT p.id, p.case_id AS "caseId", p.storage_key AS "storageKey", p.thumb_key AS "thumbKey", p.width, p.height, p.purpose,
              p.message_id AS "messageId", p.created_at AS "createdAt"
         FROM case_photos p
         LEFT JOIN messages msg ON msg.id = p.message_id
        WHERE p.case_id = :caseId ${photoId === undefined ? '' : 'AND p.id = :photoId'}
          AND (msg.id IS NULL OR (msg.kind IN ${messageKinds(visibility)} ${visibility.hidden ? '' : 'AND NOT msg.hidden'}))
        ORDER BY p.id`,
      { replacements: { caseId, photoId: photoId ?? null }, type: QueryTypes.SELECT },
    );
    return rows.map((r) => ({ ...r, messageId: r.messageId === null ? null : Number(r.messageId) }));
  },

  async messageOfCase(caseId: number, messageId: number, transaction?: Transaction): Promise<{ kind: string; authorId: number | null } | null> {
    const rows = await getSequelize().query<{ kind: string; authorId: number | null }>(
      `SELECT kind, author_id AS "authorId" FROM messages WHERE id = :messageId AND case_id = :caseId AND NOT hidden`,
      { replacements: { caseId, messageId }, type: QueryTypes.SELECT, transaction },
    );
    return rows[0] ?? null;
  },
};
