// Reporting and hiding messages. A hidden message keeps its text in the database and in the
// audit row (the record of what was said and who hid it); every serializer sends the
// placeholder instead, and open threads are told to drop the text at once.
import type { HiddenMessage, ReportReceipt, ShownMessage } from '../../../shared/steward-schemas';
import type { AppContext } from '../../context';
import { getSequelize } from '../../db/sequelize';
import { AppError, conflict, notFound } from '../../lib/errors';
import { log } from '../../lib/logger';
import { audit } from '../audit/audit';
import { canReadCase, findCaseForAccess, seesAsides } from '../cases/case-access';
import { messagesRepository } from '../threads/messages.repository';
import { announceMessageHidden, announceMessageShown } from '../threads/thread-events';
import { moderationRepository } from './moderation.repository';

/** Anyone who can see the message in its thread may report it; anyone else gets a 404. */
export async function reportMessage(user: Express.User, messageId: number, reason: string): Promise<ReportReceipt> {
  const message = await moderationRepository.findMessage(messageId);
  const caseRow = message ? await findCaseForAccess(message.caseId) : null;
  if (!message || !caseRow) throw notFound('That message');
  if (!canReadCase(user, caseRow) || (message.kind === 'aside' && !seesAsides(user))) {
    // A message that exists, asked for by someone it is hidden from: probing, worth a record.
    log.security('message.access_refused', { userId: user.id, messageId, caseId: message.caseId });
    throw notFound('That message');
  }
  if (message.kind === 'system') throw new AppError(400, 'cannot_report', 'Status lines are written by Sporewell and cannot be reported.');
  if (message.hidden) throw conflict('already_hidden', 'A steward has already hidden this message.');

  const existing = await moderationRepository.findOpenReportBy(messageId, user.id);
  if (existing !== null) {
    const report = (await moderationRepository.findReport(existing))!;
    return { id: report.id, messageId, reason: report.reason, status: 'open', createdAt: report.createdAt, alreadyReported: true };
  }
  const id = await getSequelize().transaction(async (transaction) => {
    const created = await moderationRepository.insertReport({ messageId, reporterId: user.id, reason }, transaction);
    await audit(user.id, 'message.reported', { type: 'message', id: messageId }, { caseId: message.caseId, reportId: created, reason }, transaction);
    return created;
  });
  log.info('moderation.reported', { reporterId: user.id, messageId, reportId: id });
  const report = (await moderationRepository.findReport(id))!;
  return { id, messageId, reason, status: 'open', createdAt: report.createdAt, alreadyReported: false };
}

export async function hideMessage(_ctx: AppContext, steward: Express.User, messageId: number, note: string): Promise<HiddenMessage> {
  const outcome = await getSequelize().transaction(async (transaction) => {
    const message = await moderationRepository.findMessage(messageId, { lock: true, transaction });
    if (!message) throw notFound('That message');
    if (message.kind === 'system') throw new AppError(400, 'cannot_hide', 'Status lines are written by Sporewell and cannot be hidden.');
    if (message.hidden) throw conflict('already_hidden', 'This message is already hidden.');
    const hiddenAt = await moderationRepository.hideMessage(messageId, steward.id, transaction);
    const reportIds = await moderationRepository.closeOpenReports(messageId, 'hidden', steward.id, transaction);
    // The audit row is the system of record for the hidden text.
    await audit(
      steward.id,
      'message.hidden',
      { type: 'message', id: messageId },
      { caseId: message.caseId, authorId: message.authorId, body: message.body, reportIds, note },
      transaction,
    );
    return { caseId: message.caseId, hiddenAt, reportIds };
  });
  log.security('steward.message_hidden', { actorId: steward.id, messageId, caseId: outcome.caseId, reports: outcome.reportIds.length });
  announceMessageHidden(outcome.caseId, messageId);
  return { id: messageId, caseId: outcome.caseId, hidden: true, hiddenAt: new Date(outcome.hiddenAt).toISOString(), reportsClosed: outcome.reportIds.length };
}

/**
 * A steward puts back a message that was hidden (by mistake, or after a second look). Its reports
 * stay settled as they were; the audit log keeps both steps, and open threads get the text back.
 */
export async function showMessageAgain(steward: Express.User, messageId: number, note: string): Promise<ShownMessage> {
  const caseId = await getSequelize().transaction(async (transaction) => {
    const message = await moderationRepository.findMessage(messageId, { lock: true, transaction });
    if (!message) throw notFound('That message');
    if (!message.hidden) throw conflict('not_hidden', 'This message is not hidden.');
    await moderationRepository.showMessage(messageId, transaction);
    await audit(steward.id, 'message.shown_again', { type: 'message', id: messageId }, { caseId: message.caseId, authorId: message.authorId, note }, transaction);
    return message.caseId;
  });
  log.security('steward.message_shown_again', { actorId: steward.id, messageId, caseId });
  const message = await messagesRepository.findById(messageId);
  if (message) announceMessageShown(caseId, message);
  return { id: messageId, caseId, hidden: false };
}

export async function dismissReport(steward: Express.User, reportId: number, note: string) {
  await getSequelize().transaction(async (transaction) => {
    const report = await moderationRepository.findReport(reportId, { lock: true, transaction });
    if (!report) throw notFound('That report');
    if (report.status !== 'open') throw conflict('already_decided', `This report was already ${report.status === 'hidden' ? 'settled by hiding the message' : 'dismissed'}.`);
    await moderationRepository.dismissReport(reportId, steward.id, transaction);
    await audit(steward.id, 'report.dismissed', { type: 'report', id: reportId }, { messageId: report.message.id, caseId: report.message.caseId, note }, transaction);
  });
  log.security('steward.report_dismissed', { actorId: steward.id, reportId });
  return (await moderationRepository.findReport(reportId))!;
}
