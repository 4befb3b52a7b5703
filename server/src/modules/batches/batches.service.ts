// The batch shelf's rules: owner only (anyone else's batch is "not found"), and each batch
// answered with its age and, when both weights are known, the sugar & water check in brief.
import type { BatchCreate, BatchPatch, BatchView, CaseNumbers } from '../../../shared/case-schemas';
import { AppError, notFound } from '../../lib/errors';
import { log } from '../../lib/logger';
import { checkOf } from '../cases/case-assessment';
import { batchesRepository, type BatchRow } from './batches.repository';

/** The batch's weights as case numbers, or null unless both weights are known. */
export function numbersOfBatch(row: BatchRow): CaseNumbers | null {
  if (row.cultureValue === null || row.cultureUnit === null || row.sugarValue === null || row.sugarUnit === null) return null;
  return {
    culture: { value: row.cultureValue, unit: row.cultureUnit },
    sugar: { value: row.sugarValue, unit: row.sugarUnit },
    sugarType: row.sugarType ?? undefined,
    moisturePct: row.moisturePct ?? undefined,
  };
}

/** The 404 for a batch that is missing or someone else's; the second is a refused access and is logged (ASVS 16.3.2). */
async function batchNotFound(userId: number, id: number): Promise<AppError> {
  const ownerId = await batchesRepository.ownerOf(id);
  if (ownerId !== null && ownerId !== userId) log.security('batch.access_refused', { userId, batchId: id });
  return notFound('That batch');
}

export function batchView(row: BatchRow): BatchView {
  const check = checkOf(row.stage, [], numbersOfBatch(row));
  return {
    id: row.id,
    stage: row.stage,
    label: row.label,
    madeOn: row.madeOn,
    ageDays: Number(row.ageDays),
    ingredients: row.ingredients,
    culture: row.cultureValue !== null && row.cultureUnit ? { value: row.cultureValue, unit: row.cultureUnit } : null,
    sugar: row.sugarValue !== null && row.sugarUnit ? { value: row.sugarValue, unit: row.sugarUnit } : null,
    sugarType: row.sugarType,
    moisturePct: row.moisturePct,
    container: row.container,
    cover: row.cover,
    location: row.location,
    notes: row.notes,
    finishedOn: row.finishedOn,
    check: check && {
      ratio: check.ratio,
      targetRatio: check.targetRatio,
      risk: check.risk,
      waterActivity: check.waterActivity?.estimate ?? null,
      verdict: check.verdict,
      sugarToAdd: check.sugarToAdd,
    },
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** A batch is finished on or after the day it was made; the error names the field that moved. */
function finishedAfterMade(madeOn: string, finishedOn: string | null, field: 'finishedOn' | 'madeOn'): void {
  if (finishedOn === null || finishedOn >= madeOn) return;
  throw new AppError(400, 'invalid_input', 'Some fields need fixing.', {
    [field]: field === 'finishedOn' ? `The batch was made on ${madeOn}: it cannot be finished before that.` : `The batch was finished on ${finishedOn}: it was made before that.`,
  });
}

export const batchesService = {
  async create(ownerId: number, input: BatchCreate): Promise<BatchView> {
    finishedAfterMade(input.madeOn, input.finishedOn ?? null, 'finishedOn');
    return batchView(await batchesRepository.create(ownerId, input));
  },

  async list(ownerId: number, page: number, pageSize: number, finished = false) {
    const { rows, total, counts } = await batchesRepository.listOwned(ownerId, page, pageSize, finished);
    const items = rows.map((row) => ({
      ...batchView(row),
      openCase: row.openCaseId === null ? null : { id: row.openCaseId, title: row.openCaseTitle!, status: row.openCaseStatus! },
    }));
    return { items, total, page, pageSize, counts };
  },

  async ownedOr404(ownerId: number, id: number): Promise<BatchRow> {
    const row = await batchesRepository.findOwned(ownerId, id);
    if (!row) throw await batchNotFound(ownerId, id);
    return row;
  },

  async read(ownerId: number, id: number): Promise<BatchView> {
    const row = await this.ownedOr404(ownerId, id);
    const cases = await batchesRepository.casesOf(id);
    return { ...batchView(row), cases: cases.map((c) => ({ ...c, openedAt: c.openedAt.toISOString() })) };
  },

  /** `current` is the batch as it is now (the router read it to answer 404 first). */
  async update(ownerId: number, id: number, patch: BatchPatch, current: BatchRow): Promise<BatchView> {
    finishedAfterMade(
      patch.madeOn ?? current.madeOn,
      patch.finishedOn === undefined ? current.finishedOn : patch.finishedOn,
      patch.finishedOn !== undefined ? 'finishedOn' : 'madeOn',
    );
    const row = await batchesRepository.updateOwned(ownerId, id, patch);
    if (!row) throw await batchNotFound(ownerId, id);
    return batchView(row);
  },
};
