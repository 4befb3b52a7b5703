// Cases for the thread and workflow tests, written straight into the tables (the intake route
// is tested on its own), with the opening system line a real case starts its thread with.
import type { Express } from 'express';
import { QueryTypes } from 'sequelize';
import type { CaseStatus, Role } from '../../server/shared/case-status';
import type { SymptomId } from '../../server/shared/vocabulary';
import { getSequelize } from '../../server/src/db/sequelize';
import { agent, TEST_ORIGIN } from '../setup/test-app';
import { createUser, FACTORY_PASSWORD } from './users';

export interface ThreadCaseOptions {
  growerId: number;
  mentorId?: number | null;
  status?: CaseStatus;
  stage?: string;
  symptoms?: SymptomId[];
  title?: string;
  /** the stored part of the urgency (no hours waiting) */
  urgency?: number;
  openedHoursAgo?: number;
  /** defaults to the opening while the case waits for a mentor, else none */
  waitingHoursAgo?: number | null;
}

export async function createThreadCase(options: ThreadCaseOptions): Promise<{ id: number; title: string }> {
  const sequelize = getSequelize();
  const status = options.status ?? 'awaiting_mentor';
  const opened = options.openedHoursAgo ?? 0;
  const waiting = options.waitingHoursAgo !== undefined ? options.waitingHoursAgo : status === 'awaiting_mentor' || status === 'in_conversation' ? opened : null;
  const title = options.title ?? 'IMO2: sour smell in the crock';
  const urgency = options.urgency ?? 0;
  const [row] = await sequelize.query<{ id: number }>(
    `INSERT INTO cases (grower_id, mentor_id, stage, symptoms, title, status, urgency, urgency_level, opened_at, waiting_since, claimed_at, next_seq)
     VALUES (:growerId, :mentorId, :stage, :symptoms::text[], :title, :status, :urgency, :level,
             now() - make_interval(secs => :opened * 3600),
             CASE WHEN :hasWaiting THEN now() - make_interval(secs => :waiting * 3600) END,
             CASE WHEN :mentorId::int IS NULL THEN NULL ELSE now() END, 1)
     RETURNING id`,
    {
      replacements: {
        growerId: options.growerId,
        mentorId: options.mentorId ?? null,
        stage: options.stage ?? 'IMO2',
        // a PostgreSQL array literal; symptom ids hold no commas or quotes
        symptoms: `{${(options.symptoms ?? []).join(',')}}`,
        title,
        status,
        urgency,
        level: urgency >= 45 ? 'high' : urgency >= 20 ? 'medium' : 'low',
        opened,
        hasWaiting: waiting !== null,
        waiting: waiting ?? 0,
      },
      type: QueryTypes.SELECT,
    },
  );
  await sequelize.query(
    `INSERT INTO messages (case_id, seq, author_id, kind, body, created_at)
     VALUES (:id, 1, :growerId, 'system', 'The grower opened this case.', now() - make_interval(secs => :opened * 3600))`,
    { replacements: { id: row.id, growerId: options.growerId, opened } },
  );
  return { id: row.id, title };
}

export async function messageRows(caseId: number): Promise<{ id: string; seq: number; kind: string; body: string; clientId: string | null; authorId: number | null; hidden: boolean }[]> {
  return getSequelize().query(
    `SELECT id, seq, kind, body, client_id AS "clientId", author_id AS "authorId", hidden FROM messages WHERE case_id = :caseId ORDER BY seq`,
    { replacements: { caseId }, type: QueryTypes.SELECT },
  );
}

export async function caseRow(caseId: number): Promise<Record<string, unknown>> {
  const [row] = await getSequelize().query<Record<string, unknown>>(`SELECT * FROM cases WHERE id = :caseId`, { replacements: { caseId }, type: QueryTypes.SELECT });
  return row;
}

export async function outboxFor(to: string, kind?: string): Promise<{ subject: string; body_text: string; dedupe_key: string | null; kind: string }[]> {
  return getSequelize().query(
    `SELECT subject, body_text, dedupe_key, kind FROM outbox_mail WHERE to_address = :to AND (:kind::text IS NULL OR kind = :kind) ORDER BY id`,
    { replacements: { to, kind: kind ?? null }, type: QueryTypes.SELECT },
  );
}

let counter = 0;
/** A client-made message id as the client makes them (8–64 of A–Z a–z 0–9 _ -). */
export function newClientId(): string {
  counter += 1;
  return `t${Date.now().toString(36)}_${counter}_${Math.random().toString(36).slice(2, 8)}`;
}

/** A person of `role` signed in on their own cookie-keeping agent. */
export async function signedInAs(app: Express, role: Role, displayName?: string) {
  const user = await createUser({ role, displayName });
  const browser = agent(app);
  await browser.post('/api/auth/login').set(JSON_HEADERS).send({ email: user.email, password: FACTORY_PASSWORD }).expect(200);
  return { user, browser };
}

export const JSON_HEADERS = { 'Content-Type': 'application/json', Origin: TEST_ORIGIN };
