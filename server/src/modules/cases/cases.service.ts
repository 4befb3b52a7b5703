// Opening, reading and listing cases. The server, not the body, decides the status, the
// urgency, the check and the search text; who may read a case is case-access.ts.
import type { Transaction } from 'sequelize';
import { getSequelize } from '../../db/sequelize';
import type { CaseDetail, CaseListItem, CaseListQuery, CaseNumbers, OpenCase, PhotoView } from '../../../shared/case-schemas';
import { OPEN_STATUSES, isStaffRole, type CaseStatus } from '../../../shared/case-status';
import type { StageId, SymptomId } from '../../../shared/vocabulary';
import { notFound } from '../../lib/errors';
import { numbersOfBatch } from '../batches/batches.service';
import { batchesRepository } from '../batches/batches.repository';
import { assessCase, batchAgeAt, defaultTitle, effectiveUrgency } from './case-assessment';
import { readableCaseOr404, seesAsides } from './case-access';
import { casesRepository, type CaseRow, type NewCaseRow, type PhotoRow, type Visibility } from './cases.repository';
import { buildSearchText } from './search-index';

type Reader = Pick<Express.User, 'id' | 'role'>;

export function visibilityOf(user: Reader): Visibility {
  return { asides: seesAsides(user as Express.User), hidden: user.role === 'steward' };
}

/**
 * Everything a list page depends on besides the data: which cases (a grower's own, a mentor's
 * claimed ones, or all), which statuses and filters, and which messages the reader may see as
 * the latest line. Two readers with the same filter get the same page, so it is the key the
 * rounds pages are shared by (rounds-page.ts): mentors share theirs, stewards (who also see
 * hidden messages) theirs, and each grower has their own.
 */
export interface CaseListFilter {
  growerId?: number;
  mentorId?: number;
  statuses: readonly CaseStatus[] | null;
  query: CaseListQuery;
  visibility: Visibility;
}

export interface CaseListPage {
  items: CaseListItem[];
  total: number;
  page: number;
  pageSize: number;
}

export function listFilterOf(user: Reader, query: CaseListQuery): CaseListFilter {
  const staff = isStaffRole(user.role);
  let statuses: readonly CaseStatus[] | null;
  if (query.status === 'all') statuses = null;
  else if (query.status?.length) statuses = query.status;
  else statuses = staff ? OPEN_STATUSES : null;
  return {
    ...(staff ? {} : { growerId: user.id }),
    ...(staff && query.mine ? { mentorId: user.id } : {}),
    statuses,
    query,
    visibility: visibilityOf(user),
  };
}

export interface CaseIntake {
  growerId: number;
  batchId: number | null;
  stage: StageId;
  symptoms: readonly SymptomId[];
  title?: string | null;
  description: string;
  location: string;
  numbers: CaseNumbers | null;
  batchMadeOn: string | null;
  openedAt: Date;
}

/** Everything the server works out for a new case: the live route and the demo seed both use it. */
export function prepareCaseRow(intake: CaseIntake): NewCaseRow {
  const assessment = assessCase({
    stage: intake.stage,
    symptoms: intake.symptoms,
    numbers: intake.numbers,
    batchMadeOn: intake.batchMadeOn,
    openedAt: intake.openedAt,
  });
  const title = intake.title?.trim() || defaultTitle(intake.stage, intake.symptoms);
  return {
    growerId: intake.growerId,
    batchId: intake.batchId,
    stage: intake.stage,
    symptoms: intake.symptoms,
    title,
    description: intake.description,
    location: intake.location,
    culture: intake.numbers?.culture ?? null,
    sugar: intake.numbers?.sugar ?? null,
    sugarType: intake.numbers ? (intake.numbers.sugarType ?? 'brown') : null,
    moisturePct: intake.numbers?.moisturePct ?? null,
    ratio: assessment.ratio,
    check: assessment.check,
    risk: assessment.risk,
    batchMadeOn: intake.batchMadeOn,
    urgency: assessment.urgency,
    urgencyLevel: assessment.urgencyLevel,
    searchText: buildSearchText({ title, description: intake.description, stage: intake.stage, symptoms: intake.symptoms }),
    openedAt: intake.openedAt,
  };
}

export const OPENED_LINE = 'Case opened';

function photoView(row: PhotoRow): PhotoView {
  const url = `/api/cases/${row.caseId}/photos/${row.id}`;
  return {
    id: row.id,
    url,
    thumbUrl: `${url}/thumb`,
    width: row.width,
    height: row.height,
    purpose: row.purpose,
    messageId: row.messageId,
    createdAt: row.createdAt.toISOString(),
  };
}
export { photoView };

const iso = (d: Date | null) => (d ? d.toISOString() : null);
const roundHours = (h: number | null) => (h === null ? null : Math.round(h * 10) / 10);

function detailOf(row: CaseRow, photos: PhotoRow[], reader: Reader): CaseDetail {
  const batchAgeDays = batchAgeAt(row.batchMadeOn, row.openedAt);
  const urgency = effectiveUrgency({ stage: row.stage, symptoms: row.symptoms, risk: row.risk, batchAgeDays, waitingHours: row.waitingHours });
  const steward = reader.role === 'steward';
  return {
    id: row.id,
    title: row.title,
    stage: row.stage,
    symptoms: row.symptoms,
    description: row.description,
    location: row.location,
    status: row.status,
    urgency: urgency.score,
    urgencyLevel: urgency.level,
    urgencyReasons: urgency.reasons,
    openedAt: row.openedAt.toISOString(),
    waitingHours: roundHours(row.waitingHours),
    numbers:
      row.cultureValue !== null && row.cultureUnit && row.sugarValue !== null && row.sugarUnit
        ? {
            culture: { value: row.cultureValue, unit: row.cultureUnit },
            sugar: { value: row.sugarValue, unit: row.sugarUnit },
            sugarType: row.sugarType,
            moisturePct: row.moisturePct,
          }
        : null,
    check: row.checkResult,
    risk: row.risk,
    batch:
      row.batchId !== null && row.batchLabel !== null
        ? { id: row.batchId, label: row.batchLabel, stage: row.batchStage!, madeOn: row.batchDay!, ageDays: Number(row.batchAgeNow) }
        : null,
    batchMadeOn: row.batchMadeOn,
    grower: { id: row.growerId, displayName: row.growerName, ...(steward ? { email: row.growerEmail } : {}) },
    mentor: row.mentorId !== null ? { id: row.mentorId, displayName: row.mentorName ?? '', ...(steward ? { email: row.mentorEmail ?? '' } : {}) } : null,
    photos: photos.map(photoView),
    claimedAt: iso(row.claimedAt),
    closedAt: iso(row.closedAt),
    resolvedAt: iso(row.resolvedAt),
    lastMessageAt: iso(row.lastMessageAt),
    cause: row.cause,
    causeNotes: row.causeNotes,
    remedy: row.remedy,
    remedyNotes: row.remedyNotes,
    summary: row.summary,
    outcome: row.outcome,
    stars: row.stars,
    recoveryComment: row.recoveryComment,
    askToPublish: row.askToPublish,
    consentToPublish: row.consentToPublish,
    published: row.published,
  };
}

export const casesService = {
  async open(user: Reader, input: OpenCase): Promise<CaseDetail> {
    const id = await getSequelize().transaction(async (transaction) => {
      let batchId: number | null = null;
      let numbers = input.numbers ?? null;
      let batchMadeOn = input.madeOn ?? null;
      if (input.batchId !== undefined) {
        const batch = await batchesRepository.findOwned(user.id, input.batchId, transaction);
        if (!batch) throw notFound('That batch');
        batchId = batch.id;
        numbers ??= numbersOfBatch(batch);
        batchMadeOn = batch.madeOn;
      }
      const row = prepareCaseRow({
        growerId: user.id,
        batchId,
        stage: input.stage,
        symptoms: input.symptoms,
        title: input.title,
        description: input.description,
        location: input.location,
        numbers,
        batchMadeOn,
        openedAt: new Date(),
      });
      const caseId = await casesRepository.insert(row, transaction);
      await casesRepository.appendMessage(caseId, { authorId: user.id, kind: 'system', body: OPENED_LINE, at: row.openedAt }, transaction);
      return caseId;
    });
    return this.read(user, id);
  },

  async read(user: Express.User | Reader, id: number): Promise<CaseDetail> {
    await readableCaseOr404(user as Express.User, id);
    const row = await casesRepository.findDetail(id);
    if (!row) throw notFound('That case');
    const photos = await casesRepository.photos(id, visibilityOf(user));
    return detailOf(row, photos, user);
  },

  /** A list page (the rounds, or a grower's own list) for a filter from `listFilterOf`. */
  async listPage(filter: CaseListFilter): Promise<CaseListPage> {
    const { query } = filter;
    const { rows, total } = await casesRepository.list(filter);
    const items: CaseListItem[] = rows.map((r) => ({
      id: r.id,
      title: r.title,
      stage: r.stage,
      symptoms: r.symptoms,
      status: r.status,
      risk: r.risk,
      urgency: r.urgency,
      urgencyLevel: r.urgencyLevel,
      openedAt: r.openedAt.toISOString(),
      waitingHours: roundHours(r.waitingHours),
      mentor: r.mentorId !== null ? { id: r.mentorId, displayName: r.mentorName ?? '' } : null,
      grower: { id: r.growerId, displayName: r.growerName },
      lastMessageAt: iso(r.lastMessageAt),
      lastMessagePreview: r.lastMessageBody === null ? null : r.lastMessageBody.slice(0, 140),
    }));
    return { items, total, page: query.page, pageSize: query.pageSize };
  },
};

/**
 * Stores a case's base urgency again from its stored facts (symptoms, risk, batch age at
 * opening). For whoever changes those facts; waiting time needs no call (it is added on read).
 */
export async function refreshCaseUrgency(caseId: number, transaction?: Transaction): Promise<void> {
  const facts = await casesRepository.urgencyInputs(caseId, transaction);
  if (!facts) return;
  const base = effectiveUrgency({
    stage: facts.stage,
    symptoms: facts.symptoms,
    risk: facts.risk,
    batchAgeDays: batchAgeAt(facts.batchMadeOn, facts.openedAt),
    waitingHours: 0,
  });
  await casesRepository.setUrgency(caseId, base.score, base.level, transaction);
}

/**
 * For the thread and workflow routes: call with `true` when the case starts waiting for a
 * mentor's reply (a grower writes, it moves back to in_conversation) and `false` when a mentor
 * has answered or it is over to the grower or closed. The rounds list counts hours from it.
 */
export function setCaseWaiting(caseId: number, waiting: boolean, transaction?: Transaction): Promise<void> {
  return casesRepository.setWaiting(caseId, waiting, transaction);
}
