// Whether a mentor is e-mailed when a grower writes on a case they hold and it stays unread
// (on unless they turn it off), and the lookup the watcher makes for it: the open cases a mentor
// holds. Which mails went out is in outbox_mail (its dedupe key names the case, the mentor and
// the first unread message), so no column on cases is needed for that.
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  await context.sequelize.query(`ALTER TABLE users ADD COLUMN IF NOT EXISTS notify_grower_wrote boolean NOT NULL DEFAULT true`);
  await context.sequelize.query(`
    CREATE INDEX IF NOT EXISTS cases_held_open_idx ON cases (mentor_id)
     WHERE mentor_id IS NOT NULL AND status IN ('in_conversation', 'over_to_grower', 'watching', 'awaiting_mentor')`);
}

export async function down({ context }: Migration): Promise<void> {
  await context.sequelize.query(`DROP INDEX IF EXISTS cases_held_open_idx`);
  await context.sequelize.query(`ALTER TABLE users DROP COLUMN IF EXISTS notify_grower_wrote`);
}
