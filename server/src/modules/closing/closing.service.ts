// Closing a case, the recovery report, consent to publish, and the steward's "close as lost".
//
// Rules (PRODUCT.md screens 6–7, and these decisions):
// - Closing: the mentor who holds the case, or a steward, from "In conversation" or "Over to the
//   grower". Not from "Awaiting a mentor": nobody has advised yet, so there is no cause or remedy
//   to record; a steward claims or moves the case first. Never the case's own grower.
//   → "Watching", check-ins scheduled (1, 3, 7 days by default), a system line, and an e-mail to
//   the grower with the link to the recovery report.
// - Recovery report: the case's grower only, once, while the case is watching. recovered and
//   partly → "Recovered", lost → "Lost". With consent the field note is published in the same
//   transaction. The mentor's "ask to publish" only decides whether the form asks; the grower's
//   answer is what counts.
// - Consent can be changed later by the grower on a resolved case: false takes the note down,
//   true publishes it. A mentor or steward may re-publish (e.g. with more words left out), but
//   never without the grower's consent (409).
// - A steward may take a published field note out of the Field Library, saying why (a system
//   line and the audit log keep the reason). It stays out, whatever the mentor re-publishes or the
//   grower consents to again, until a steward publishes it again, which lifts the hold. The grower
//   is mailed when it is taken out (with the reason) and when it is put back.
// - Close as lost: a steward, on a case watching for at least LOST_AFTER_DAYS since closing with
//   no report. It records no outcome, so it counts in no track record, and it is not published.
// Every change is one transaction (case row locked first), with its system line; the live update
// is sent only after commit.
import type { Transaction } from 'sequelize';
import { STATUS_LABELS, isStaffRole } from '../../../shared/case-status';
import {
  LOST_AFTER_DAYS,
  type ClosingState,
  type CloseCaseValues,
  type ConsentInput,
  type RecoveryReportValues,
} from '../../../shared/closing-schemas';
import type { ThreadMessage } from '../../../shared/socket-events';
import type { AppContext } from '../../context';
import { getSequelize } from '../../db/sequelize';
import { AppError, conflict, forbidden, notFound } from '../../lib/errors';
import { audit } from '../audit/audit';
import { readableCaseOr404 } from '../cases/case-access';
import { indexResolvedCase } from '../cases/search-index';
import { publishFieldNote, unpublishFieldNote } from '../library/field-notes';
import { invalidateRemedyRecords } from '../library/library.service';
import { messagesRepository } from '../threads/messages.repository';
import { writeSystemLine } from '../threads/messages.service';
import { closedLine, recoveryReportLine } from '../threads/system-lines';
import { publishChange, type ThreadChange } from '../threads/thread-events';
import { setWaiting, urgencyNow } from '../threads/urgency-recompute';
import { queueClosedMail, queueLibraryHoldMail } from './closing-mail';
import { closingRepository as repo, type ClosingRow } from './closing.repository';

const CLOSABLE = new Set(['in_conversation', 'over_to_grower']);
const RESOLVED = new Set(['recovered', 'lost']);
const DAY_MS = 86_400_000;

const holdsOrStewards = (user: Express.User, row: ClosingRow) => user.role === 'steward' || (user.role === 'mentor' && row.mentorId === user.id);

function lostAllowedFrom(row: ClosingRow): Date | null {
  return row.status === 'watching' && row.closedAt ? new Date(new Date(row.closedAt).getTime() + LOST_AFTER_DAYS * DAY_MS) : null;
}

function closingStateOf(user: Express.User, row: ClosingRow, checkIns: ClosingState['checkIns']): ClosingState {
  const isGrower = row.growerId === user.id;
  const lostFrom = lostAllowedFrom(row);
  const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);
  return {
    caseId: row.id,
    title: row.title,
    status: row.status,
    stage: row.stage,
    grower: { id: row.growerId, displayName: row.growerName },
    mentor: row.mentorId != null ? { id: row.mentorId, displayName: row.mentorName ?? '' } : null,
    closedAt: iso(row.closedAt),
    closedBy: row.closedBy != null ? { id: row.closedBy, displayName: row.closedByName ?? '' } : null,
    cause: row.cause,
    causeNotes: row.causeNotes,
    remedy: row.remedy,
    remedyNotes: row.remedyNotes,
    summary: row.summary,
    askToPublish: row.askToPublish,
    checkIns,
    outcome: row.outcome,
    stars: row.stars,
    recoveryComment: row.recoveryComment,
    resolvedAt: iso(row.resolvedAt),
    consentToPublish: row.consentToPublish,
    consentPhotos: row.consentPhotos,
    published: row.published && row.noteSlug !== null,
    noteSlug: row.noteSlug,
    ...(isStaffRole(user.role) && !isGrower ? { redactTerms: row.redactTerms } : {}),
    libraryHold:
      row.libraryHoldReason !== null && row.libraryHoldAt !== null
        ? {
            by: row.libraryHoldBy != null ? { id: row.libraryHoldBy, displayName: row.libraryHoldByName ?? '' } : null,
            at: new Date(row.libraryHoldAt).toISOString(),
            reason: row.libraryHoldReason,
          }
        : null,
    can: {
      close: !isGrower && holdsOrStewards(user, row) && CLOSABLE.has(row.status),
      fileReport: isGrower && row.status === 'watching',
      changeConsent: isGrower && RESOLVED.has(row.status) && row.outcome !== null,
      publish:
        !isGrower &&
        holdsOrStewards(user, row) &&
        (row.libraryHoldReason === null || user.role === 'steward') &&
        RESOLVED.has(row.status) &&
        row.outcome !== null &&
        row.consentToPublish,
      takeDown: user.role === 'steward' && !isGrower && row.published && row.noteSlug !== null,
      closeAsLost: user.role === 'steward' && !isGrower && lostFrom !== null && lostFrom.getTime() <= Date.now(),
    },
    lostAllowedFrom: iso(lostFrom),
  };
}

export async function getClosingState(user: Express.User, caseId: number): Promise<ClosingState> {
  await readableCaseOr404(user, caseId);
  const row = await repo.find(caseId);
  if (!row) throw notFound('That case');
  return closingStateOf(user, row, await repo.checkIns(caseId));
}

interface Step {
  line: string | null;
  photoIds?: number[];
  after?: () => void;
}

/**
 * Runs one closing step on the locked case: `step` checks the rules and writes, and returns the
 * system line. The line, the urgency and the state are written in the same transaction; the live
 * update goes out after commit.
 */
async function run(ctx: AppContext, user: Express.User, caseId: number, step: (row: ClosingRow, t: Transaction) => Promise<Step>): Promise<ClosingState> {
  await readableCaseOr404(user, caseId);
  const sequelize = getSequelize();
  const { state, change, after } = await sequelize.transaction(async (t) => {
    const row = await repo.find(caseId, t, true);
    if (!row) throw notFound('That case');
    const { line, photoIds, after } = await step(row, t);
    let message: ThreadMessage | null = null;
    if (line) {
      const messageId = await writeSystemLine(caseId, user.id, line, t);
      if (photoIds?.length) await messagesRepository.attachPhotos(messageId, caseId, user.id, photoIds, t);
      message = await messagesRepository.findById(messageId, t);
    }
    // Watching, recovered and lost cases wait on no one's reply.
    await setWaiting(caseId, 'stop', t);
    const urgency = await urgencyNow(caseId, t);
    const updated = (await repo.find(caseId, t))!;
    const change: ThreadChange | null = message
      ? {
          caseId,
          growerId: updated.growerId,
          mentorId: updated.mentorId,
          messages: [message],
          ...(updated.status !== row.status && urgency ? { caseUpdate: { caseId, status: updated.status, mentorId: updated.mentorId, ...urgency } } : {}),
        }
      : null;
    return { state: closingStateOf(user, updated, await repo.checkIns(caseId, t)), change, after };
  });
  after?.();
  if (change) await publishChange(change);
  return state;
}

export async function closeCase(ctx: AppContext, user: Express.User, caseId: number, values: CloseCaseValues): Promise<ClosingState> {
  let mailed = false;
  const state = await run(ctx, user, caseId, async (row, t) => {
    if (row.growerId === user.id) throw forbidden('You cannot close a case you opened yourself.');
    if (!holdsOrStewards(user, row)) throw forbidden('Only the mentor who holds this case, or a steward, can close it.');
    if (!CLOSABLE.has(row.status)) {
      const why =
        row.status === 'awaiting_mentor'
          ? 'No mentor has taken it up yet: claim it and talk it through first.'
          : 'It is already closed or ended.';
      throw conflict('case_not_open', `This case is “${STATUS_LABELS[row.status]}”, so it cannot be closed. ${why}`);
    }
    await repo.close(caseId, user.id, values, t);
    await repo.scheduleCheckIns(caseId, values.checkInDays, t);
    // A disabled account gets no mail.
    if (!row.growerDisabled) {
      mailed = await queueClosedMail(
        {
          publicUrl: ctx.config.publicUrl,
          caseId,
          title: row.title,
          to: row.growerEmail,
          growerName: row.growerName,
          closerName: user.displayName,
          cause: values.cause,
          remedy: values.remedy,
          remedyNotes: values.remedyNotes,
          summary: values.summary,
          checkInDays: values.checkInDays,
        },
        t,
      );
    }
    return { line: closedLine(user.displayName, values) };
  });
  if (mailed) ctx.pokeMail();
  return state;
}

export async function fileRecoveryReport(ctx: AppContext, user: Express.User, caseId: number, report: RecoveryReportValues): Promise<ClosingState> {
  return run(ctx, user, caseId, async (row, t) => {
    if (row.growerId !== user.id) throw forbidden('Only the grower who opened this case can file its recovery report.');
    if (row.outcome !== null || RESOLVED.has(row.status)) throw conflict('already_reported', 'The recovery report for this case is already in.');
    if (row.status !== 'watching') {
      throw conflict('case_not_watching', `This case is “${STATUS_LABELS[row.status]}”: a recovery report comes after a mentor closes it.`);
    }
    const photoIds = await repo.unattachedPhotoIds(caseId, user.id, report.photoIds, t);
    if (photoIds.length !== new Set(report.photoIds).size) {
      throw new AppError(400, 'invalid_input', 'Some of those photos are not yours to add to this report.', { photoIds: 'Upload the photos to this case first.' });
    }
    const status = report.outcome === 'lost' ? 'lost' : 'recovered';
    await repo.fileReport(caseId, report, status, t);
    await repo.dropUnsentCheckIns(caseId, t);
    await indexResolvedCase(caseId, t);
    if (report.consentToPublish) await publishFieldNote(caseId, t);
    return {
      line: recoveryReportLine(user.displayName, report),
      photoIds,
      after: invalidateRemedyRecords,
    };
  });
}

export async function changeConsent(ctx: AppContext, user: Express.User, caseId: number, input: ConsentInput): Promise<ClosingState> {
  return run(ctx, user, caseId, async (row, t) => {
    if (row.growerId !== user.id) throw forbidden('Only the grower who opened this case can change whether it is shared.');
    if (!RESOLVED.has(row.status) || row.outcome === null) {
      throw conflict('not_resolved', 'Sharing is decided with the recovery report; file that first.');
    }
    const consentPhotos = input.consentToPublish ? (input.consentPhotos ?? row.consentPhotos) : false;
    if (input.consentToPublish === row.consentToPublish && consentPhotos === row.consentPhotos && row.published === input.consentToPublish) return { line: null };
    await repo.setConsent(caseId, input.consentToPublish, consentPhotos, t);
    if (input.consentToPublish && row.libraryHoldReason !== null) {
      if (row.consentToPublish) return { line: null };
      return { line: `${user.displayName} agreed to share this case again; a steward took its field note out of the Field Library, so it stays out until a steward puts it back.` };
    }
    if (input.consentToPublish) {
      await publishFieldNote(caseId, t);
      return { line: `${user.displayName} agreed to share this case: it is now an anonymised field note in the Field Library.` };
    }
    const hadNote = await unpublishFieldNote(caseId, t);
    return { line: hadNote ? `${user.displayName} withdrew consent to share this case; its field note was taken out of the Field Library.` : null };
  });
}

export async function republish(ctx: AppContext, user: Express.User, caseId: number, redactTerms: string[] | undefined): Promise<ClosingState> {
  return run(ctx, user, caseId, async (row, t) => {
    if (row.growerId === user.id || !holdsOrStewards(user, row)) throw forbidden('Only the mentor who held this case, or a steward, can publish it.');
    if (!row.consentToPublish) throw conflict('no_consent', 'The grower has not agreed to share this case, so it cannot be published.');
    const held = row.libraryHoldReason !== null;
    if (held && user.role !== 'steward') {
      throw conflict('held_by_steward', `A steward took this field note out of the Field Library (“${row.libraryHoldReason}”); only a steward can put it back.`);
    }
    if (redactTerms) await repo.setRedactTerms(caseId, redactTerms, t);
    const wasPublished = row.published;
    await publishFieldNote(caseId, t);
    if (held) {
      await repo.setLibraryHold(caseId, null, t);
      await audit(user.id, 'field_note.restored', { type: 'case', id: caseId }, { heldFor: row.libraryHoldReason }, t);
      await queueHoldMail(ctx, row, user, { reason: row.libraryHoldReason!, heldAt: row.libraryHoldAt ?? new Date(), change: 'put_back' }, t);
      return { line: `${user.displayName} put the field note of this case back in the Field Library.` };
    }
    return { line: `${user.displayName} ${wasPublished ? 'updated' : 'published'} the field note of this case.` };
  });
}

/** Tells the grower (unless their account is disabled) that a steward took their note out or put it back. */
async function queueHoldMail(
  ctx: AppContext,
  row: ClosingRow,
  steward: Express.User,
  hold: { reason: string; heldAt: Date; change: 'taken_out' | 'put_back' },
  t: Transaction,
): Promise<void> {
  if (row.growerDisabled) return;
  const queued = await queueLibraryHoldMail(
    { publicUrl: ctx.config.publicUrl, caseId: row.id, title: row.title, to: row.growerEmail, growerName: row.growerName, stewardName: steward.displayName, ...hold },
    t,
  );
  // Sent once the change is committed: the outbox worker reads only committed rows.
  if (queued) t.afterCommit(() => ctx.pokeMail());
}

/** A steward takes a case's published field note out of the Field Library, saying why; the grower is mailed. */
export async function takeOutOfLibrary(ctx: AppContext, user: Express.User, caseId: number, reason: string): Promise<ClosingState> {
  return run(ctx, user, caseId, async (row, t) => {
    if (user.role !== 'steward') throw forbidden('Only a steward can take a field note out of the Field Library.');
    if (!row.published || row.noteSlug === null) throw conflict('not_published', 'This case has no field note in the Field Library.');
    const slug = row.noteSlug;
    await unpublishFieldNote(caseId, t);
    await repo.setLibraryHold(caseId, { stewardId: user.id, reason }, t);
    await audit(user.id, 'field_note.taken_down', { type: 'case', id: caseId }, { slug, reason }, t);
    await queueHoldMail(ctx, row, user, { reason, heldAt: new Date(), change: 'taken_out' }, t);
    return { line: `${user.displayName} took the field note of this case out of the Field Library: “${reason}”` };
  });
}

export async function closeAsLost(ctx: AppContext, user: Express.User, caseId: number): Promise<ClosingState> {
  return run(ctx, user, caseId, async (row, t) => {
    if (user.role !== 'steward' || row.growerId === user.id) throw forbidden('Only a steward can close a case as lost.');
    const from = lostAllowedFrom(row);
    if (!from) throw conflict('case_not_watching', `This case is “${STATUS_LABELS[row.status]}”: only a case waiting for its recovery report can be closed as lost.`);
    if (from.getTime() > Date.now()) {
      throw conflict('too_early', `The grower has until ${from.toISOString().slice(0, 10)} to report (${LOST_AFTER_DAYS} days after closing).`);
    }
    await repo.markLost(caseId, t);
    await repo.dropUnsentCheckIns(caseId, t);
    await indexResolvedCase(caseId, t);
    return {
      line: `${user.displayName} closed the case as lost: no recovery report came in ${LOST_AFTER_DAYS} days after closing. It counts in no track record, since the outcome is unknown.`,
    };
  });
}
