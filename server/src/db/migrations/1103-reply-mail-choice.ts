// Whether a grower is e-mailed when a mentor replies on their case while they are away (on
// unless they turn it off on their account page; at most one a case every 10 minutes anyway).
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  await context.sequelize.query(`ALTER TABLE users ADD COLUMN IF NOT EXISTS notify_mentor_replied boolean NOT NULL DEFAULT true`);
}

export async function down({ context }: Migration): Promise<void> {
  await context.sequelize.query(`ALTER TABLE users DROP COLUMN IF EXISTS notify_mentor_replied`);
}
