// Cases and thread messages written straight into the tables, for the steward desk's tests
// (moderation needs messages to report; the metrics need cases with known times).
import type { Express } from 'express';
import { QueryTypes } from 'sequelize';
import type { CaseStatus, Role } from '../../server/shared/case-status';
import type { StageId } from '../../server/shared/vocabulary';
import { getSequelize } from '../../server/src/db/sequelize';
import { setLogSink } from '../../server/src/lib/logger';
import { agent, TEST_ORIGIN } from '../setup/test-app';
import { createUser } from './users';

export interface CaseOverrides {
  growerId: number;
  mentorId?: number | null;
  stage?: StageId;
  title?: string;
  status?: CaseStatus;
  openedAt?: string;
  firstReplyAt?: string | null;
  resolvedAt?: string | null;
  remedy?: string | null;
  urgencyLevel?: 'low' | 'medium' | 'high';
}

export async function insertCase(o: CaseOverrides): Promise<number> {
  const [row] = await getSequelize().query<{ id: number }>(
    `INSERT INTO cases (grower_id, mentor_id, stage, title, status, opened_at, first_reply_at, resolved_at, remedy, urgency_level)
     VALUES (:growerId, :mentorId, :stage, :title, :status, COALESCE(CAST(:openedAt AS timestamptz), now()), :firstReplyAt, :resolvedAt, :remedy, :urgencyLevel)
     RETURNING id`,
    {
      replacements: {
        growerId: o.growerId,
        mentorId: o.mentorId ?? null,
        stage: o.stage ?? 'IMO1',
        title: o.title ?? 'Rice box smells sour on day three',
        status: o.status ?? 'awaiting_mentor',
        openedAt: o.openedAt ?? null,
        firstReplyAt: o.firstReplyAt ?? null,
        resolvedAt: o.resolvedAt ?? null,
        remedy: o.remedy ?? null,
        urgencyLevel: o.urgencyLevel ?? 'low',
      },
      type: QueryTypes.SELECT,
    },
  );
  return row.id;
}

/** Appends a message under the case's next sequence number, the way the thread does. */
export async function insertMessage(caseId: number, authorId: number | null, body: string, kind: 'text' | 'aside' | 'system' = 'text'): Promise<number> {
  const sequelize = getSequelize();
  return sequelize.transaction(async (transaction) => {
    const [seq] = await sequelize.query<{ next_seq: number }>(`UPDATE cases SET next_seq = next_seq + 1 WHERE id = :caseId RETURNING next_seq`, {
      replacements: { caseId },
      type: QueryTypes.SELECT,
      transaction,
    });
    const [row] = await sequelize.query<{ id: string }>(
      `INSERT INTO messages (case_id, seq, author_id, kind, body) VALUES (:caseId, :seq, :authorId, :kind, :body) RETURNING id`,
      { replacements: { caseId, seq: seq.next_seq, authorId, kind, body }, type: QueryTypes.SELECT, transaction },
    );
    return Number(row.id);
  });
}

export const JSON_HEADERS = { 'Content-Type': 'application/json', Origin: TEST_ORIGIN };

/** A cookie-keeping agent signed in as this person (one browser, one session). */
export async function signedInAgent(app: Express, user: { email: string; password: string }) {
  const browser = agent(app);
  await browser.post('/api/auth/login').set(JSON_HEADERS).send({ email: user.email, password: user.password }).expect(200);
  return browser;
}

/** A new person of this role, and an agent signed in as them. */
export async function personSignedIn(app: Express, role: Role) {
  const user = await createUser({ role });
  return { user, browser: await signedInAgent(app, user) };
}

/** Collects log lines for the length of a test (ASVS 16.3 assertions). */
export function captureLog(): { lines: () => Record<string, unknown>[]; restore: () => void } {
  const lines: string[] = [];
  setLogSink((line) => lines.push(line), 'info');
  return {
    lines: () => lines.map((l) => JSON.parse(l) as Record<string, unknown>),
    restore: () => setLogSink((line) => process.stdout.write(line + '\n'), (process.env.LOG_LEVEL as 'silent') ?? 'silent'),
  };
}
