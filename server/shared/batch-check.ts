// The sugar & water check (PRODUCT.md, "The computation the job needs", 1): how much sugar a
// batch has against its stage's usual rule, what the scale should read, and an estimate of the
// mix's water activity with the microbe groups that can still grow at it.
//
// Model, in short: water = culture × its moisture + sugar × the sugar's water; sucrose = sugar ×
// its sucrose share; only as much sucrose dissolves as the water can hold at 20 °C; the Norrish
// equation turns dissolved sucrose and water into water activity. Other solutes (the culture's
// own sugars and salts, the glucose and fructose in brown sugar) are left out, and they would
// lower water activity a little further, so the estimate leans to the wet, cautious side.
//
// This file: the input's schema and `checkBatch`, which validates and then computes; the data and
// computations themselves are in batch-check-model.ts (no zod), re-exported here.
import { z } from 'zod';
import { MAX_BATCH_GRAMS, SUGAR_TYPE_IDS, checkValidBatch, type BatchCheckResult } from './batch-check-model';
import { STAGE_IDS } from './vocabulary';
import { symptomSchema } from './vocabulary-schemas';
import { toGrams } from './units';
import { massUnitSchema } from './units-schemas';

export * from './batch-check-model';

const weight = (what: string, allowZero: boolean) =>
  z
    .object(
      {
        value: allowZero
          ? z.number({ error: `Enter the ${what} weight as a number.` }).gte(0, { error: `The ${what} weight cannot be below zero.` })
          : z.number({ error: `Enter the ${what} weight as a number.` }).gt(0, { error: `Enter a ${what} weight above zero.` }),
        unit: massUnitSchema,
      },
      { error: `Enter the ${what} weight and its unit.` },
    )
    .refine((m) => toGrams(m.value, m.unit) <= MAX_BATCH_GRAMS, {
      error: `That ${what} weight is over 1,000 kg; check the number and the unit.`,
      path: ['value'],
    });

export const batchCheckInputSchema = z.object({
  stage: z.enum(STAGE_IDS, { error: 'Choose the stage of the batch.' }),
  culture: weight('culture', false),
  sugar: weight('sugar', true),
  sugarType: z.enum(SUGAR_TYPE_IDS, { error: 'Choose brown, white or raw sugar.' }).default('brown'),
  moisturePct: z
    .number({ error: 'Enter the moisture as a number of percent.' })
    .gte(0, { error: 'Moisture is between 0 and 100 %.' })
    .lte(100, { error: 'Moisture is between 0 and 100 %.' })
    .optional(),
  containerWeight: weight('container', true).optional(),
  symptoms: z.array(symptomSchema).max(50).optional(),
});

export type BatchCheckInput = z.input<typeof batchCheckInputSchema>;
export type BatchCheckParsed = z.output<typeof batchCheckInputSchema>;

/** Check a batch. Validates with `batchCheckInputSchema` (throws its ZodError on bad input;
 * routes should safeParse first to answer 400). */
export function checkBatch(input: BatchCheckInput): BatchCheckResult {
  return checkValidBatch(batchCheckInputSchema.parse(input));
}
