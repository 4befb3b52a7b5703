// Batches and cases made directly through the repositories, the way the routes make them.
import type { BatchCreate, CaseNumbers } from '../../server/shared/case-schemas';
import type { CaseStatus } from '../../server/shared/case-status';
import type { CauseId, RemedyId, StageId, SymptomId } from '../../server/shared/vocabulary';
import { getSequelize } from '../../server/src/db/sequelize';
import { batchesRepository } from '../../server/src/modules/batches/batches.repository';
import { casesRepository } from '../../server/src/modules/cases/cases.repository';
import { OPENED_LINE, prepareCaseRow } from '../../server/src/modules/cases/cases.service';
import { indexResolvedCase } from '../../server/src/modules/cases/search-index';
import { forgetResolvedCount } from '../../server/src/modules/cases/similar.service';

export const daysAgo = (days: number) => new Date(Date.now() - days * 86_400_000);
export const dayString = (days: number) => daysAgo(days).toISOString().slice(0, 10);

export function createBatch(ownerId: number, overrides: Partial<BatchCreate> = {}) {
  return batchesRepository.create(ownerId, {
    stage: 'IMO2',
    label: 'Cedar hollow rice',
    madeOn: dayString(5),
    culture: { value: 900, unit: 'g' },
    sugar: { value: 900, unit: 'g' },
    sugarType: 'brown',
    ...overrides,
  });
}

export interface CaseOptions {
  stage?: StageId;
  symptoms?: SymptomId[];
  title?: string;
  description?: string;
  numbers?: CaseNumbers | null;
  batchId?: number | null;
  batchMadeOn?: string | null;
  openedAt?: Date;
  status?: CaseStatus;
  mentorId?: number | null;
  waitingSince?: Date | null;
  cause?: CauseId;
  causeNotes?: string;
  remedy?: RemedyId;
  remedyNotes?: string;
  summary?: string;
  outcome?: 'recovered' | 'partly' | 'lost';
  published?: boolean;
}

/** An open case (awaiting a mentor unless told otherwise), with its "Case opened" line. */
export async function createCase(growerId: number, options: CaseOptions = {}): Promise<number> {
  const openedAt = options.openedAt ?? new Date();
  const row = prepareCaseRow({
    growerId,
    batchId: options.batchId ?? null,
    stage: options.stage ?? 'IMO2',
    symptoms: options.symptoms ?? ['bubbling'],
    title: options.title,
    description: options.description ?? '',
    location: '',
    numbers: options.numbers === undefined ? null : options.numbers,
    batchMadeOn: options.batchMadeOn ?? null,
    openedAt,
  });
  return getSequelize().transaction(async (transaction) => {
    const id = await casesRepository.insert(
      {
        ...row,
        status: options.status,
        mentorId: options.mentorId ?? null,
        waitingSince: options.waitingSince === undefined ? openedAt : options.waitingSince,
        cause: options.cause,
        causeNotes: options.causeNotes,
        remedy: options.remedy,
        remedyNotes: options.remedyNotes,
        summary: options.summary,
        outcome: options.outcome,
        published: options.published,
        consentToPublish: options.published,
      },
      transaction,
    );
    await casesRepository.appendMessage(id, { authorId: growerId, kind: 'system', body: OPENED_LINE, at: openedAt }, transaction);
    return id;
  });
}

/** A resolved case, indexed for "batches like this" as the workflow would leave it. */
export async function createResolvedCase(growerId: number, options: CaseOptions = {}): Promise<number> {
  const outcome = options.outcome ?? 'recovered';
  const id = await createCase(growerId, {
    cause: 'too-little-sugar',
    remedy: 'add-sugar',
    published: true,
    ...options,
    outcome,
    status: outcome === 'lost' ? 'lost' : 'recovered',
    waitingSince: null,
  });
  await getSequelize().transaction((transaction) => indexResolvedCase(id, transaction));
  forgetResolvedCount();
  return id;
}
