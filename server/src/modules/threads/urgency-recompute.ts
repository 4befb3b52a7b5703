// The thread's share of the urgency. The cases module stores the part of the score that does
// not change with time (`cases.urgency`: symptoms, the check's risk, the batch's age) and adds
// the hours waiting when a case is read, counted from `cases.waiting_since` while the case is
// awaiting a mentor or in conversation (see cases.repository.ts). What the thread changes is
// that clock, so every post and move here restarts or stops it in its own transaction:
//
// | event                                              | waiting_since                   |
// |----------------------------------------------------|---------------------------------|
// | the grower writes                                  | kept if already waiting, else now |
// | a mentor or steward writes (not an aside)          | none: the grower has an answer  |
// | moved to "over to the grower", or withdrawn        | none: nobody owes a reply       |
// | back from "over to the grower" to "in conversation"| now                             |
// | claimed, handed over, asides, system lines         | unchanged                       |
import { QueryTypes, type Transaction } from 'sequelize';
import { URGENCY_WEIGHTS, urgencyLevelOf, type UrgencyLevel } from '../../../shared/urgency';
import { getSequelize } from '../../db/sequelize';

export type WaitingClock = 'start' | 'restart' | 'stop';

const CLOCK_SQL: Record<WaitingClock, string> = {
  start: 'COALESCE(waiting_since, now())',
  restart: 'now()',
  stop: 'NULL',
};

export async function setWaiting(caseId: number, clock: WaitingClock, transaction: Transaction): Promise<void> {
  await getSequelize().query(`UPDATE cases SET waiting_since = ${CLOCK_SQL[clock]} WHERE id = :caseId`, { replacements: { caseId }, transaction });
}

export interface UrgencyNow {
  urgency: number;
  urgencyLevel: UrgencyLevel;
}

const WAITING_STATUSES = new Set(['awaiting_mentor', 'in_conversation']);

/** The score as the rounds table shows it at `now`: the stored part plus the hours waiting. */
export function urgencyAt(stored: number, waitingSince: Date | null, status: string, now: Date = new Date()): UrgencyNow {
  const w = URGENCY_WEIGHTS;
  const hours = waitingSince && WAITING_STATUSES.has(status) ? Math.max(0, (now.getTime() - new Date(waitingSince).getTime()) / 3_600_000) : 0;
  const urgency = Math.min(100, stored + Math.round(Math.min(w.waitingCap, hours * w.waitingPointsPerHour)));
  return { urgency, urgencyLevel: urgencyLevelOf(urgency) };
}

export async function urgencyNow(caseId: number, transaction?: Transaction): Promise<UrgencyNow | null> {
  const [row] = await getSequelize().query<{ urgency: number; waitingSince: Date | null; status: string; now: Date }>(
    `SELECT urgency, waiting_since AS "waitingSince", status, now() AS now FROM cases WHERE id = :caseId`,
    { replacements: { caseId }, type: QueryTypes.SELECT, transaction },
  );
  return row ? urgencyAt(row.urgency, row.waitingSince, row.status, new Date(row.now)) : null;
}
