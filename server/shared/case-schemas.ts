// The contract of the batch shelf, "open a case", the rounds list and "batches like this": the
// client's forms and the server's routes validate with these same schemas, and the response
// shapes below are what the routes answer.
import { z } from 'zod';
import { MAX_BATCH_GRAMS, SUGAR_TYPE_IDS, type BatchCheckResult, type BatchRisk, type SugarTypeId } from './batch-check';
import { CASE_STATUSES, type CaseStatus } from './case-status';
import { CAUSE_IDS, REMEDY_IDS, STAGE_IDS, SYMPTOM_IDS, type CauseId, type RemedyId, type StageId, type SymptomId } from './vocabulary';
import { toGrams, type MassUnit } from './units';
import { massUnitSchema } from './units-schemas';
import type { UrgencyLevel } from './urgency';

// ---------------------------------------------------------------------------------------------
// Pieces

const stageField = z.enum(STAGE_IDS, { error: 'Choose the stage of the batch.' });
const symptomField = z.enum(SYMPTOM_IDS, { error: 'That is not one of the symptoms Sporewell knows.' });
const sugarTypeField = z.enum(SUGAR_TYPE_IDS, { error: 'Choose brown, white or raw sugar.' });

function weightOf(what: string, allowZero: boolean) {
  const value = z.number({ error: `Enter the ${what} weight as a number.` });
  return z
    .object(
      {
        value: allowZero
          ? value.gte(0, { error: `The ${what} weight cannot be below zero.` })
          : value.gt(0, { error: `Enter a ${what} weight above zero.` }),
        unit: massUnitSchema,
      },
      { error: `Enter the ${what} weight and its unit.` },
    )
    .refine((m) => toGrams(m.value, m.unit) <= MAX_BATCH_GRAMS, {
      error: `That ${what} weight is over 1,000 kg; check the number and the unit.`,
      path: ['value'],
    });
}

export const cultureWeightSchema = weightOf('culture', false);
export const sugarWeightSchema = weightOf('sugar', true);

export const moisturePctSchema = z
  .number({ error: 'Enter the moisture as a number of percent.' })
  .gte(0, { error: 'Moisture is between 0 and 100 %.' })
  .lte(100, { error: 'Moisture is between 0 and 100 %.' });

/** Today as YYYY-MM-DD in UTC; a day of slack covers growers east of Greenwich. */
function latestAllowedDay(): string {
  return new Date(Date.now() + 86_400_000).toISOString().slice(0, 10);
}

export const madeOnSchema = z.iso
  .date({ error: 'Enter the date as YYYY-MM-DD.' })
  .refine((day) => day >= '1950-01-01', { error: 'That date is too long ago.' })
  .refine((day) => day <= latestAllowedDay(), { error: 'The date cannot be in the future.' });

/** The day a grower finished with a batch (used up or thrown out); null puts it back on the shelf. */
export const finishedOnSchema = z.iso
  .date({ error: 'Enter the date as YYYY-MM-DD.' })
  .refine((day) => day <= latestAllowedDay(), { error: 'The date cannot be in the future.' })
  .nullable();

const text = (max: number, what: string) => z.string({ error: `Enter ${what} as text.` }).trim().max(max, { error: `Keep ${what} under ${max} characters.` });

// ---------------------------------------------------------------------------------------------
// Batch shelf

/** What a grower can set on a batch. Create needs stage, label and madeOn; the rest may be
 * left out (text fields then stay empty, weights unknown). PATCH takes any subset, and `null`
 * clears a weight, the sugar type or the moisture. */
const batchFields = {
  stage: stageField,
  label: text(120, 'the label').min(1, { error: 'Give the batch a label.' }),
  madeOn: madeOnSchema,
  ingredients: text(2000, 'the ingredients'),
  culture: cultureWeightSchema.nullable(),
  sugar: sugarWeightSchema.nullable(),
  sugarType: sugarTypeField.nullable(),
  moisturePct: moisturePctSchema.nullable(),
  container: text(120, 'the container'),
  cover: text(120, 'the cover'),
  location: text(200, 'where it sits'),
  notes: text(5000, 'the notes'),
  finishedOn: finishedOnSchema,
};

export const batchCreateSchema = z.object({
  ...batchFields,
  ingredients: batchFields.ingredients.optional(),
  culture: batchFields.culture.optional(),
  sugar: batchFields.sugar.optional(),
  sugarType: batchFields.sugarType.optional(),
  moisturePct: batchFields.moisturePct.optional(),
  container: batchFields.container.optional(),
  cover: batchFields.cover.optional(),
  location: batchFields.location.optional(),
  notes: batchFields.notes.optional(),
  finishedOn: batchFields.finishedOn.optional(),
});
export type BatchCreateInput = z.input<typeof batchCreateSchema>;
export type BatchCreate = z.output<typeof batchCreateSchema>;

export const batchPatchSchema = z
  .object(batchFields)
  .partial()
  .refine((patch) => Object.values(patch).some((v) => v !== undefined), { error: 'Change at least one thing.' });
export type BatchPatchInput = z.input<typeof batchPatchSchema>;
export type BatchPatch = z.output<typeof batchPatchSchema>;

export interface MassValue {
  value: number;
  unit: MassUnit;
}

/** The sugar & water check in brief, on a batch that has both weights. */
export interface BatchCheckSummary {
  ratio: number;
  targetRatio: number | null;
  risk: BatchRisk;
  waterActivity: number | null;
  verdict: string;
  sugarToAdd: { grams: number; value: number; unit: MassUnit };
}

/** GET/POST/PATCH /api/batches… answer this (the list answers `{ items: BatchView[], total, page, pageSize }`). */
export interface BatchView {
  id: number;
  stage: StageId;
  label: string;
  /** YYYY-MM-DD */
  madeOn: string;
  /** whole days since madeOn (server's calendar) */
  ageDays: number;
  ingredients: string;
  culture: MassValue | null;
  sugar: MassValue | null;
  sugarType: SugarTypeId | null;
  moisturePct: number | null;
  container: string;
  cover: string;
  location: string;
  notes: string;
  /** YYYY-MM-DD: the day the grower finished with it (it is off the shelf); null while on the shelf */
  finishedOn: string | null;
  /** null unless both weights are known */
  check: BatchCheckSummary | null;
  createdAt: string;
  updatedAt: string;
  /** only on GET /api/batches/:id: the cases opened about this batch, newest first */
  cases?: { id: number; title: string; status: CaseStatus; openedAt: string }[];
  /** only on GET /api/batches: the newest case about this batch still open, or null */
  openCase?: { id: number; title: string; status: CaseStatus } | null;
}

// ---------------------------------------------------------------------------------------------
// Open a case

/** The numbers of a case: both weights are needed for the check; sugar may be 0. */
export const caseNumbersSchema = z.object(
  {
    culture: cultureWeightSchema,
    sugar: sugarWeightSchema,
    sugarType: sugarTypeField.optional(),
    moisturePct: moisturePctSchema.optional(),
  },
  { error: 'Enter the culture and sugar weights, or leave the numbers out.' },
);
export type CaseNumbers = z.output<typeof caseNumbersSchema>;

export const MAX_CASE_SYMPTOMS = 20;

export const caseSymptomsSchema = z
  .array(symptomField, { error: 'Send the symptoms as a list of ids.' })
  .max(MAX_CASE_SYMPTOMS, { error: `Choose at most ${MAX_CASE_SYMPTOMS} symptoms.` })
  .refine((list) => new Set(list).size === list.length, { error: 'Each symptom once, please.' });

/** POST /api/cases. Fields a grower may not set (status, mentorId, published, urgency, growerId,
 * …) are not in the schema and are dropped. With `batchId` and no `numbers`, the batch's own
 * weights are used; `madeOn` (from-scratch cases) tells the batch's age when there is no batch. */
export const openCaseSchema = z.object({
  batchId: z.number({ error: 'Not a valid batch.' }).int().positive().max(2_147_483_647).optional(),
  stage: stageField,
  symptoms: caseSymptomsSchema.default([]),
  /** empty or left out: the server writes one from the stage and the weightiest symptom */
  title: text(140, 'the title').optional(),
  description: text(5000, 'the description').default(''),
  location: text(200, 'where it sits').default(''),
  madeOn: madeOnSchema.optional(),
  numbers: caseNumbersSchema.optional(),
});
export type OpenCaseInput = z.input<typeof openCaseSchema>;
export type OpenCase = z.output<typeof openCaseSchema>;

// ---------------------------------------------------------------------------------------------
// Photos

export { PHOTO_LIMITS } from './photo-limits';

export const PHOTO_PURPOSES = ['case', 'thread', 'recovery'] as const;
export type PhotoPurpose = (typeof PHOTO_PURPOSES)[number];

/** The text fields that may come with a photo upload (multipart fields are strings). */
export const photoFieldsSchema = z.object({
  purpose: z.enum(PHOTO_PURPOSES, { error: 'purpose is case, thread or recovery.' }).optional(),
  messageId: z.coerce.number({ error: 'Not a valid message.' }).int().positive().max(Number.MAX_SAFE_INTEGER).optional(),
});

export interface PhotoView {
  id: number;
  /** /api/cases/:caseId/photos/:photoId — JPEG, only for who may read the case */
  url: string;
  /** …/thumb — JPEG, at most 400 px on the long side */
  thumbUrl: string;
  width: number;
  height: number;
  purpose: PhotoPurpose;
  messageId: number | null;
  createdAt: string;
}

// ---------------------------------------------------------------------------------------------
// Reading cases

export interface PersonRef {
  id: number;
  displayName: string;
  /** stewards only */
  email?: string;
}

export interface CaseDetail {
  id: number;
  title: string;
  stage: StageId;
  symptoms: SymptomId[];
  description: string;
  location: string;
  status: CaseStatus;
  /** the effective score now: the stored part plus the hours waiting (see cases.repository.ts) */
  urgency: number;
  urgencyLevel: UrgencyLevel;
  urgencyReasons: string[];
  openedAt: string;
  /** hours since the case began waiting for a mentor; null while it waits on no one */
  waitingHours: number | null;
  numbers: { culture: MassValue; sugar: MassValue; sugarType: SugarTypeId | null; moisturePct: number | null } | null;
  /** the full sugar & water check as computed when the case was opened; null without numbers */
  check: BatchCheckResult | null;
  risk: BatchRisk | null;
  batch: { id: number; label: string; stage: StageId; madeOn: string; ageDays: number } | null;
  /** YYYY-MM-DD the batch was made (from the batch, or given with a from-scratch case) */
  batchMadeOn: string | null;
  grower: PersonRef;
  mentor: PersonRef | null;
  photos: PhotoView[];
  claimedAt: string | null;
  closedAt: string | null;
  resolvedAt: string | null;
  lastMessageAt: string | null;
  cause: CauseId | null;
  causeNotes: string | null;
  remedy: RemedyId | null;
  remedyNotes: string | null;
  summary: string | null;
  outcome: 'recovered' | 'partly' | 'lost' | null;
  stars: number | null;
  recoveryComment: string | null;
  askToPublish: boolean;
  consentToPublish: boolean;
  published: boolean;
}

// ---------------------------------------------------------------------------------------------
// The rounds list

const listOf = <T extends z.ZodType>(item: T, max = 30) =>
  z.preprocess(
    (v) => (typeof v === 'string' ? v.split(',') : v === undefined ? undefined : ([] as unknown[]).concat(v))?.map((s) => (typeof s === 'string' ? s.trim() : s)).filter((s) => s !== ''),
    z.array(item).max(max).optional(),
  );

const flag = z.preprocess(
  (v) => (v === undefined ? undefined : v === true || v === '1' || v === 'true' || v === 'yes'),
  z.boolean().optional(),
);

const hours = z.coerce.number({ error: 'Hours as a number.' }).min(0).max(24 * 365 * 10).optional();

export const CASE_SORTS = ['urgency', 'oldest', 'newest'] as const;
export type CaseSort = (typeof CASE_SORTS)[number];

/** GET /api/cases query. `status` is one id, a comma list, or `all`; leaving it out means all of
 * a grower's own cases, and the open ones (awaiting_mentor, in_conversation, over_to_grower)
 * for mentors and stewards. `symptom` keeps cases with any of the listed symptoms. Age is
 * hours since the case was opened. */
export const caseListQuerySchema = z.object({
  status: z.union([z.literal('all'), listOf(z.enum(CASE_STATUSES, { error: 'Unknown status.' }))]).optional(),
  stage: listOf(stageField),
  symptom: listOf(symptomField),
  mine: flag,
  minAgeHours: hours,
  maxAgeHours: hours,
  sort: z.enum(CASE_SORTS, { error: 'sort is urgency, oldest or newest.' }).default('urgency'),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(50),
});
export type CaseListQueryInput = z.input<typeof caseListQuerySchema>;
export type CaseListQuery = z.output<typeof caseListQuerySchema>;

export interface CaseListItem {
  id: number;
  title: string;
  stage: StageId;
  symptoms: SymptomId[];
  status: CaseStatus;
  risk: BatchRisk | null;
  urgency: number;
  urgencyLevel: UrgencyLevel;
  openedAt: string;
  waitingHours: number | null;
  mentor: { id: number; displayName: string } | null;
  grower: { id: number; displayName: string };
  /** the latest message the reader may see (asides only for mentors and stewards; never hidden ones) */
  lastMessageAt: string | null;
  /** its first 140 characters */
  lastMessagePreview: string | null;
}

// ---------------------------------------------------------------------------------------------
// Batches like this

export const SIMILAR_DEFAULT_LIMIT = 5;
export const SIMILAR_MAX_LIMIT = 20;

const limitField = z.coerce.number({ error: 'limit is a number.' }).int().min(1).max(SIMILAR_MAX_LIMIT).default(SIMILAR_DEFAULT_LIMIT);

/** POST /api/cases/similar: the unsaved draft of the "open a case" form. */
export const similarDraftSchema = z.object({
  stage: stageField.optional(),
  symptoms: z.array(symptomField).max(MAX_CASE_SYMPTOMS).default([]),
  title: text(140, 'the title').default(''),
  description: text(5000, 'the description').default(''),
  numbers: caseNumbersSchema.optional(),
  limit: limitField,
});
export type SimilarDraftInput = z.input<typeof similarDraftSchema>;
export type SimilarDraft = z.output<typeof similarDraftSchema>;

/** GET /api/cases/:id/similar?limit= */
export const similarQuerySchema = z.object({ limit: limitField });

const similarShared = {
  stage: stageField,
  symptoms: z.array(symptomField),
  cause: z.enum(CAUSE_IDS).nullable(),
  remedy: z.enum(REMEDY_IDS).nullable(),
  outcome: z.enum(['recovered', 'partly', 'lost']).nullable(),
  /** 0–1, higher is closer */
  score: z.number().min(0).max(1),
  /** plain sentences, strongest first, e.g. "Same stage (IMO2)", "Shares 2 symptoms: …" */
  reasons: z.array(z.string()),
};

/** What mentors and stewards see: the resolved case itself, published or not. */
export const similarCaseItemSchema = z.object({
  kind: z.literal('case'),
  id: z.number().int(),
  title: z.string(),
  status: z.enum(['recovered', 'lost']),
  published: z.boolean(),
  ...similarShared,
});

/**
 * What a grower sees: never another grower's case (its words, its id), only the anonymised
 * field note made from it with consent, read from the library's copy and linked by its slug.
 */
export const similarNoteItemSchema = z.object({
  kind: z.literal('note'),
  slug: z.string().min(1),
  title: z.string(),
  summary: z.string(),
  ...similarShared,
});

export const similarItemSchema = z.discriminatedUnion('kind', [similarCaseItemSchema, similarNoteItemSchema]);

/** POST /api/cases/similar and GET /api/cases/:id/similar answer this. */
export const similarAnswerSchema = z.object({
  items: z.array(similarItemSchema),
  /** the words that counted, and what a misspelt one was read as (for growers, only words read as typed) */
  terms: z.array(z.object({ word: z.string(), term: z.string() })),
});

export type SimilarCaseItem = z.infer<typeof similarCaseItemSchema>;
export type SimilarNoteItem = z.infer<typeof similarNoteItemSchema>;
export type SimilarItem = z.infer<typeof similarItemSchema>;
export type SimilarAnswer = z.infer<typeof similarAnswerSchema>;
