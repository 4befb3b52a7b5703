// The demo's batch shelves and cases (demo.ts runs this once, as the part "demo:cases").
// Dates in demo-data.ts are relative, so the demo always looks like the last year. Each case
// goes through the same `prepareCaseRow` as a live one (check, risk, urgency, search text),
// then gets its thread, its closing and outcome, and — resolved — its words indexed for
// "batches like this". Resolved cases with the grower's consent are flagged `published`.
import type { Transaction } from 'sequelize';
import { RESOLVED_STATUSES } from '../../../shared/case-status';
import { batchesRepository, type BatchRow } from '../../modules/batches/batches.repository';
import { numbersOfBatch } from '../../modules/batches/batches.service';
import { casesRepository } from '../../modules/cases/cases.repository';
import { OPENED_LINE, prepareCaseRow } from '../../modules/cases/cases.service';
import { indexResolvedCase } from '../../modules/cases/search-index';
import { DEMO_BATCHES, DEMO_CASES, type DemoCase } from './demo-data';

const MINUTE = 60_000;
const DAY = 86_400_000;

const daysAgo = (days: number, now: number) => new Date(now - days * DAY);
const dayOf = (date: Date) => date.toISOString().slice(0, 10);

function idOf(users: Map<string, number>, key: string, what: string): number {
  const id = users.get(key);
  if (id === undefined) throw new Error(`demo-data: ${what} "${key}" is not a demo user`);
  return id;
}

/** When the case's life happened, from its thread: claimed at the mentor's first word, closed after the last one. */
function timesOf(demo: DemoCase, openedAt: Date, now: number) {
  const at = (minutes: number) => new Date(openedAt.getTime() + minutes * MINUTE);
  const mentorLines = demo.messages.filter((m) => m.authorKey === demo.mentorKey);
  const firstMentor = mentorLines.map((m) => m.minutesAfterOpen).sort((a, b) => a - b)[0];
  const lastLine = Math.max(0, ...demo.messages.map((m) => m.minutesAfterOpen));
  const claimedAt = demo.mentorKey ? at(firstMentor ?? 30) : null;
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
    const caseId = await casesRepository.insert(
      {
        ...intake,
        ...timesOf(demo, openedAt, now),
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
    await casesRepository.appendMessage(caseId, { authorId: growerId, kind: 'system', body: OPENED_LINE, at: openedAt }, transaction);
    for (const message of [...demo.messages].sort((a, b) => a.minutesAfterOpen - b.minutesAfterOpen)) {
      await casesRepository.appendMessage(
        caseId,
        {
          authorId: idOf(users, message.authorKey, 'message author'),
          kind: message.kind,
          body: message.body,
          at: new Date(openedAt.getTime() + message.minutesAfterOpen * MINUTE),
        },
        transaction,
      );
    }
    if (resolved) await indexResolvedCase(caseId, transaction);
  }
}
