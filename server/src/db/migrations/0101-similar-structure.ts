// "Batches like this" at 100,000 resolved cases (QUALITY.md: p95 ≤ 25 ms). The structural part
// of the score (shared symptoms, same stage, sugar ratio) is computed for every resolved case
// of the draft's stage; reading ~12,000 rows of the heap for that took far too long, so:
// - symptom_bits: the symptoms as a 64-bit mask (bit i = SYMPTOM_BIT_ORDER[i], see
//   similar.service.ts), so shared/all symptoms are two bit_counts instead of array work;
// - a covering index over resolved cases by stage and symptom set: the nearest symptom sets are
//   looked up exactly (a few hundred probes), and a draft without symptoms reads its stage
//   from the index alone.
// The bit order is frozen here: a symptom added to the vocabulary later needs a migration that
// appends it (never reorders) and recomputes the column.
import type { Migration } from '../migrator';

export const SYMPTOM_BIT_ORDER_0101 = [
  'smell-sweet', 'smell-earthy', 'smell-alcoholic', 'smell-sour', 'smell-putrid', 'smell-ammonia', 'smell-musty', 'smell-none',
  'colour-white', 'colour-light-grey', 'colour-dark-grey', 'colour-yellow-orange', 'colour-pink-red', 'colour-bright-green',
  'colour-blue-green', 'colour-black', 'colour-brown', 'bubbling', 'slimy', 'free-liquid', 'wet-sloppy', 'dry-crusty', 'clumped',
  'fuzzy-growth', 'insects', 'animal-damage',
] as const;

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  const order = SYMPTOM_BIT_ORDER_0101.map((s) => `'${s}'`).join(', ');
  await q(`
    CREATE FUNCTION case_symptom_mask(symptoms text[]) RETURNS bigint
    LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$
      SELECT coalesce(bit_or(1::bigint << (p - 1)), 0)
        FROM unnest(symptoms) AS s, array_position(ARRAY[${order}]::text[], s) AS p
       WHERE p IS NOT NULL
    $$`);
  await q(`ALTER TABLE cases ADD COLUMN symptom_bits bigint GENERATED ALWAYS AS (case_symptom_mask(symptoms)) STORED`);
  await q(`
    CREATE INDEX cases_resolved_structure_idx ON cases (stage, symptom_bits) INCLUDE (id, sugar_ratio, published)
     WHERE status IN ('recovered', 'lost')`);
}

export async function down({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`DROP INDEX IF EXISTS cases_resolved_structure_idx`);
  await q(`ALTER TABLE cases DROP COLUMN IF EXISTS symptom_bits`);
  await q(`DROP FUNCTION IF EXISTS case_symptom_mask(text[])`);
}
