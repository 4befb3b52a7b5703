// The last mail of a kind to an address, found by index: confirmation and reset links go to an
// address at most once every two minutes (auth.service.ts), however large the outbox grows.
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  await context.sequelize.query(`CREATE INDEX IF NOT EXISTS outbox_mail_address_kind_idx ON outbox_mail (to_address, kind, created_at)`);
}

export async function down({ context }: Migration): Promise<void> {
  await context.sequelize.query(`DROP INDEX IF EXISTS outbox_mail_address_kind_idx`);
}
