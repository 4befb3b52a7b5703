// The steward desk's contract: request bodies (validated on both sides) and the answers the
// client reads. Imports nothing but zod and this folder.
import { z } from 'zod';
import type { Role } from './case-status';
import { roleSchema } from './case-status-schemas';
import { REASON_MAX } from './moderation-limits';
import type { StageId } from './vocabulary';
import { stageSchema } from './vocabulary-schemas';
import type { MentorLoad, OpenByUrgency, RecoveryRate, WeekReplyTimes, WeekStageCounts } from './metrics';

// ---------------------------------------------------------------------------------------------
// Mentor applications

export const EXPERIENCE_MIN = 40;
export const EXPERIENCE_MAX = 3000;

export const mentorApplicationSchema = z.object({
  experience: z
    .string({ error: 'Tell the stewards about your experience.' })
    .trim()
    .min(EXPERIENCE_MIN, `Write at least ${EXPERIENCE_MIN} characters about what you have made and for how long.`)
    .max(EXPERIENCE_MAX, `Keep it under ${EXPERIENCE_MAX} characters.`),
  stages: z
    .array(stageSchema, { error: 'Choose the stages you know well.' })
    .min(1, 'Choose at least one stage you know well.')
    .max(11)
    .transform((stages) => [...new Set(stages)]),
  region: z.string({ error: 'Say where you grow.' }).trim().min(2, 'Say where you grow, roughly.').max(120, 'Keep it under 120 characters.'),
});
export type MentorApplicationInput = z.input<typeof mentorApplicationSchema>;

export const APPLICATION_STATUSES = ['pending', 'approved', 'declined'] as const;
export type ApplicationStatus = (typeof APPLICATION_STATUSES)[number];
export const applicationStatusSchema = z.enum(APPLICATION_STATUSES);
export const APPLICATION_STATUS_LABELS: Record<ApplicationStatus, string> = {
  pending: 'Waiting for a steward',
  approved: 'Approved',
  declined: 'Declined',
};

export const NOTE_MAX = 1000;

export const applicationDecisionSchema = z
  .object({
    decision: z.enum(['approved', 'declined'], { error: 'Choose approve or decline.' }),
    note: z.string().trim().max(NOTE_MAX, `Keep the note under ${NOTE_MAX} characters.`).default(''),
  })
  // The applicant is told why; a bare "no" helps nobody grow into the role.
  .refine((v) => v.decision !== 'declined' || v.note.length > 0, { path: ['note'], message: 'Say why, so the grower knows what to work on.' });
export type ApplicationDecisionInput = z.input<typeof applicationDecisionSchema>;

/** What growers read about a mentor on their profile, in the mentor's own words (empty: nothing). */
export const ABOUT_MAX = 600;
export const mentorAboutSchema = z.object({
  about: z.string({ error: 'Write a few words, or leave it empty.' }).trim().max(ABOUT_MAX, `Keep it under ${ABOUT_MAX} characters.`),
});

export interface PersonRef {
  id: number;
  displayName: string;
}

export interface MentorApplication {
  id: number;
  /** `disabled` is there for stewards only (the applicant's own list leaves it out) */
  applicant: PersonRef & { email: string; role: Role; disabled?: boolean };
  experience: string;
  stages: StageId[];
  region: string;
  status: ApplicationStatus;
  note: string | null;
  decidedBy: PersonRef | null;
  decidedAt: string | null;
  createdAt: string;
}

// ---------------------------------------------------------------------------------------------
// People

export const userChangeSchema = z
  .object({
    role: roleSchema.optional(),
    disabled: z.boolean({ error: 'Say true or false.' }).optional(),
  })
  .strict()
  .refine((v) => v.role !== undefined || v.disabled !== undefined, { path: ['_'], message: 'Send a role, disabled, or both.' });
export type UserChangeInput = z.infer<typeof userChangeSchema>;

export interface StewardUser {
  id: number;
  email: string;
  displayName: string;
  role: Role;
  emailVerified: boolean;
  disabled: boolean;
  createdAt: string;
}

export interface AuditEntry {
  id: number;
  action: string;
  actor: PersonRef | null;
  targetType: string | null;
  targetId: string | null;
  /** a readable name for the target where there is one (a person's name, a case title) */
  targetLabel: string | null;
  detail: Record<string, unknown>;
  createdAt: string;
}

// ---------------------------------------------------------------------------------------------
// Moderation

export { REASON_MAX };

export const reportMessageSchema = z.object({
  reason: z
    .string({ error: 'Say what is wrong with this message.' })
    .trim()
    .min(3, 'Say in a few words what is wrong with this message.')
    .max(REASON_MAX, `Keep it under ${REASON_MAX} characters.`),
});
export type ReportMessageInput = z.input<typeof reportMessageSchema>;

export const moderationNoteSchema = z.object({
  note: z.string().trim().max(NOTE_MAX, `Keep the note under ${NOTE_MAX} characters.`).default(''),
});

export const REPORT_STATUSES = ['open', 'hidden', 'dismissed'] as const;
export type ReportStatus = (typeof REPORT_STATUSES)[number];
export const reportStatusSchema = z.enum(REPORT_STATUSES);

export interface MessageReport {
  id: number;
  reason: string;
  status: ReportStatus;
  reporter: PersonRef | null;
  decidedBy: PersonRef | null;
  decidedAt: string | null;
  createdAt: string;
  message: {
    id: number;
    caseId: number;
    caseTitle: string;
    kind: 'text' | 'aside' | 'system';
    /** the text as written, for the steward even once hidden */
    body: string;
    hidden: boolean;
    author: (PersonRef & { role: Role }) | null;
    createdAt: string;
    /** open reports on this message, this one included */
    openReports: number;
  };
}

// ---------------------------------------------------------------------------------------------
// Community health

const isoDate = z.iso.date({ error: 'Use a date like 2025-03-31.' });

export const metricsQuerySchema = z
  .object({ from: isoDate.optional(), to: isoDate.optional() })
  .refine((v) => !v.from || !v.to || v.from <= v.to, { path: ['from'], message: 'The start must not be after the end.' });

export interface MentorLoadRow extends MentorLoad {
  displayName: string;
}

export interface CommunityMetrics {
  from: string;
  to: string;
  casesPerWeek: WeekStageCounts[];
  firstReply: WeekReplyTimes[];
  recoveryByStage: RecoveryRate[];
  recoveryByRemedy: RecoveryRate[];
  /** right now, whatever the range */
  openByUrgency: OpenByUrgency;
  /** cases held now, and cases resolved within the range */
  mentorLoad: MentorLoadRow[];
}

export interface CaughtMail {
  id: number;
  to: string;
  subject: string | null;
  text: string | null;
  receivedAt: string;
}

/** Every list route answers this shape. */
/** A field note a steward took out of the Field Library and that is still held out (GET /api/steward/library-holds). */
export interface LibraryHoldItem {
  caseId: number;
  title: string;
  stage: string;
  heldBy: PersonRef | null;
  heldAt: string;
  reason: string;
  /** Whether the grower still agrees to share it (a steward can put it back only then). */
  consentToPublish: boolean;
}

export interface Paged<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** What POST /api/messages/:id/reports answers (201 new, 200 when this person's report was already open). */
export interface ReportReceipt {
  id: number;
  messageId: number;
  reason: string;
  status: 'open';
  createdAt: string;
  alreadyReported: boolean;
}

/** What POST /api/steward/messages/:id/show answers: a hidden message back in its thread. */
export interface ShownMessage {
  id: number;
  caseId: number;
  hidden: false;
}

/** What POST /api/steward/messages/:id/hide answers. */
export interface HiddenMessage {
  id: number;
  caseId: number;
  hidden: true;
  hiddenAt: string;
  reportsClosed: number;
}
