// The batch shelf in SQL. Every read and write is scoped to the owner: another grower's batch
// simply is not found.
import { QueryTypes, type Transaction } from 'sequelize';
import { getSequelize } from '../../db/sequelize';
import type { SugarTypeId } from '../../../shared/batch-check';
import type { BatchCreate, BatchPatch } from '../../../shared/case-schemas';
import { OPEN_STATUSES, type CaseStatus } from '../../../shared/case-status';
import type { MassUnit } from '../../../shared/units';
import type { StageId } from '../../../shared/vocabulary';

/** The numbers as batches and cases both store them (numeric columns read as float8). */
export interface WeightColumns {
  cultureValue: number | null;
  cultureUnit: MassUnit | null;
  sugarValue: number | null;
  sugarUnit: MassUnit | null;
  sugarType: SugarTypeId | null;
  moisturePct: number | null;
}

export interface BatchRow extends WeightColumns {
  id: number;
  ownerId: number;
  stage: StageId;
  label: string;
  madeOn: string;
  ageDays: number;
  ingredients: string;
  container: string;
  cover: string;
  location: string;
  notes: string;
  finishedOn: string | null;
  createdAt: Date;
  updatedAt: Date;
}

/** A shelf row: the batch and its newest open case, if any. */
export interface ShelfBatchRow extends BatchRow {
  openCaseId: number | null;
  openCaseTitle: string | null;
  openCaseStatus: CaseStatus | null;
}

const COLUMNS = `
  b.id, b.owner_id AS "ownerId", b.stage, b.label, to_char(b.made_on, 'YYYY-MM-DD') AS "madeOn",
  GREATEST(0, (now() AT TIME ZONE 'UTC')::date - b.made_on) AS "ageDays", b.ingredients,
  b.culture_value::float8 AS "cultureValue", b.culture_unit AS "cultureUnit",
  b.sugar_value::float8 AS "sugarValue", b.sugar_unit AS "sugarUnit", b.sugar_type AS "sugarType",
  b.moisture_pct::float8 AS "moisturePct", b.container, b.cover, b.location, b.notes,
  to_char(b.finished_on, 'YYYY-MM-DD') AS "finishedOn",
  b.created_at AS "createdAt", b.updated_at AS "updatedAt"`;

/** Which columns a field of the API writes. */
function columnsOf(input: BatchPatch): Record<string, unknown> {
  const set: Record<string, unknown> = {};
  if (input.stage !== undefined) set.stage = input.stage;
  if (input.label !== undefined) set.label = input.label;
  if (input.madeOn !== undefined) set.made_on = input.madeOn;
  if (input.ingredients !== undefined) set.ingredients = input.ingredients;
  if (input.culture !== undefined) {
    set.culture_value = input.culture?.value ?? null;
    set.culture_unit = input.culture?.unit ?? null;
  }
  if (input.sugar !== undefined) {
    set.sugar_value = input.sugar?.value ?? null;
    set.sugar_unit = input.sugar?.unit ?? null;
  }
  if (input.sugarType !== undefined) set.sugar_type = input.sugarType;
  if (input.moisturePct !== undefined) set.moisture_pct = input.moisturePct;
  if (input.container !== undefined) set.container = input.container;
  if (input.cover !== undefined) set.cover = input.cover;
  if (input.location !== undefined) set.location = input.location;
  if (input.notes !== undefined) set.notes = input.notes;
  if (input.finishedOn !== undefined) set.finished_on = input.finishedOn;
  return set;
}

export const batchesRepository = {
  async create(ownerId: number, input: BatchCreate, transaction?: Transaction): Promise<BatchRow> {
    const set = columnsOf(input);
    const names = Object.keys(set);
    const rows = await getSequelize().query<{ id: number }>(
      `INSERT INTO batches (owner_id, ${names.join(', ')}) VALUES (:ownerId, ${names.map((n) => `:${n}`).join(', ')}) RETURNING id`,
      { replacements: { ownerId, ...set }, type: QueryTypes.SELECT, transaction },
    );
    return (await this.findOwned(ownerId, rows[0].id, transaction))!;
  },

  async findOwned(ownerId: number, id: number, transaction?: Transaction): Promise<BatchRow | null> {
    const rows = await getSequelize().query<BatchRow>(`SELECT ${COLUMNS} FROM batches b WHERE b.id = :id AND b.owner_id = :ownerId`, {
      replacements: { id, ownerId },
      type: QueryTypes.SELECT,
      transaction,
    });
    return rows[0] ?? null;
  },

  /** Whose batch this is, or null when there is no such batch (to tell a refused access from a typo). */
  async ownerOf(id: number): Promise<number | null> {
    const rows = await getSequelize().query<{ ownerId: number }>(`SELECT owner_id AS "ownerId" FROM batches WHERE id = :id`, {
      replacements: { id },
      type: QueryTypes.SELECT,
    });
    return rows[0]?.ownerId ?? null;
  },

  /**
   * One page of the shelf (`finished` false: the batches on it, newest made first) or of the
   * batches taken off it (most recently finished first), with how many each side holds.
   */
  async listOwned(ownerId: number, page: number, pageSize: number, finished = false): Promise<{ rows: ShelfBatchRow[]; total: number; counts: { onShelf: number; finished: number } }> {
    const sequelize = getSequelize();
    const [rows, count] = await Promise.all([
      sequelize.query<ShelfBatchRow>(
        `SELECT ${COLUMNS}, oc.id AS "openCaseId", oc.title AS "openCaseTitle", oc.status AS "openCaseStatus"
           FROM batches b
           LEFT JOIN LATERAL (
             SELECT c.id, c.title, c.status FROM cases c
              WHERE c.batch_id = b.id AND c.status IN (:open)
              ORDER BY c.opened_at DESC, c.id DESC LIMIT 1
           ) oc ON true
          WHERE b.owner_id = :ownerId AND (b.finished_on IS NOT NULL) = :finished
          ORDER BY ${finished ? 'b.finished_on DESC, ' : ''}b.made_on DESC, b.id DESC LIMIT :limit OFFSET :offset`,
        { replacements: { ownerId, finished, open: [...OPEN_STATUSES], limit: pageSize, offset: (page - 1) * pageSize }, type: QueryTypes.SELECT },
      ),
      sequelize.query<{ onShelf: number; finished: number }>(
        `SELECT count(*) FILTER (WHERE finished_on IS NULL)::int AS "onShelf", count(*) FILTER (WHERE finished_on IS NOT NULL)::int AS finished
           FROM batches WHERE owner_id = :ownerId`,
        { replacements: { ownerId }, type: QueryTypes.SELECT },
      ),
    ]);
    const counts = count[0];
    return { rows, total: finished ? counts.finished : counts.onShelf, counts };
  },

  async updateOwned(ownerId: number, id: number, patch: BatchPatch): Promise<BatchRow | null> {
    const set = columnsOf(patch);
    const names = Object.keys(set);
    const rows = await getSequelize().query<{ id: number }>(
      `UPDATE batches SET ${names.map((n) => `${n} = :${n}`).join(', ')}, updated_at = now()
        WHERE id = :id AND owner_id = :ownerId RETURNING id`,
      { replacements: { id, ownerId, ...set }, type: QueryTypes.SELECT },
    );
    return rows.length ? this.findOwned(ownerId, id) : null;
  },

  async casesOf(batchId: number): Promise<{ id: number; title: string; status: CaseStatus; openedAt: Date }[]> {
    return getSequelize().query(
      `SELECT id, title, status, opened_at AS "openedAt" FROM cases WHERE batch_id = :batchId ORDER BY opened_at DESC, id DESC LIMIT 50`,
      { replacements: { batchId }, type: QueryTypes.SELECT },
    );
  },
};
