// Two lookups the thread makes on every write that had no index: the photos of a message (read
// with each message the thread answers; case_photos was indexed by case only) and the reply
// mail already queued for a case within the last 10 minutes (a prefix match on dedupe_key,
// 'reply:<case>:…', which a plain btree under a non-C collation cannot serve).
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  await q(`CREATE INDEX IF NOT EXISTS case_photos_message_idx ON case_photos (message_id) WHERE message_id IS NOT NULL`);
  await q(`CREATE INDEX IF NOT EXISTS outbox_mail_reply_key_idx ON outbox_mail (dedupe_key text_pattern_ops) WHERE kind = 'mentor_reply'`);
}

export async function down({ context }: Migration): Promise<void> {
  await context.sequelize.query(`DROP INDEX IF EXISTS outbox_mail_reply_key_idx`);
  await context.sequelize.query(`DROP INDEX IF EXISTS case_photos_message_idx`);
}
