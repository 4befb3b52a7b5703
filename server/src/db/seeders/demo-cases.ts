// The demo's batch shelves and cases (demo.ts runs this once, as the part "demo:cases").
// Dates in demo-data.ts are relative, so the demo always looks like the last year. Each case
// goes through the same `prepareCaseRow` as a live one (check, risk, urgency, search text),
// then gets its thread, its closing and outcome, and — resolved — its words indexed for
// "batches like this". Resolved cases with the grower's consent are flagged `published`.
//
// A seeded thread reads like one that went through the product: besides the demo's own lines it
// has the system lines the workflow writes (taken, moved over to the grower, closed, recovery
// report; same words, from system-lines.ts), and read marks, so the people on a case have read
// its history: everything on a case that is over, and on an open case everything up to their
// own last line. What is left unread is what a real day would leave: the grower's newest line
// waiting for the mentor, or the mentor's answer the grower has not opened yet.
import type { Transaction } from 'sequelize';
import { OPEN_STATUSES, RESOLVED_STATUSES } from '../../../shared/case-status';
import { DEFAULT_CHECK_IN_DAYS } from '../../../shared/closing-schemas';
import { getSequelize } from '../sequelize';
import { batchesRepository, type BatchRow } from '../../modules/batches/batches.repository';
import { numbersOfBatch } from '../../modules/batches/batches.service';
import { casesRepository } from '../../modules/cases/cases.repository';
import { OPENED_LINE, prepareCaseRow } from '../../modules/cases/cases.service';
import { indexResolvedCase } from '../../modules/cases/search-index';
import { messagesRepository } from '../../modules/threads/messages.repository';
import { claimedLine, closedLine, movedLine, recoveryReportLine } from '../../modules/threads/system-lines';
import { DEMO_BATCHES, DEMO_CASES, DEMO_USERS, type DemoCase } from './demo-data';

const MINUTE = 60_000;
const DAY = 86_400_000;

const daysAgo = (days: number, now: number) => new Date(now - days * DAY);
const dayOf = (date: Date) => date.toISOString().slice(0, 10);

function idOf(users: Map<string, number>, key: string, what: string): number {
  const id = users.get(key);
  if (id === undefined) throw new Error(`demo-data: ${what} "${key}" is not a demo user`);
  return id;
}

/** When the case's life happened, from its thread: claimed just before the mentor's first word, closed after the last one. */
function timesOf(demo: DemoCase, openedAt: Date, now: number) {
  const at = (minutes: number) => new Date(openedAt.getTime() + minutes * MINUTE);
  const mentorLines = demo.messages.filter((m) => m.authorKey === demo.mentorKey);
  const firstMentor = mentorLines.map((m) => m.minutesAfterOpen).sort((a, b) => a - b)[0];
  const lastLine = Math.max(0, ...demo.messages.map((m) => m.minutesAfterOpen));
  // Replies do not claim in the product, so the mentor took the case a moment before answering.
  const claimedAt = demo.mentorKey ? at(firstMentor === undefined ? 30 : firstMentor - Math.min(2, firstMentor / 2)) : null;
  const firstReplyAt = firstMentor !== undefined ? at(firstMentor) : null;
  const closes = demo.status === 'watching' || RESOLVED_STATUSES.includes(demo.status);
  const closedAt = closes ? at(lastLine + 60) : null;
  // A recovery report comes about a week after closing, and never in the future.
  const resolvedAt = RESOLVED_STATUSES.includes(demo.status) && closedAt ? new Date(Math.min(closedAt.getTime() + 7 * DAY, now - 60 * MINUTE)) : null;
  // Waiting for a mentor: from the opening while unclaimed, from the grower's last line in conversation.
  let waitingSince: Date | null = null;
  if (demo.status === 'awaiting_mentor') waitingSince = openedAt;
  if (demo.status === 'in_conversation') {
    const last = [...demo.messages].sort((a, b) => b.minutesAfterOpen - a.minutesAfterOpen)[0];
    waitingSince = !last || last.authorKey === demo.growerKey ? at(last?.minutesAfterOpen ?? 0) : null;
  }
  return { claimedAt, firstReplyAt, closedAt, resolvedAt, waitingSince };
}

export async function seedDemoCases(users: Map<string, number>, transaction: Transaction): Promise<void> {
  const now = Date.now();
  const batches = new Map<string, BatchRow>();
  for (const demo of DEMO_BATCHES) {
    const row = await batchesRepository.create(
      idOf(users, demo.ownerKey, 'batch owner'),
      {
        stage: demo.stage,
        label: demo.label,
        madeOn: dayOf(daysAgo(demo.madeDaysAgo, now)),
        ingredients: demo.ingredients,
        culture: demo.culture,
        sugar: demo.sugar,
        sugarType: demo.sugarType,
        moisturePct: demo.moisturePct ?? null,
        container: demo.container,
        cover: demo.cover,
        location: demo.location,
        notes: demo.notes ?? '',
      },
      transaction,
    );
    batches.set(demo.key, row);
  }

  for (const demo of DEMO_CASES) {
    const growerId = idOf(users, demo.growerKey, 'grower');
    const mentorId = demo.mentorKey ? idOf(users, demo.mentorKey, 'mentor') : null;
    const batch = demo.batchKey ? batches.get(demo.batchKey) : undefined;
    if (demo.batchKey && !batch) throw new Error(`demo-data: case "${demo.key}" names an unknown batch "${demo.batchKey}"`);
    const openedAt = daysAgo(demo.openedDaysAgo, now);
    const intake = prepareCaseRow({
      growerId,
      batchId: batch?.id ?? null,
      stage: demo.stage,
      symptoms: demo.symptoms,
      title: demo.title,
      description: demo.description,
      location: demo.location ?? batch?.location ?? '',
      numbers: batch ? numbersOfBatch(batch) : null,
      batchMadeOn: batch?.madeOn ?? null,
      openedAt,
    });
    const resolved = RESOLVED_STATUSES.includes(demo.status);
    const times = timesOf(demo, openedAt, now);
    const caseId = await casesRepository.insert(
      {
        ...intake,
        ...times,
        status: demo.status,
        mentorId,
        cause: demo.cause ?? null,
        causeNotes: demo.causeNotes ?? null,
        remedy: demo.remedy ?? null,
        remedyNotes: demo.remedyNotes ?? null,
        summary: demo.summary ?? null,
        askToPublish: demo.consentToPublish !== undefined,
        outcome: demo.outcome ?? null,
        stars: demo.stars ?? null,
        recoveryComment: demo.recoveryComment ?? null,
        consentToPublish: demo.consentToPublish ?? false,
        published: resolved && demo.consentToPublish === true,
      },
      transaction,
    );
    const lastSeqBy = new Map<number, number>();
    let lastSeq = 0;
    for (const line of threadOf(demo, { growerId, mentorId }, openedAt, times, users)) {
      const { seq } = await casesRepository.appendMessage(caseId, line, transaction);
      if (line.authorId !== null) lastSeqBy.set(line.authorId, seq);
      lastSeq = seq;
    }
    const open = OPEN_STATUSES.includes(demo.status);
    for (const personId of [growerId, mentorId]) {
      if (personId === null) continue;
      await messagesRepository.markRead(caseId, personId, open ? (lastSeqBy.get(personId) ?? 0) : lastSeq, transaction);
    }
    if (times.closedAt && mentorId !== null) await recordClosing(caseId, mentorId, times.closedAt, demo.status, now, transaction);
    if (resolved) await indexResolvedCase(caseId, transaction);
  }
}

interface SeedLine {
  authorId: number | null;
  kind: 'text' | 'aside' | 'system';
  body: string;
  at: Date;
}

/** The case's thread in time order: its opening, the demo's lines, and the system lines of each status change. */
function threadOf(
  demo: DemoCase,
  people: { growerId: number; mentorId: number | null },
  openedAt: Date,
  times: ReturnType<typeof timesOf>,
  users: Map<string, number>,
): SeedLine[] {
  const minutesLater = (minutes: number) => new Date(openedAt.getTime() + minutes * MINUTE);
  const grower = nameOf(demo.growerKey);
  const mentor = demo.mentorKey ? nameOf(demo.mentorKey) : null;
  const lines: SeedLine[] = [{ authorId: people.growerId, kind: 'system', body: OPENED_LINE, at: openedAt }];
  for (const message of demo.messages) {
    lines.push({ authorId: idOf(users, message.authorKey, 'message author'), kind: message.kind, body: message.body, at: minutesLater(message.minutesAfterOpen) });
  }
  const system = (authorId: number | null, body: string, at: Date) => lines.push({ authorId, kind: 'system', body, at });
  if (mentor && times.claimedAt) system(people.mentorId, claimedLine(mentor), times.claimedAt);
  if (mentor && demo.status === 'over_to_grower') {
    const lastMentorLine = Math.max(0, ...demo.messages.filter((m) => m.authorKey === demo.mentorKey).map((m) => m.minutesAfterOpen));
    system(people.mentorId, movedLine(mentor, 'in_conversation', 'over_to_grower'), minutesLater(lastMentorLine + 1));
  }
  if (mentor && times.closedAt && demo.cause && demo.remedy) {
    system(people.mentorId, closedLine(mentor, { cause: demo.cause, remedy: demo.remedy, checkInDays: DEFAULT_CHECK_IN_DAYS }), times.closedAt);
  }
  if (times.resolvedAt && demo.outcome && demo.stars) {
    system(people.growerId, recoveryReportLine(grower, { outcome: demo.outcome, stars: demo.stars, consentToPublish: demo.consentToPublish === true }), times.resolvedAt);
  }
  // Stable: lines at the same minute keep the order above.
  return lines.sort((a, b) => a.at.getTime() - b.at.getTime());
}

function nameOf(key: string): string {
  const user = DEMO_USERS.find((u) => u.key === key);
  if (!user) throw new Error(`demo-data: "${key}" is not a demo user`);
  return user.displayName;
}

/** Who closed the case, and for one still watching its check-ins: those already due count as sent, so the seed mails nobody. */
async function recordClosing(caseId: number, mentorId: number, closedAt: Date, status: DemoCase['status'], now: number, transaction: Transaction): Promise<void> {
  const sequelize = getSequelize();
  await sequelize.query(`UPDATE cases SET closed_by = :mentorId WHERE id = :caseId`, { replacements: { caseId, mentorId }, transaction });
  if (status !== 'watching') return;
  await sequelize.query(
    `INSERT INTO check_ins (case_id, day, due_at, sent_at)
     SELECT :caseId, d, due, CASE WHEN due <= :now THEN due END
       FROM unnest(ARRAY[:days]::int[]) AS d, LATERAL (SELECT :closedAt::timestamptz + make_interval(days => d) AS due) x`,
    { replacements: { caseId, days: [...DEFAULT_CHECK_IN_DAYS], closedAt, now: new Date(now) }, transaction },
  );
}
