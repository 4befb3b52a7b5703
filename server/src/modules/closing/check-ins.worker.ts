// Sends the check-in e-mails that are due. Due rows are claimed with FOR UPDATE SKIP LOCKED, so
// several processes never mail one check-in twice (and the outbox dedupe key is a second guard);
// the mail is queued in the same transaction that marks the check-in sent. A check-in whose case
// is no longer watching, or whose grower's account a steward disabled, is marked without mail.
import { QueryTypes } from 'sequelize';
import { getSequelize, isConnectionError } from '../../db/sequelize';
import { log } from '../../lib/logger';
import { queueCheckInMail } from './closing-mail';

interface DueRow {
  id: number;
  caseId: number;
  day: number;
  status: string;
  title: string;
  email: string;
  displayName: string;
  disabled: boolean;
}

/** Sends what is due once; returns how many e-mails were queued. */
export async function sendDueCheckIns(publicUrl: string, batch = 50): Promise<number> {
  const sequelize = getSequelize();
  return sequelize.transaction(async (transaction) => {
    const due = await sequelize.query<DueRow>(
      `SELECT ci.id, ci.case_id AS "caseId", ci.day, c.status, c.title, u.email, u.display_name AS "displayName", u.disabled
         FROM check_ins ci
         JOIN cases c ON c.id = ci.case_id
         JOIN users u ON u.id = c.grower_id
        WHERE ci.sent_at IS NULL AND ci.due_at <= now()
        ORDER BY ci.due_at
        LIMIT $1
        FOR UPDATE OF ci SKIP LOCKED`,
      { bind: [batch], type: QueryTypes.SELECT, transaction },
    );
    let queued = 0;
    for (const row of due) {
      if (row.status === 'watching' && !row.disabled) {
        const mailed = await queueCheckInMail(
          { publicUrl, caseId: row.caseId, day: row.day, title: row.title, to: row.email, growerName: row.displayName },
          transaction,
        );
        if (mailed) queued += 1;
      }
    }
    if (due.length) {
      await sequelize.query(`UPDATE check_ins SET sent_at = now() WHERE id = ANY($1::int[])`, { bind: [due.map((r) => r.id)], transaction });
    }
    return queued;
  });
}

export interface CheckInWorker {
  stop(): Promise<void>;
}

export function startCheckInWorker(options: { publicUrl: string; pokeMail: () => void; intervalMs?: number }): CheckInWorker {
  const intervalMs = options.intervalMs ?? 60_000;
  let stopped = false;
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<void> | null = null;
  const tick = async () => {
    try {
      let queued = 0;
      let round: number;
      do {
        round = await sendDueCheckIns(options.publicUrl);
        queued += round;
      } while (!stopped && round > 0);
      if (queued) {
        log.info('closing.check_ins_sent', { queued });
        options.pokeMail();
      }
    } catch (error) {
      if (!isConnectionError(error)) log.error('closing.check_in_worker_error', { error: (error as Error).message });
    }
  };
  const schedule = () => {
    if (stopped) return;
    timer = setTimeout(() => {
      running = tick().finally(() => {
        running = null;
        schedule();
      });
    }, intervalMs);
    timer.unref();
  };
  schedule();
  return {
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      await running;
    },
  };
}
