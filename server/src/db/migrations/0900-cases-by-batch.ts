// The cases of a batch, newest first: the batch page lists them and the batch shelf shows each
// batch's open case. Without it both read every case (cases.batch_id had no index).
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  await context.sequelize.query(
    `CREATE INDEX IF NOT EXISTS cases_batch_idx ON cases (batch_id, opened_at DESC, id DESC) WHERE batch_id IS NOT NULL`,
  );
}

export async function down({ context }: Migration): Promise<void> {
  await context.sequelize.query(`DROP INDEX IF EXISTS cases_batch_idx`);
}
