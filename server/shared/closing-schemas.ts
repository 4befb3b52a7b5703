// Closing a case, the recovery report and publishing consent (PRODUCT.md screens 6 and 7). The
// client's forms and the server's routes validate with these same schemas; the shapes below are
// what the closing routes answer.
import { z } from 'zod';
import type { CaseStatus } from './case-status';
import { OUTCOMES, OUTCOME_LABELS, type Outcome } from './outcomes';
import { CAUSE_IDS, REMEDY_IDS, type CauseId, type RemedyId } from './vocabulary';
import { LIBRARY_HOLD_REASON_MAX } from './moderation-limits';

/** Check-ins after closing, in days: the grower hears from us after 1, 3 and 7 days unless they
 * answer first (PRODUCT.md screen 6). */
export const DEFAULT_CHECK_IN_DAYS: readonly number[] = [1, 3, 7];
export const MAX_CHECK_IN_DAY = 14;
/** A steward may close a watching case as lost once this many days passed with no report. */
export const LOST_AFTER_DAYS = 14;

export { OUTCOMES, OUTCOME_LABELS, type Outcome };
export const outcomeSchema = z.enum(OUTCOMES, { error: 'Choose recovered, partly or lost.' });

const text = (max: number, what: string) =>
  z.string({ error: `Enter ${what} as text.` }).trim().max(max, { error: `Keep ${what} under ${max} characters.` });

/** Words or places the mentor wants kept out of the published field note. */
export const redactTermsSchema = z
  .array(text(80, 'each word to leave out').min(2, { error: 'Each word to leave out needs at least 2 letters.' }), {
    error: 'List the words to leave out as text.',
  })
  .max(20, { error: 'List at most 20 words to leave out.' });

export const closeCaseSchema = z.object({
  cause: z.enum(CAUSE_IDS, { error: 'Choose the likely cause.' }),
  causeNotes: text(2000, 'the notes on the cause').default(''),
  remedy: z.enum(REMEDY_IDS, { error: 'Choose the remedy to try.' }),
  remedyNotes: text(2000, 'the notes on the remedy').default(''),
  summary: text(1500, 'the summary').min(10, { error: 'Write a short summary in plain words (at least 10 characters).' }),
  askToPublish: z.boolean({ error: 'Say whether to ask the grower to share this as a field note.' }).default(true),
  redactTerms: redactTermsSchema.default([]),
  checkInDays: z
    .array(z.int({ error: 'Check-in days are whole days.' }).min(1).max(MAX_CHECK_IN_DAY, { error: `Check in within ${MAX_CHECK_IN_DAY} days.` }))
    .min(1, { error: 'Keep at least one check-in.' })
    .max(5, { error: 'At most 5 check-ins.' })
    .default([...DEFAULT_CHECK_IN_DAYS])
    .transform((days) => [...new Set(days)].sort((a, b) => a - b)),
});
export type CloseCaseInput = z.input<typeof closeCaseSchema>;
export type CloseCaseValues = z.output<typeof closeCaseSchema>;

export const recoveryReportSchema = z.object({
  outcome: outcomeSchema,
  stars: z
    .int({ error: 'Choose from 1 to 5 stars.' })
    .min(1, { error: 'Choose from 1 to 5 stars.' })
    .max(5, { error: 'Choose from 1 to 5 stars.' }),
  comment: text(2000, 'the comment').default(''),
  consentToPublish: z.boolean({ error: 'Say whether this case may be shared as a field note.' }),
  consentPhotos: z.boolean().default(false),
  /** Photos uploaded with purpose "recovery" (POST /api/cases/:id/photos) to go with the report. */
  photoIds: z.array(z.int().positive(), { error: 'Photo ids are numbers.' }).max(6, { error: 'At most 6 photos.' }).default([]),
});
export type RecoveryReportInput = z.input<typeof recoveryReportSchema>;
export type RecoveryReportValues = z.output<typeof recoveryReportSchema>;

export const consentSchema = z.object({
  consentToPublish: z.boolean({ error: 'Say whether this case may be shared as a field note.' }),
  consentPhotos: z.boolean().optional(),
});
export type ConsentInput = z.infer<typeof consentSchema>;

export const publishSchema = z.object({ redactTerms: redactTermsSchema.optional() });

/** A steward taking a field note out of the Field Library says why (the case's thread shows it). */
export const takeDownSchema = z.object({
  reason: text(LIBRARY_HOLD_REASON_MAX, 'the reason')
    .min(3, { error: 'Say in a few words why the note comes out of the library.' }),
});
export type TakeDownInput = z.infer<typeof takeDownSchema>;

export interface CheckInView {
  day: number;
  dueAt: string;
  sentAt: string | null;
}

/** GET /api/cases/:id/closing — the closing side of a case, with what the asker may do now. */
export interface ClosingState {
  caseId: number;
  title: string;
  status: CaseStatus;
  stage: string;
  grower: { id: number; displayName: string };
  mentor: { id: number; displayName: string } | null;
  closedAt: string | null;
  closedBy: { id: number; displayName: string } | null;
  cause: CauseId | null;
  causeNotes: string | null;
  remedy: RemedyId | null;
  remedyNotes: string | null;
  summary: string | null;
  askToPublish: boolean;
  checkIns: CheckInView[];
  outcome: Outcome | null;
  stars: number | null;
  recoveryComment: string | null;
  resolvedAt: string | null;
  consentToPublish: boolean;
  consentPhotos: boolean;
  published: boolean;
  noteSlug: string | null;
  /** Mentors and stewards only (the grower never sees what the mentor flagged). */
  redactTerms?: string[];
  /** A steward took the field note out of the Field Library; it stays out until a steward puts it back. */
  libraryHold: { by: { id: number; displayName: string } | null; at: string; reason: string } | null;
  can: {
    close: boolean;
    fileReport: boolean;
    changeConsent: boolean;
    /** Publish again (the holding mentor or a steward, with consent); a steward's hold allows only stewards. */
    publish: boolean;
    /** A steward, while the note is in the library. */
    takeDown: boolean;
    closeAsLost: boolean;
  };
  /** When a steward may close this watching case as lost (null when not watching). */
  lostAllowedFrom: string | null;
}
