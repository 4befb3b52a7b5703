// What the live thread needs beyond the base schema: how far each person has read each case
// (for unread counts), and when the "urgent case waiting" mail went out for a case, so it is
// sent once per case however often the watcher runs and however many processes run it.
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`
    CREATE TABLE case_reads (
      case_id    integer NOT NULL REFERENCES cases(id) ON DELETE CASCADE,
      user_id    integer NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      last_seq   integer NOT NULL DEFAULT 0,
      updated_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (user_id, case_id)
    )`);
  await q(`ALTER TABLE cases ADD COLUMN notify_urgent_sent_at timestamptz`);
  // The watcher looks only at open, unclaimed, high-urgency cases that have not been mailed.
  await q(`CREATE INDEX cases_urgent_unmailed_idx ON cases (opened_at)
             WHERE status = 'awaiting_mentor' AND mentor_id IS NULL AND notify_urgent_sent_at IS NULL`);
}

export async function down({ context }: Migration): Promise<void> {
  await context.sequelize.query(`DROP INDEX IF EXISTS cases_urgent_unmailed_idx`);
  await context.sequelize.query(`ALTER TABLE cases DROP COLUMN IF EXISTS notify_urgent_sent_at`);
  await context.sequelize.query(`DROP TABLE IF EXISTS case_reads`);
}
