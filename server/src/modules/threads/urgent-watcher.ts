// Mentors who asked for it (users.notify_urgent) get one e-mail when a high-urgency case has
// waited more than an hour with nobody holding it. A small timer looks once a minute
// (mail-watcher.ts), scoring each waiting case as the rounds table does (the hours waiting climb
// on their own), and mails each such case once. cases.notify_urgent_sent_at is set in the mail's transaction by a conditional
// UPDATE, so several processes running the watcher still send each case once.
import { QueryTypes } from 'sequelize';
import { casePath, MENTOR_MAIL_SETTINGS_PATH } from '../../../shared/case-links';
import { URGENT_WAIT_MINUTES } from '../../../shared/urgency';
import type { AppContext } from '../../context';
import { getSequelize } from '../../db/sequelize';
import { enqueueMail } from '../mail/outbox';
import { urgencyAt } from './urgency-recompute';

/** One pass: returns how many mails were queued. */
export async function runUrgentCaseCheck(ctx: AppContext): Promise<number> {
  const sequelize = getSequelize();
  // Few cases wait unclaimed for an hour; their urgency is worked out here the way the rounds table shows it.
  const waiting = await sequelize.query<{ id: number; title: string; stage: string; urgency: number; waitingSince: Date | null; status: string; growerId: number; now: Date }>(
    `SELECT id, title, stage, urgency, waiting_since AS "waitingSince", status, grower_id AS "growerId", now() AS now FROM cases
      WHERE status = 'awaiting_mentor' AND mentor_id IS NULL AND notify_urgent_sent_at IS NULL
        AND opened_at < now() - make_interval(mins => :minutes)
      ORDER BY opened_at`,
    { replacements: { minutes: URGENT_WAIT_MINUTES }, type: QueryTypes.SELECT },
  );
  const due = waiting
    .map((c) => ({ ...c, ...urgencyAt(c.urgency, c.waitingSince, c.status, new Date(c.now)) }))
    .filter((c) => c.urgencyLevel === 'high');
  let queued = 0;
  for (const item of due) {
    queued += await sequelize.transaction(async (transaction) => {
      const taken = await sequelize.query(`UPDATE cases SET notify_urgent_sent_at = now() WHERE id = :id AND notify_urgent_sent_at IS NULL RETURNING id`, {
        replacements: { id: item.id },
        type: QueryTypes.SELECT,
        transaction,
      });
      if (!taken.length) return 0;
      const mentors = await sequelize.query<{ id: number; email: string; displayName: string }>(
        `SELECT id, email, display_name AS "displayName" FROM users
          WHERE notify_urgent AND NOT disabled AND role IN ('mentor', 'steward') AND id <> :growerId`,
        { replacements: { growerId: item.growerId }, type: QueryTypes.SELECT, transaction },
      );
      let count = 0;
      for (const mentor of mentors) {
        const added = await enqueueMail(
          {
            to: mentor.email,
            subject: `Urgent case waiting for a mentor: “${item.title}”`,
            text: [
              `Hello ${mentor.displayName},`,
              '',
              `A ${item.stage} case with high urgency (${item.urgency} of 100) has waited more than an hour and nobody has taken it yet:`,
              `“${item.title}”`,
              `${ctx.config.publicUrl}${casePath(item.id)}`,
              '',
              'You get this because you asked for e-mails about urgent cases. To stop them, untick “E-mail about urgent cases” at the foot of the rounds:',
              `${ctx.config.publicUrl}${MENTOR_MAIL_SETTINGS_PATH}`,
            ].join('\n'),
            kind: 'urgent_case',
            dedupeKey: `urgent:${item.id}:${mentor.id}`,
          },
          transaction,
        );
        if (added) count += 1;
      }
      return count;
    });
  }
  if (queued) ctx.pokeMail();
  return queued;
}
