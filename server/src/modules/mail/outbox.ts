// The outbox: every e-mail is a row first, written in the transaction of the event that causes
// it; a worker sends due rows with retries. Rows are claimed with FOR UPDATE SKIP LOCKED so
// several processes never send one mail twice.
import type { Transaction } from 'sequelize';
import { QueryTypes } from 'sequelize';
import type { Transporter } from 'nodemailer';
import { getSequelize, isConnectionError } from '../../db/sequelize';
import { log } from '../../lib/logger';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  kind?: string;
  /** A second enqueue with the same key is ignored (e.g. "reply:<case>:<10-minute slot>"). */
  dedupeKey?: string;
}

export async function enqueueMail(mail: OutgoingMail, transaction?: Transaction): Promise<boolean> {
  const [, inserted] = await getSequelize().query(
    `INSERT INTO outbox_mail (to_address, subject, body_text, kind, dedupe_key)
     VALUES (:to, :subject, :text, :kind, :dedupeKey)
     ON CONFLICT (dedupe_key) DO NOTHING`,
    {
      replacements: { to: mail.to, subject: mail.subject, text: mail.text, kind: mail.kind ?? 'general', dedupeKey: mail.dedupeKey ?? null },
      transaction,
    },
  );
  return Number(inserted) > 0;
}

const MAX_ATTEMPTS = 30;

/** Sends what is due once; returns how many were sent. */
export async function sendDueMail(transport: Transporter, from: string, batch = 20): Promise<number> {
  const sequelize = getSequelize();
  let sent = 0;
  await sequelize.transaction(async (transaction) => {
    const due = await sequelize.query<{ id: string; to_address: string; subject: string; body_text: string; attempts: number }>(
      `SELECT id, to_address, subject, body_text, attempts FROM outbox_mail
        WHERE status = 'pending' AND next_attempt_at <= now()
        ORDER BY id LIMIT :batch FOR UPDATE SKIP LOCKED`,
      { replacements: { batch }, type: QueryTypes.SELECT, transaction },
    );
    for (const row of due) {
      try {
        await transport.sendMail({ from, to: row.to_address, subject: row.subject, text: row.body_text });
        await sequelize.query(`UPDATE outbox_mail SET status = 'sent', sent_at = now(), attempts = attempts + 1, last_error = NULL WHERE id = :id`, {
          replacements: { id: row.id },
          transaction,
        });
        sent += 1;
      } catch (error) {
        const attempts = row.attempts + 1;
        // Back off 5 s, 10 s, 20 s … up to 10 minutes between tries.
        const delaySeconds = Math.min(600, 5 * 2 ** Math.min(attempts - 1, 7));
        await sequelize.query(
          `UPDATE outbox_mail SET attempts = :attempts, last_error = :err,
             status = CASE WHEN :attempts >= :max THEN 'failed' ELSE 'pending' END,
             next_attempt_at = now() + make_interval(secs => :delay) WHERE id = :id`,
          { replacements: { id: row.id, attempts, err: String((error as Error).message).slice(0, 500), max: MAX_ATTEMPTS, delay: delaySeconds }, transaction },
        );
        log.error('mail.send_failed', { id: row.id, attempts, error: (error as Error).message });
      }
    }
  });
  return sent;
}

export interface OutboxWorker {
  stop(): Promise<void>;
  /** Wakes the worker now instead of at its next tick (after an enqueue). */
  poke(): void;
}

export function startOutboxWorker(transport: Transporter, from: string, intervalMs = 2000): OutboxWorker {
  let stopped = false;
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<void> | null = null;
  const tick = async () => {
    if (stopped) return;
    try {
      while (!stopped && (await sendDueMail(transport, from)) > 0) {
        // keep going while there is more
      }
    } catch (error) {
      if (!isConnectionError(error)) log.error('mail.worker_error', { error: (error as Error).message });
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
  };
  schedule();
  return {
    poke() {
      if (stopped || running) return;
      if (timer) clearTimeout(timer);
      running = tick().finally(() => {
        running = null;
        schedule();
      });
    },
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      await running;
    },
  };
}
