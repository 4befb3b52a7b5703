// A case talked through by a mentor, ready to close, and the steps after it, made through the
// real routes so every test starts from what a grower and a mentor would leave behind.
import type { Express } from 'express';
import { QueryTypes } from 'sequelize';
import type { CloseCaseInput, RecoveryReportInput } from '../../server/shared/closing-schemas';
import { getSequelize } from '../../server/src/db/sequelize';
import { createCase, type CaseOptions } from './cases';
import { JSON_HEADERS, signedIn } from './sign-in';

export const CLOSE_BODY: CloseCaseInput = {
  cause: 'too-little-sugar',
  causeNotes: 'Half the usual sugar for the weight of culture.',
  remedy: 'add-sugar',
  remedyNotes: 'Top-dress with sugar until it matches the culture, check again tomorrow.',
  summary: 'Bubbling IMO2 with half the sugar it needed; topped up to equal weights.',
  askToPublish: true,
};

export const REPORT_BODY: RecoveryReportInput = { outcome: 'recovered', stars: 5, comment: 'Quiet again by the next day.', consentToPublish: false };

export type Browser = Awaited<ReturnType<typeof signedIn>>['browser'];

export interface TalkedCase {
  caseId: number;
  grower: Awaited<ReturnType<typeof signedIn>>;
  mentor: Awaited<ReturnType<typeof signedIn>>;
}

/** A case "In conversation", held by a fresh mentor, opened by a fresh grower. */
export async function talkedCase(app: Express, options: CaseOptions & { growerName?: string; mentorName?: string } = {}): Promise<TalkedCase> {
  const grower = await signedIn(app, 'grower', options.growerName);
  const mentor = await signedIn(app, 'mentor', options.mentorName);
  const caseId = await createCase(grower.user.id, { status: 'in_conversation', mentorId: mentor.user.id, waitingSince: null, ...options });
  return { caseId, grower, mentor };
}

export function closeAs(browser: Browser, caseId: number, body: Partial<CloseCaseInput> = {}) {
  return browser.post(`/api/cases/${caseId}/close`).set(JSON_HEADERS).send({ ...CLOSE_BODY, ...body });
}

export function reportAs(browser: Browser, caseId: number, body: Partial<RecoveryReportInput> = {}) {
  return browser.post(`/api/cases/${caseId}/recovery-report`).set(JSON_HEADERS).send({ ...REPORT_BODY, ...body });
}

/** A case closed by its mentor and now watching. */
export async function watchingCase(app: Express, options: Parameters<typeof talkedCase>[1] = {}, close: Partial<CloseCaseInput> = {}): Promise<TalkedCase> {
  const talked = await talkedCase(app, options);
  const res = await closeAs(talked.mentor.browser, talked.caseId, close);
  if (res.status !== 200) throw new Error(`closing failed: ${res.status} ${JSON.stringify(res.body)}`);
  return talked;
}

export async function caseRow(caseId: number): Promise<Record<string, unknown>> {
  const [row] = await getSequelize().query<Record<string, unknown>>(`SELECT * FROM cases WHERE id = $1`, { bind: [caseId], type: QueryTypes.SELECT });
  return row;
}

export async function systemLines(caseId: number): Promise<string[]> {
  const rows = await getSequelize().query<{ body: string }>(`SELECT body FROM messages WHERE case_id = $1 AND kind = 'system' ORDER BY seq`, {
    bind: [caseId],
    type: QueryTypes.SELECT,
  });
  return rows.map((r) => r.body);
}

export async function mailTo(email: string): Promise<Array<{ subject: string; body_text: string; kind: string; dedupe_key: string | null }>> {
  return getSequelize().query(`SELECT subject, body_text, kind, dedupe_key FROM outbox_mail WHERE to_address = $1 ORDER BY id`, {
    bind: [email],
    type: QueryTypes.SELECT,
  });
}
