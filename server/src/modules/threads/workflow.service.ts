// Claiming, handing over and moving a case along PRODUCT.md's workflow. Each change locks the
// case row, writes a system line (who and what; created_at is when), restarts or stops the
// waiting clock the urgency counts from (urgency-recompute.ts), and is published live only
// after it is committed.
//
// Decisions: claiming is explicit (a reply from a mentor who does not hold the case does not
// claim it); claiming a case you already hold changes nothing and answers 200; a mentor may
// move only a case they hold or one nobody holds (moving an unheld case takes it); a steward
// may move any case; `watching`, `recovered` and `lost` come from closing and the recovery
// report, never from POST /status.
import { QueryTypes, type Transaction } from 'sequelize';
import { OPEN_STATUSES, STATUS_LABELS, canMove, isLegalMove, type CaseStatus, type Role } from '../../../shared/case-status';
import type { ThreadMessage } from '../../../shared/socket-events';
import type { UrgencyLevel } from '../../../shared/urgency';
import { getSequelize } from '../../db/sequelize';
import { AppError, conflict, forbidden, notFound } from '../../lib/errors';
import { readableCaseOr404 } from '../cases/case-access';
import { messagesRepository as repo, type ThreadCase } from './messages.repository';
import { writeSystemLine } from './messages.service';
import { claimedLine, handedOverLine, movedLine } from './system-lines';
import type { ThreadChange } from './thread-events';
import { setWaiting, urgencyAt } from './urgency-recompute';

export interface CaseWorkflowState {
  id: number;
  status: CaseStatus;
  mentorId: number | null;
  mentor: { id: number; displayName: string } | null;
  /** as the rounds table shows it now: the stored part plus the hours waiting */
  urgency: number;
  urgencyLevel: UrgencyLevel;
  /** since when the grower has been waiting for a mentor's reply; null while nobody owes one */
  waitingSince: string | null;
  claimedAt: string | null;
  firstReplyAt: string | null;
  closedAt: string | null;
  updatedAt: string;
}

export interface WorkflowResult {
  state: CaseWorkflowState;
  /** the system line written, or null when nothing changed */
  systemMessage: ThreadMessage | null;
  change: ThreadChange | null;
}

const isOpen = (status: string) => (OPEN_STATUSES as readonly string[]).includes(status);
const label = (status: string) => STATUS_LABELS[status as CaseStatus] ?? status;

function caseClosed(status: string): AppError {
  return conflict('case_closed', `This case is “${label(status)}”, so it can no longer be claimed or handed over.`);
}

export async function claimCase(user: Express.User, caseId: number): Promise<WorkflowResult> {
  return change(user, caseId, async (row, t) => {
    if (row.growerId === user.id) throw forbidden('You cannot mentor a case you opened yourself.');
    if (!isOpen(row.status)) throw caseClosed(row.status);
    if (row.mentorId === user.id) return null;
    if (row.mentorId !== null) {
      const holder = await displayNameOf(row.mentorId, t);
      throw conflict('already_claimed', `${holder ?? 'Another mentor'} already holds this case.`);
    }
    await assign(row, user.id, t);
    return claimedLine(user.displayName);
  });
}

export async function handOverCase(user: Express.User, caseId: number, targetId: number): Promise<WorkflowResult> {
  return change(user, caseId, async (row, t) => {
    if (user.role !== 'steward' && row.mentorId !== user.id) {
      throw forbidden('Only the mentor who holds this case, or a steward, can hand it over.');
    }
    if (!isOpen(row.status)) throw caseClosed(row.status);
    const [target] = await getSequelize().query<{ id: number; displayName: string; role: Role; disabled: boolean }>(
      `SELECT id, display_name AS "displayName", role, disabled FROM users WHERE id = :targetId`,
      { replacements: { targetId }, type: QueryTypes.SELECT, transaction: t },
    );
    if (!target || target.role !== 'mentor' || target.disabled || target.id === row.growerId) {
      throw new AppError(400, 'invalid_input', 'A case can be handed only to an active mentor.', { mentorId: 'Choose an active mentor other than the grower.' });
    }
    if (target.id === row.mentorId) throw conflict('no_change', `${target.displayName} already holds this case.`);
    await assign(row, target.id, t);
    return handedOverLine(user.displayName, target.displayName);
  });
}

export async function moveCase(user: Express.User, caseId: number, to: CaseStatus): Promise<WorkflowResult> {
  return change(user, caseId, async (row, t) => {
    const from = row.status as CaseStatus;
    if (!isLegalMove(from, to)) {
      const elsewhere = to === 'watching' ? ' Closing the case does that.' : to === 'recovered' || to === 'lost' ? ' The recovery report does that.' : '';
      throw conflict('illegal_transition', `A case that is “${label(from)}” cannot be moved to “${label(to)}” here.${elsewhere}`);
    }
    // Someone who opened the case acts on it as its grower, whatever else they are.
    const role: Role = row.growerId === user.id ? 'grower' : user.role;
    if (!canMove(from, to, role)) throw forbidden(`Your role cannot move a case from “${label(from)}” to “${label(to)}”.`);
    if (role === 'mentor' && row.mentorId !== null && row.mentorId !== user.id) {
      throw forbidden('Another mentor holds this case; ask them or a steward to move it.');
    }
    const takes = role !== 'grower' && row.mentorId === null && to !== 'withdrawn';
    await getSequelize().query(
      `UPDATE cases SET status = :to, updated_at = now(),
              mentor_id = CASE WHEN :takes THEN :userId ELSE mentor_id END,
              claimed_at = CASE WHEN :takes THEN now() ELSE claimed_at END,
              closed_at = CASE WHEN :to = 'withdrawn' THEN now() ELSE closed_at END
        WHERE id = :caseId`,
      { replacements: { to, takes, userId: user.id, caseId }, transaction: t },
    );
    if (to === 'over_to_grower' || to === 'withdrawn') await setWaiting(caseId, 'stop', t);
    else if (from === 'over_to_grower') await setWaiting(caseId, 'restart', t);
    return movedLine(user.displayName, from, to, takes);
  });
}

/** Runs one workflow step on the locked case; `step` returns the system line, or null for "no change". */
async function change(user: Express.User, caseId: number, step: (row: ThreadCase, t: Transaction) => Promise<string | null>): Promise<WorkflowResult> {
  await readableCaseOr404(user, caseId);
  const sequelize = getSequelize();
  return sequelize.transaction(async (t) => {
    const row = await repo.lockCase(caseId, t);
    if (!row) throw notFound('That case');
    const line = await step(row, t);
    if (line === null) return { state: await stateOf(caseId, t), systemMessage: null, change: null };
    const messageId = await writeSystemLine(caseId, user.id, line, t);
    const state = await stateOf(caseId, t);
    const systemMessage = await repo.findById(messageId, t);
    return {
      state,
      systemMessage,
      change: {
        caseId,
        growerId: row.growerId,
        mentorId: state.mentorId,
        messages: systemMessage ? [systemMessage] : [],
        caseUpdate: { caseId, status: state.status, mentorId: state.mentorId, urgency: state.urgency, urgencyLevel: state.urgencyLevel },
      },
    };
  });
}

async function assign(row: ThreadCase, mentorId: number, t: Transaction): Promise<void> {
  await getSequelize().query(
    `UPDATE cases SET mentor_id = :mentorId, claimed_at = now(), updated_at = now(),
            status = CASE WHEN status = 'awaiting_mentor' THEN 'in_conversation' ELSE status END
      WHERE id = :caseId`,
    { replacements: { mentorId, caseId: row.id }, transaction: t },
  );
}

async function displayNameOf(userId: number, t: Transaction): Promise<string | null> {
  const [row] = await getSequelize().query<{ displayName: string }>(`SELECT display_name AS "displayName" FROM users WHERE id = :userId`, {
    replacements: { userId },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  return row?.displayName ?? null;
}

export async function stateOf(caseId: number, transaction?: Transaction): Promise<CaseWorkflowState> {
  const [row] = await getSequelize().query<{
    id: number;
    status: CaseStatus;
    mentorId: number | null;
    mentorName: string | null;
    urgency: number;
    waitingSince: Date | null;
    claimedAt: Date | null;
    firstReplyAt: Date | null;
    closedAt: Date | null;
    updatedAt: Date;
    now: Date;
  }>(
    `SELECT c.id, c.status, c.mentor_id AS "mentorId", u.display_name AS "mentorName", c.urgency, c.waiting_since AS "waitingSince",
            c.claimed_at AS "claimedAt", c.first_reply_at AS "firstReplyAt", c.closed_at AS "closedAt", c.updated_at AS "updatedAt", now() AS now
       FROM cases c LEFT JOIN users u ON u.id = c.mentor_id WHERE c.id = :caseId`,
    { replacements: { caseId }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw notFound('That case');
  const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);
  return {
    id: row.id,
    status: row.status,
    mentorId: row.mentorId,
    mentor: row.mentorId != null ? { id: row.mentorId, displayName: row.mentorName ?? '' } : null,
    ...urgencyAt(row.urgency, row.waitingSince, row.status, new Date(row.now)),
    waitingSince: iso(row.waitingSince),
    claimedAt: iso(row.claimedAt),
    firstReplyAt: iso(row.firstReplyAt),
    closedAt: iso(row.closedAt),
    updatedAt: new Date(row.updatedAt).toISOString(),
  };
}
