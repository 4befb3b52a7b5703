// A mentor who holds a case is e-mailed when the grower writes on it and the post stays unread
// for GROWER_WROTE_MAIL_MINUTES: they may be away from the site, and the grower is waiting. A
// small timer looks once a minute. The mail names the first post they have not read; its dedupe
// key (case, mentor, that post's seq) makes it one mail until they read the case, however often
// the watcher runs and however many processes run it. Only posts written after the mentor took
// the case count (a case claimed from the rounds was read before it was claimed), never hidden
// ones, and nothing goes to a disabled account or to a mentor who turned these mails off.
import { QueryTypes } from 'sequelize';
import { conversationPath, MENTOR_MAIL_SETTINGS_PATH } from '../../../shared/case-links';
import { GROWER_WROTE_MAIL_MINUTES } from '../../../shared/urgency';
import type { AppContext } from '../../context';
import { getSequelize } from '../../db/sequelize';
import { enqueueMail } from '../mail/outbox';
import { previewOf } from './messages.service';

/** How much of the grower's post the mail quotes. */
const QUOTE_CHARS = 280;

/** The outbox dedupe key; the query below builds the same one to skip what was already mailed. */
const growerWroteKey = (caseId: number, mentorId: number, seq: number) => `grower-wrote:${caseId}:${mentorId}:${seq}`;

interface Due {
  caseId: number;
  title: string;
  mentorId: number;
  mentorEmail: string;
  mentorName: string;
  growerName: string;
  seq: number;
  body: string;
  unread: number;
}

/** One pass: returns how many mails were queued. */
export async function runGrowerWroteCheck(ctx: AppContext): Promise<number> {
  const sequelize = getSequelize();
  const due = await sequelize.query<Due>(
    `SELECT c.id AS "caseId", c.title, c.mentor_id AS "mentorId", mu.email AS "mentorEmail", mu.display_name AS "mentorName",
            gu.display_name AS "growerName", f.seq, f.body, f.unread
       FROM cases c
       JOIN users mu ON mu.id = c.mentor_id
       JOIN users gu ON gu.id = c.grower_id
       LEFT JOIN case_reads r ON r.case_id = c.id AND r.user_id = c.mentor_id
       JOIN LATERAL (
         SELECT (array_agg(m.seq ORDER BY m.seq))[1] AS seq, (array_agg(m.body ORDER BY m.seq))[1] AS body,
                min(m.created_at) AS first_at, count(*)::int AS unread
           FROM messages m
          WHERE m.case_id = c.id AND m.seq > COALESCE(r.last_seq, 0) AND m.author_id = c.grower_id
            AND m.kind = 'text' AND NOT m.hidden AND m.created_at > c.claimed_at
       ) f ON f.seq IS NOT NULL
      WHERE c.mentor_id IS NOT NULL AND c.mentor_id <> c.grower_id
        AND c.status IN ('in_conversation', 'over_to_grower', 'watching', 'awaiting_mentor')
        AND mu.notify_grower_wrote AND NOT mu.disabled AND mu.role IN ('mentor', 'steward')
        AND f.first_at < now() - make_interval(mins => :minutes)
        AND NOT EXISTS (SELECT 1 FROM outbox_mail o WHERE o.dedupe_key = 'grower-wrote:' || c.id || ':' || c.mentor_id || ':' || f.seq)
      ORDER BY f.first_at`,
    { replacements: { minutes: GROWER_WROTE_MAIL_MINUTES }, type: QueryTypes.SELECT },
  );
  let queued = 0;
  for (const item of due) {
    const quote = previewOf(item.body, QUOTE_CHARS);
    const more = item.unread > 1 ? `\n(and ${item.unread - 1} more ${item.unread === 2 ? 'post' : 'posts'} since)` : '';
    const added = await enqueueMail({
      to: item.mentorEmail,
      subject: `${item.growerName} wrote on “${item.title}”`,
      text: [
        `Hello ${item.mentorName},`,
        '',
        `${item.growerName} wrote on a case you hold, “${item.title}”, and it has waited more than ${GROWER_WROTE_MAIL_MINUTES} minutes unread:`,
        '',
        `“${quote}”${more}`,
        '',
        'Read it and answer here:',
        `${ctx.config.publicUrl}${conversationPath(item.caseId)}`,
        '',
        'Sporewell sends one of these e-mails a case until you have read the case again. To stop them, untick “E-mail me when a grower writes” at the foot of the rounds:',
        `${ctx.config.publicUrl}${MENTOR_MAIL_SETTINGS_PATH}`,
      ].join('\n'),
      kind: 'grower_wrote',
      dedupeKey: growerWroteKey(item.caseId, item.mentorId, item.seq),
    });
    if (added) queued += 1;
  }
  if (queued) ctx.pokeMail();
  return queued;
}
