// The thread's rules, shared by the HTTP routes and the socket handlers. A post is stored in
// one transaction (case row locked → duplicate check → next seq → insert → case fields, status,
// urgency, mail); only then does the caller acknowledge and publish it. Most posts take the
// group-commit path of message-writer.ts (the same checks in one statement shared with the
// posts arriving meanwhile); the rarer ones that change the case's status, queue a reply
// mail or attach photos take the transaction below.
import { QueryTypes, type Transaction } from 'sequelize';
import type { ThreadMessage } from '../../../shared/socket-events';
import { CATCH_UP_MAX } from '../../../shared/socket-events';
import { ACCOUNT_PATH, conversationPath } from '../../../shared/case-links';
import type { AppContext } from '../../context';
import { getSequelize } from '../../db/sequelize';
import { AppError, conflict, forbidden, notFound, unauthorized } from '../../lib/errors';
import { log } from '../../lib/logger';
import { readableCaseOr404, seesAsides, type CaseAccessRow } from '../cases/case-access';
import { enqueueMail } from '../mail/outbox';
import { REPLY_MAIL_WINDOW_MINUTES } from '../../../shared/urgency';
import { messagesRepository as repo, type ThreadCase } from './messages.repository';
import { writeMessage } from './message-writer';
import { isViewingCase, type ThreadChange } from './thread-events';
import { setWaiting, urgencyNow } from './urgency-recompute';

/** A thread whose case ended takes no more text; mentors may still note asides on it. */
const CLOSED_THREAD = new Set(['recovered', 'lost', 'withdrawn']);
export const FIRST_LOOK_COUNT = 100;
const PREVIEW_CHARS = 140;

/** Asides are for mentors and stewards, and never on a case they opened themselves as its grower. */
export function seesAsidesOn(user: Pick<Express.User, 'id' | 'role'>, row: Pick<CaseAccessRow, 'growerId'>): boolean {
  return seesAsides(user) && row.growerId !== user.id;
}

export interface MessagePage {
  items: ThreadMessage[];
  hasMore: boolean;
}

/** Messages after `afterSeq` (all of them, CATCH_UP_MAX at a time), or the latest ones when absent. */
export async function listMessages(user: Express.User, caseId: number, options: { afterSeq?: number; latest?: number }): Promise<MessagePage> {
  const access = await readableCaseOr404(user, caseId);
  const includeAsides = seesAsidesOn(user, access);
  const page =
    options.afterSeq === undefined && options.latest
      ? await repo.listLatest(caseId, { includeAsides, limit: options.latest })
      : await repo.listAfter(caseId, { afterSeq: options.afterSeq ?? 0, includeAsides, limit: CATCH_UP_MAX });
  const last = page.items.at(-1);
  if (last) await repo.markRead(caseId, user.id, last.seq);
  return page;
}

export interface PostInput {
  clientId: string;
  body: string;
  kind: 'text' | 'aside';
  photoIds?: number[];
}

export interface PostResult {
  message: ThreadMessage;
  duplicate: boolean;
  /** what to publish live; null for a duplicate, which was published the first time */
  change: ThreadChange | null;
}

const ASIDE_REFUSED = 'Only mentors and stewards can write a mentor aside.';
const CLIENT_ID_TAKEN = 'That message id is already used in this case. Send it with a new one.';
const THREAD_CLOSED = 'This case has ended, so its thread takes no new messages.';

/**
 * `via.sid`: the post comes from a socket of this session, which is checked again as the post
 * is stored (a signed-out or disabled person's event is refused with 401 `unauthorized`).
 */
export async function postMessage(ctx: AppContext, user: Express.User, caseId: number, input: PostInput, via: { sid?: string } = {}): Promise<PostResult> {
  if (!input.photoIds?.length) {
    const written = await writeMessage({
      databaseUrl: ctx.config.DATABASE_URL,
      caseId,
      author: { id: user.id, role: user.role },
      sid: via.sid ?? null,
      startedAfterMs: via.sid ? Date.now() - ctx.config.SESSION_ABSOLUTE_HOURS * 3_600_000 : null,
      kind: input.kind,
      body: input.body,
      clientId: input.clientId,
      preview: previewOf(input.body),
    });
    switch (written.outcome) {
      case 'stored':
        return {
          message: written.message,
          duplicate: false,
          change: { caseId, growerId: written.growerId, mentorId: written.mentorId, messages: [written.message], viewing: written.viewing },
        };
      case 'duplicate':
        return { message: written.message, duplicate: true, change: null };
      case 'unauthorized':
        throw unauthorized('Sign in again.');
      case 'refused':
        // As readableCaseOr404 does: the same 404 as for a missing case, logged as refused access.
        log.security('case.access_refused', { userId: user.id, caseId });
        throw notFound('That case');
      case 'not_found':
        throw notFound('That case');
      case 'forbidden':
        throw forbidden(ASIDE_REFUSED);
      case 'taken':
        throw conflict('client_id_taken', CLIENT_ID_TAKEN);
      case 'closed':
        throw conflict('thread_closed', THREAD_CLOSED);
      case 'slow':
        break;
    }
  }
  const access = await readableCaseOr404(user, caseId);
  const staff = seesAsidesOn(user, access);
  if (input.kind === 'aside' && !staff) throw forbidden(ASIDE_REFUSED);
  const mentorReply = staff && input.kind === 'text';
  // Asked before the transaction: presence is in memory (or the adapter), not in the database.
  const growerAway = mentorReply && !(await isViewingCase(caseId, access.growerId));
  const sequelize = getSequelize();
  let mailQueued = false;

  const outcome = await sequelize.transaction(async (transaction) => {
    const row = await repo.lockCase(caseId, transaction);
    if (!row) throw notFound('That case');
    const existing = await repo.findByClientId(caseId, input.clientId, transaction);
    if (existing) {
      // Someone else's id must not hand back their message (it could be an aside).
      if (existing.authorId !== user.id) throw conflict('client_id_taken', CLIENT_ID_TAKEN);
      const { authorId: _authorId, ...message } = existing;
      return { duplicate: true as const, message };
    }
    if (input.kind === 'text' && CLOSED_THREAD.has(row.status)) {
      throw conflict('thread_closed', THREAD_CLOSED);
    }

    const ids: number[] = [];
    const messageId = await repo.insert({ caseId, authorId: user.id, kind: input.kind, body: input.body, clientId: input.clientId }, transaction);
    ids.push(messageId);
    const photoIds = [...new Set(input.photoIds ?? [])];
    if (photoIds.length && (await repo.attachPhotos(messageId, caseId, user.id, photoIds, transaction)) !== photoIds.length) {
      throw new AppError(400, 'invalid_input', 'Some of those photos cannot be attached.', {
        photoIds: 'Attach only photos you uploaded to this case that are not in the thread yet.',
      });
    }

    let status = row.status;
    if (input.kind === 'text') {
      await sequelize.query(
        `UPDATE cases SET last_message_at = now(), last_message_preview = :preview, updated_at = now(),
                first_reply_at = CASE WHEN :mentorReply AND first_reply_at IS NULL THEN now() ELSE first_reply_at END
          WHERE id = :caseId`,
        { replacements: { caseId, preview: previewOf(input.body), mentorReply }, transaction },
      );
      if (user.id === row.growerId && row.status === 'over_to_grower') {
        status = 'in_conversation';
        await sequelize.query(`UPDATE cases SET status = 'in_conversation' WHERE id = :caseId`, { replacements: { caseId }, transaction });
        ids.push(await writeSystemLine(caseId, user.id, `${user.displayName} replied, so the case is back in conversation.`, transaction));
        await setWaiting(caseId, 'restart', transaction);
      } else {
        await setWaiting(caseId, mentorReply ? 'stop' : 'start', transaction);
      }
    }
    const urgency = (await urgencyNow(caseId, transaction))!;
    if (growerAway) mailQueued = await queueReplyMail(ctx, row, user, transaction);

    const messages = await Promise.all(ids.map((id) => repo.findById(id, transaction)));
    const stored = messages.filter((m): m is ThreadMessage => m !== null);
    await repo.markRead(caseId, user.id, stored.at(-1)!.seq, transaction);
    const change: ThreadChange = {
      caseId,
      growerId: row.growerId,
      mentorId: row.mentorId,
      messages: stored,
      ...(status !== row.status ? { caseUpdate: { caseId, status, mentorId: row.mentorId, ...urgency } } : {}),
    };
    return { duplicate: false as const, message: stored[0], change };
  });

  if (mailQueued) ctx.pokeMail();
  return outcome.duplicate ? { message: outcome.message, duplicate: true, change: null } : { message: outcome.message, duplicate: false, change: outcome.change };
}

/** A system line: who did what; created_at says when. Call with the case locked. */
export async function writeSystemLine(caseId: number, actorId: number | null, body: string, transaction: Transaction): Promise<number> {
  return repo.insert({ caseId, authorId: actorId, kind: 'system', body, clientId: null }, transaction);
}

/** A post on one line, cut to `chars` with an ellipsis: the rounds' last-message line, a mail's quote. */
export function previewOf(body: string, chars = PREVIEW_CHARS): string {
  const flat = body.replace(/\s+/g, ' ').trim();
  return flat.length > chars ? `${flat.slice(0, chars - 1)}…` : flat;
}

/**
 * One mail to the grower per case per 10 minutes at most: a mail queued for the case within
 * the window holds the next back (the case row is locked, so two replies cannot both pass),
 * and the slot in the dedupe key is a second guard should two processes race on the outbox.
 */
async function queueReplyMail(ctx: AppContext, row: ThreadCase, mentor: Express.User, transaction: Transaction): Promise<boolean> {
  const sequelize = getSequelize();
  const recent = await sequelize.query(
    `SELECT 1 FROM outbox_mail WHERE kind = 'mentor_reply' AND dedupe_key LIKE :prefix
        AND created_at > now() - make_interval(mins => :minutes) LIMIT 1`,
    { replacements: { prefix: `reply:${row.id}:%`, minutes: REPLY_MAIL_WINDOW_MINUTES }, type: QueryTypes.SELECT, transaction },
  );
  if (recent.length) return false;
  const [grower] = await sequelize.query<{ email: string; displayName: string }>(
    `SELECT email, display_name AS "displayName" FROM users WHERE id = :id AND NOT disabled AND notify_mentor_replied`,
    { replacements: { id: row.growerId }, type: QueryTypes.SELECT, transaction },
  );
  if (!grower) return false;
  const slot = Math.floor(Date.now() / (REPLY_MAIL_WINDOW_MINUTES * 60_000));
  return enqueueMail(
    {
      to: grower.email,
      subject: `${mentor.displayName} replied about “${row.title}”`,
      text: [
        `Hello ${grower.displayName},`,
        '',
        `${mentor.displayName} replied on your Sporewell case “${row.title}”. Read the thread and answer here:`,
        `${ctx.config.publicUrl}${conversationPath(row.id)}`,
        '',
        `Sporewell sends at most one of these e-mails per case every ${REPLY_MAIL_WINDOW_MINUTES} minutes, and none while you have the case open.`,
        `To stop them, untick “E-mail me when a mentor replies” on your account page: ${ctx.config.publicUrl}${ACCOUNT_PATH}`,
        'Advice on Sporewell comes from community members, not from licensed professionals.',
      ].join('\n'),
      kind: 'mentor_reply',
      dedupeKey: `reply:${row.id}:${slot}`,
    },
    transaction,
  );
}
