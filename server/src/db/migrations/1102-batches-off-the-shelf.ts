// The day a grower finished with a batch (used it up or threw it out): it leaves the batch shelf
// and the open-a-case picker, and can be put back. NULL: still on the shelf.
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  await context.sequelize.query(`ALTER TABLE batches ADD COLUMN IF NOT EXISTS finished_on date`);
}

export async function down({ context }: Migration): Promise<void> {
  await context.sequelize.query(`ALTER TABLE batches DROP COLUMN IF EXISTS finished_on`);
}
